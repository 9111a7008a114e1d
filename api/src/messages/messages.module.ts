import { Module } from '@nestjs/common';
import { JobsModule } from '../jobs/jobs.module';
import { BookingsModule } from '../bookings/bookings.module';
import { MailModule } from '../mail/mail.module';
import { ShopModule } from '../shop/shop.module';
import { MessageClock } from './message-clock';
import { MessageNoticesService } from './message-notices.service';
import { MessageNoticesWorker } from './message-notices.worker';
import { MessagesController } from './messages.controller';
import { MessagesRepository } from './messages.repository';
import { MessagesService } from './messages.service';

@Module({
  imports: [JobsModule, BookingsModule, MailModule, ShopModule],
  controllers: [MessagesController],
  providers: [MessagesService, MessagesRepository, MessageNoticesService, MessageNoticesWorker, MessageClock],
  exports: [MessagesService, MessageNoticesService],
})
export class MessagesModule {}
