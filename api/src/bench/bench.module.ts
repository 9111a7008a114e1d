import { Module } from '@nestjs/common';
import { BookingsModule } from '../bookings/bookings.module';
import { BenchCache } from './bench-cache';
import { BenchController } from './bench.controller';
import { BenchRepository } from './bench.repository';
import { BenchService } from './bench.service';
import { LeadTimeController } from './lead-time.controller';

@Module({
  imports: [BookingsModule],
  controllers: [BenchController, LeadTimeController],
  providers: [BenchService, BenchRepository, BenchCache],
  exports: [BenchService, BenchRepository],
})
export class BenchModule {}
