import { Module } from '@nestjs/common';
import { BenchController } from './bench.controller';
import { BenchRepository } from './bench.repository';
import { BenchService } from './bench.service';

@Module({ controllers: [BenchController], providers: [BenchService, BenchRepository], exports: [BenchService] })
export class BenchModule {}
