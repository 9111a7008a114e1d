import { BuildsModule } from '../builds/builds.module';
import { BookingsModule } from '../bookings/bookings.module';
import { Module } from '@nestjs/common';
import { ExportsController } from './exports.controller';
import { ExportsService } from './exports.service';
import { OfficeRepository } from './office.repository';

/** The bookkeeper's CSV exports (owner only). */
@Module({
  imports: [BookingsModule, BuildsModule],
  controllers: [ExportsController],
  providers: [ExportsService, OfficeRepository],
  exports: [ExportsService],
})
export class ExportsModule {}
