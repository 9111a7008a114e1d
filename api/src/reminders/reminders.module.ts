import { Module } from '@nestjs/common';
import { JobsModule } from '../jobs/jobs.module';
import { BenchModule } from '../bench/bench.module';
import { BookingsModule } from '../bookings/bookings.module';
import { MailModule } from '../mail/mail.module';
import { PaymentsModule } from '../payments/payments.module';
import { ReminderClock } from './reminder-clock';
import { RemindersController } from './reminders.controller';
import { RemindersRepository } from './reminders.repository';
import { RemindersService } from './reminders.service';
import { RemindersWorker } from './reminders-worker.service';

@Module({
  imports: [JobsModule, BookingsModule, PaymentsModule, BenchModule, MailModule],
  controllers: [RemindersController],
  providers: [RemindersService, RemindersRepository, RemindersWorker, ReminderClock],
  exports: [RemindersService],
})
export class RemindersModule {}
