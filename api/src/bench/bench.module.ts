import { Module } from '@nestjs/common';
import { BenchController } from './bench.controller';
import { BenchRepository } from './bench.repository';
import { BenchService } from './bench.service';
import { LeadTimeController } from './lead-time.controller';

@Module({ controllers: [BenchController, LeadTimeController], providers: [BenchService, BenchRepository], exports: [BenchService] })
export class BenchModule {}
