import { Module } from '@nestjs/common';
import { APP_INTERCEPTOR } from '@nestjs/core';
import { EstimatesModule } from '../estimates/estimates.module';
import { EstimatesService } from '../estimates/estimates.service';
import { MailModule } from '../mail/mail.module';
import { BookingPhotosService } from './booking-photos.service';
import { BookingsController } from './bookings.controller';
import { BookingsRepository } from './bookings.repository';
import { BookingsService } from './bookings.service';
import { CustomerContactInterceptor } from './customer-contact.interceptor';
import { PhotoStorageModule } from './photo-storage.module';
import { QuotePricer } from './quote-pricer';

@Module({
  imports: [MailModule, EstimatesModule, PhotoStorageModule],
  controllers: [BookingsController],
  providers: [
    BookingsService,
    BookingsRepository,
    BookingPhotosService,
    { provide: QuotePricer, useExisting: EstimatesService },
    { provide: APP_INTERCEPTOR, useClass: CustomerContactInterceptor },
  ],
  exports: [BookingsService, BookingPhotosService],
})
export class BookingsModule {}
