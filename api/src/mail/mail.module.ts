import { Module } from '@nestjs/common';
import { JobsModule } from '../jobs/jobs.module';
import { ShopModule } from '../shop/shop.module';
import { MailController } from './mail.controller';
import { MailDeliveryService } from './mail-delivery.service';
import { MailOutboxRepository } from './mail-outbox.repository';
import { MailTransport } from './mail-transport';
import { MailWorker } from './mail-worker.service';
import { MailService } from './mail.service';

@Module({
  imports: [JobsModule, ShopModule],
  controllers: [MailController],
  providers: [MailService, MailOutboxRepository, MailDeliveryService, MailTransport, MailWorker],
  exports: [MailService, MailDeliveryService, MailOutboxRepository],
})
export class MailModule {}
