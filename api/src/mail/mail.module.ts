import { Module } from '@nestjs/common';
import { MailOutboxRepository } from './mail-outbox.repository';
import { MailService } from './mail.service';

@Module({ providers: [MailService, MailOutboxRepository], exports: [MailService] })
export class MailModule {}
