import { Module } from '@nestjs/common';
import { CalendarFeedsController } from './calendar-feeds.controller';
import { CalendarFeedsRepository } from './calendar-feeds.repository';
import { CalendarFeedsService } from './calendar-feeds.service';

/** Private iCalendar feeds of the bench, per builder and for the shop. */
@Module({
  controllers: [CalendarFeedsController],
  providers: [CalendarFeedsService, CalendarFeedsRepository],
  exports: [CalendarFeedsService],
})
export class CalendarFeedsModule {}
