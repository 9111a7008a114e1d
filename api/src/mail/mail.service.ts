import { Injectable } from '@nestjs/common';
import type { Executor } from '../database/database';
import { MailOutboxRepository } from './mail-outbox.repository';
import type { OutgoingMail } from './mail.types';

@Injectable()
export class MailService {
  constructor(private readonly outbox: MailOutboxRepository) {}

  /**
   * Queues a message in the caller's transaction: it exists exactly when the change that causes it
   * commits. Delivery happens later from the outbox, with retries.
   */
  enqueue(trx: Executor, mail: OutgoingMail) {
    return this.outbox.insert(mail, 'loomwright.local', trx);
  }
}
