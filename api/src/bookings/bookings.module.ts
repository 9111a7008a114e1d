import { Module } from '@nestjs/common';
import { EstimatesModule } from '../estimates/estimates.module';
import { EstimatesService } from '../estimates/estimates.service';
import { MailModule } from '../mail/mail.module';
import { BookingPhotosService } from './booking-photos.service';
import { BookingsController } from './bookings.controller';
import { BookingsRepository } from './bookings.repository';
import { BookingsService } from './bookings.service';
import { PhotoStorageModule } from './photo-storage.module';
import { QuotePricer } from './quote-pricer';

@Module({
  imports: [MailModule, EstimatesModule, PhotoStorageModule],
  controllers: [BookingsController],
  providers: [BookingsService, BookingsRepository, BookingPhotosService, { provide: QuotePricer, useExisting: EstimatesService }],
  exports: [BookingsService, BookingsRepository, BookingPhotosService],
})
export class BookingsModule {}
