import { BuildsModule } from '../builds/builds.module';
import { BookingsModule } from '../bookings/bookings.module';
import { Module } from '@nestjs/common';
import { BenchModule } from '../bench/bench.module';
import { OfficeRepository } from '../exports/office.repository';
import { ReportsController } from './reports.controller';
import { ReportsService } from './reports.service';

/**
 * The owner's reports. They read through the exports' OfficeRepository (provided here too, not
 * exported from there) so a report and its CSV file are the same query.
 */
@Module({
  imports: [BenchModule, BookingsModule, BuildsModule],
  controllers: [ReportsController],
  providers: [ReportsService, OfficeRepository],
})
export class ReportsModule {}
