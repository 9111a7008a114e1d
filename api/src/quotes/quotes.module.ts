import { Module } from '@nestjs/common';
import { BookingsModule } from '../bookings/bookings.module';
import { ConfigurationsModule } from '../configurations/configurations.module';
import { EstimatesModule } from '../estimates/estimates.module';
import { MailModule } from '../mail/mail.module';
import { PriceBookModule } from '../price-book/price-book.module';
import { ShopModule } from '../shop/shop.module';
import { BookingQuoteController, QuotesController } from './quotes.controller';
import { QuotesRepository } from './quotes.repository';
import { QuotesService } from './quotes.service';

@Module({
  imports: [EstimatesModule, PriceBookModule, ShopModule, MailModule, BookingsModule, ConfigurationsModule],
  controllers: [QuotesController, BookingQuoteController],
  providers: [QuotesService, QuotesRepository],
  exports: [QuotesService],
})
export class QuotesModule {}
