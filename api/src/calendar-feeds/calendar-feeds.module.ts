import { Module } from '@nestjs/common';
import { BookingsModule } from '../bookings/bookings.module';
import { CalendarFeedsController } from './calendar-feeds.controller';
import { CalendarFeedsRepository } from './calendar-feeds.repository';
import { CalendarFeedsService } from './calendar-feeds.service';

/** Private iCalendar feeds of the bench, per builder and for the shop. */
@Module({
  imports: [BookingsModule],
  controllers: [CalendarFeedsController],
  providers: [CalendarFeedsService, CalendarFeedsRepository],
  exports: [CalendarFeedsService],
})
export class CalendarFeedsModule {}
