import { BenchModule } from '../bench/bench.module';
import { Module } from '@nestjs/common';
import { TeamController } from './team.controller';
import { TeamRepository } from './team.repository';
import { TeamService } from './team.service';

@Module({ imports: [BenchModule], controllers: [TeamController], providers: [TeamService, TeamRepository], exports: [TeamService] })
export class TeamModule {}
