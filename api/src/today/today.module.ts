import { BuildsModule } from '../builds/builds.module';
import { Module } from '@nestjs/common';
import { BookingsModule } from '../bookings/bookings.module';
import { ShopModule } from '../shop/shop.module';
import { OfficeRepository } from '../exports/office.repository';
import { TodayController } from './today.controller';
import { TodayRepository } from './today.repository';
import { TodayService } from './today.service';

/** A builder's today (GET /api/today); reads money through the exports' OfficeRepository like the reports do. */
@Module({
  imports: [BookingsModule, BuildsModule, ShopModule],
  controllers: [TodayController],
  providers: [TodayService, TodayRepository, OfficeRepository],
})
export class TodayModule {}
