import { Module } from '@nestjs/common';
import { BookingsModule } from '../bookings/bookings.module';
import { MailModule } from '../mail/mail.module';
import { ShopModule } from '../shop/shop.module';
import { PaymentWebhooksService } from './payment-webhooks.service';
import { PaymentsController } from './payments.controller';
import { PaymentsRepository } from './payments.repository';
import { PaymentsService } from './payments.service';
import { stripeProvider } from './stripe.provider';

@Module({
  imports: [BookingsModule, MailModule, ShopModule],
  controllers: [PaymentsController],
  providers: [PaymentsService, PaymentWebhooksService, PaymentsRepository, stripeProvider],
  exports: [PaymentsService, PaymentsRepository],
})
export class PaymentsModule {}
