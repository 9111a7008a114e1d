import { randomUUID } from 'node:crypto';
import { Injectable } from '@nestjs/common';
import { Database, Executor } from '../database/database';
import type { OutgoingMail } from './mail.types';

@Injectable()
export class MailOutboxRepository {
  constructor(private readonly db: Database) {}

  /** Inserts into the outbox; returns undefined when the dedupe key was already used. */
  insert(mail: OutgoingMail, domain: string, trx: Executor = this.db) {
    return trx
      .insertInto('mail_outbox')
      .values({
        message_id: `<${randomUUID()}@${domain}>`,
        template: mail.template,
        to_address: mail.to,
        data: JSON.stringify(mail.data),
        booking_id: mail.bookingId ?? null,
        user_id: mail.userId ?? null,
        dedupe_key: mail.dedupeKey ?? null,
      })
      .onConflict((oc) => oc.column('dedupe_key').doNothing())
      .returning(['id', 'message_id'])
      .executeTakeFirst();
  }
}
