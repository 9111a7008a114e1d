import { Module } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { APP_INTERCEPTOR } from '@nestjs/core';
import type { AppConfig } from '../config/configuration';
import { EstimatesModule } from '../estimates/estimates.module';
import { EstimatesService } from '../estimates/estimates.service';
import { MailModule } from '../mail/mail.module';
import { BookingPhotosService } from './booking-photos.service';
import { BookingsController } from './bookings.controller';
import { BookingsRepository } from './bookings.repository';
import { BookingsService } from './bookings.service';
import { CustomerContactInterceptor } from './customer-contact.interceptor';
import { LocalDiskPhotoStorage, PhotoStorage } from './photo-storage';
import { QuotePricer } from './quote-pricer';

@Module({
  imports: [MailModule, EstimatesModule],
  controllers: [BookingsController],
  providers: [
    BookingsService,
    BookingsRepository,
    BookingPhotosService,
    {
      provide: PhotoStorage,
      inject: [ConfigService],
      useFactory: (config: ConfigService<AppConfig, true>) => new LocalDiskPhotoStorage(config.get('app', { infer: true }).uploadsDir),
    },
    { provide: QuotePricer, useExisting: EstimatesService },
    { provide: APP_INTERCEPTOR, useClass: CustomerContactInterceptor },
  ],
  exports: [BookingsService],
})
export class BookingsModule {}
