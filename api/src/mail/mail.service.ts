import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { MailLogEntry, MailLogPage, MailState } from '@loomwright/shared';
import type { AppConfig } from '../config/configuration';
import { Database, type Executor } from '../database/database';
import { MailOutboxRepository } from './mail-outbox.repository';
import { MailWorker } from './mail-worker.service';
import type { OutgoingMail } from './mail.types';

type OutboxRow = NonNullable<Awaited<ReturnType<MailOutboxRepository['findById']>>>;

@Injectable()
export class MailService {
  /** The right-hand side of every Message-ID (RFC 5322 §3.6.4): the sending domain. */
  private readonly domain: string;

  constructor(
    private readonly db: Database,
    private readonly outbox: MailOutboxRepository,
    private readonly worker: MailWorker,
    config: ConfigService<AppConfig, true>,
  ) {
    this.domain = /@([^>\s]+)>?\s*$/.exec(config.get('mail', { infer: true }).from)?.[1] ?? 'loomwright.local';
  }

  /**
   * Queues a message in the caller's transaction: it exists exactly when the change that causes it
   * commits. Delivery happens later from the outbox, with retries. Returns undefined when the
   * dedupe key was already used (the message was queued before).
   */
  async enqueue(trx: Executor, mail: OutgoingMail) {
    const row = await this.outbox.insert(mail, this.domain, trx);
    if (row) await this.worker.scheduleDelivery(row.id, trx);
    return row;
  }

  async list(query: { page: number; pageSize: number; state?: MailState; q?: string }, canResend: boolean): Promise<MailLogPage> {
    const { rows, total } = await this.outbox.list(query);
    return { items: rows.map(toEntry), total, page: query.page, pageSize: query.pageSize, canResend };
  }

  /**
   * A resend is intentional (the player lost the message, or it failed), so it is a new outbox row
   * with a NEW Message-ID, linked to the original by resentFromId: a mail store that already holds
   * the original's Message-ID may drop a same-ID copy as a duplicate, which would defeat the point.
   * The original row stays as it was, so the log keeps the true history.
   */
  async resend(id: string): Promise<MailLogEntry> {
    return this.db.transaction().execute(async (trx) => {
      const original = await this.outbox.findById(id, trx);
      if (!original) throw new NotFoundException(`There is no message with the id ${id}.`);
      if (original.state === 'queued' || original.state === 'sending') {
        throw new ConflictException('This message is still waiting to go out; resend it once it has been sent or has failed.');
      }
      const copy = await this.outbox.insertResend(id, this.domain, trx);
      if (!copy) throw new NotFoundException(`There is no message with the id ${id}.`);
      await this.worker.scheduleDelivery(copy.id, trx);
      return toEntry((await this.outbox.findById(copy.id, trx))!);
    });
  }
}

function toEntry(row: OutboxRow): MailLogEntry {
  return {
    id: row.id,
    messageId: row.message_id,
    template: row.template,
    to: row.to_address,
    subject: row.subject,
    state: row.state,
    attempts: row.attempts,
    lastError: row.last_error,
    bookingId: row.booking_id,
    resentFromId: row.resent_from_id,
    createdAt: iso(row.created_at),
    sentAt: row.sent_at ? iso(row.sent_at) : null,
  };
}

// Generated<Timestamp> columns come back as Date at runtime; the nested column type hides that.
const iso = (value: unknown) => new Date(value as Date | string).toISOString();
