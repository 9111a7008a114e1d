import { Module, ServiceUnavailableException } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { AppConfig } from '../config/configuration';
import { MailModule } from '../mail/mail.module';
import { BookingPhotosService } from './booking-photos.service';
import { BookingsController } from './bookings.controller';
import { BookingsRepository } from './bookings.repository';
import { BookingsService } from './bookings.service';
import { LocalDiskPhotoStorage, PhotoStorage } from './photo-storage';
import { QuotePricer } from './quote-pricer';

@Module({
  imports: [MailModule],
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
    {
      // Until the estimate engine's module is merged, requests cannot be priced; say so plainly.
      provide: QuotePricer,
      useValue: {
        price: async () => {
          throw new ServiceUnavailableException('Pricing is not available yet: the estimate engine is not installed.');
        },
      } satisfies QuotePricer,
    },
  ],
  exports: [BookingsService],
})
export class BookingsModule {}
