import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import {
  encodeMailLogCursor,
  mailMessages,
  singleUseLinkKeys,
  type AuthUser,
  type MailLogEntry,
  type MailLogPage,
  type MailState,
  type MoneyFacts,
} from '@loomwright/shared';
import type { AppConfig } from '../config/configuration';
import { Database, type Executor } from '../database/database';
import { balanceLetterData } from './balance-letter';
import { MailOutboxRepository } from './mail-outbox.repository';
import { MailWorker } from './mail-worker.service';
import { isMailTemplate, type MailTemplate, type OutgoingMail } from './mail.types';
import { upgradeMailData } from './templates/upgrade-data';

type OutboxRow = NonNullable<Awaited<ReturnType<MailOutboxRepository['findById']>>>;

/** What a resend knows of the message it repeats; the data has no single-use links left in it. */
export interface MessageToRenew {
  userId: string | null;
  to: string;
  data: Record<string, unknown>;
}

/**
 * Makes fresh single-use links for a resend, in the resend's transaction: returns the message's
 * data with new links, or throws an HTTP exception saying in words why there is nothing to resend.
 */
export type LinkRenewer = (trx: Executor, message: MessageToRenew) => Promise<Record<string, unknown>>;

@Injectable()
export class MailService {
  /** The right-hand side of every Message-ID (RFC 5322 §3.6.4): the sending domain. */
  private readonly domain: string;
  private readonly linkRenewers = new Map<string, LinkRenewer>();

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

  /**
   * The balance letter to the player, with the same money facts as their build page, when there is
   * a balance to ask for (none before a firm quote); `dedupeKey` says how often it may go.
   */
  async enqueueBalanceLetter(
    trx: Executor,
    player: { id: string; name: string; email: string },
    booking: { id: string; reference: string },
    money: MoneyFacts,
    dedupeKey: string,
  ) {
    const letter = balanceLetterData(player.name, booking.reference, money);
    if (!letter) return undefined;
    return this.enqueue(trx, {
      template: 'balance-requested',
      to: player.email,
      bookingId: booking.id,
      userId: player.id,
      dedupeKey,
      data: letter,
    });
  }

  /**
   * The mail log. The owner sees every message and may resend; a builder sees the messages sent to
   * them and those about builds assigned to them, not every customer's mail.
   */
  async list(
    query: { page: number; pageSize: number; state?: MailState; q?: string; cursor?: { key: string; id: string } },
    viewer: AuthUser,
  ): Promise<MailLogPage> {
    const owner = viewer.role === 'owner';
    const { cursor, ...rest } = query;
    const { rows, total } = await this.outbox.list({ ...rest, after: cursor, ...(!owner && { onlyForBuilderUserId: viewer.id }) });
    const last = rows.length === query.pageSize ? rows[rows.length - 1] : undefined;
    return {
      items: rows.map(toEntry),
      total,
      page: query.page,
      pageSize: query.pageSize,
      canResend: owner,
      nextCursor: last ? encodeMailLogCursor({ key: last.sort_key, id: last.id }) : null,
    };
  }

  /** Called by the module that issues a template's single-use links (accounts, invitations). */
  renewLinksWith(template: MailTemplate, renew: LinkRenewer) {
    this.linkRenewers.set(template, renew);
  }

  /**
   * A resend is intentional (the player lost the message, or it failed), so it is a new outbox row
   * with a NEW Message-ID, linked to the original by resentFromId: a mail store that already holds
   * the original's Message-ID may drop a same-ID copy as a duplicate, which would defeat the point.
   * The original row stays as it was, so the log keeps the true history.
   *
   * A message whose outcome is unknown may already be in the recipient's mailbox, so it is resent
   * only when the caller confirms a second copy is acceptable. A message with a single-use link
   * never repeats its link (spent, retired or removed from the outbox): it gets a fresh one, or the
   * resend is refused in words when no fresh link can rightly be made.
   */
  async resend(id: string, options: { confirmPossibleDuplicate?: boolean } = {}): Promise<MailLogEntry> {
    return this.db.transaction().execute(async (trx) => {
      const original = await this.outbox.findById(id, trx);
      if (!original) throw new NotFoundException(`There is no message with the id ${id}.`);
      if (original.state === 'queued' || original.state === 'sending') {
        throw new ConflictException('This message is still waiting to go out; resend it once it has been sent or has failed.');
      }
      if (original.state === 'unknown' && options.confirmPossibleDuplicate !== true) {
        throw new ConflictException(mailMessages.unknownNeedsConfirmation);
      }
      const copy = await this.outbox.insertResend(id, this.domain, await this.renewedData(trx, original), trx);
      if (!copy) throw new NotFoundException(`There is no message with the id ${id}.`);
      await this.worker.scheduleDelivery(copy.id, trx);
      return toEntry((await this.outbox.findById(copy.id, trx))!);
    });
  }

  /** Null keeps the original's data; a message with single-use links gets fresh ones. */
  private async renewedData(trx: Executor, original: OutboxRow): Promise<Record<string, unknown> | null> {
    const linkKeys = singleUseLinkKeys[original.template];
    if (!linkKeys) return null;
    const renew = this.linkRenewers.get(original.template);
    if (!renew)
      throw new ConflictException('This message carried a single-use link that cannot be renewed; ask the recipient to request a new one.');
    // Today's key names, so the renewed row is written as a new one would be.
    const data = isMailTemplate(original.template)
      ? upgradeMailData(original.template, original.data)
      : { ...(original.data as Record<string, unknown>) };
    for (const key of linkKeys) delete data[key];
    return renew(trx, { userId: original.user_id, to: original.to_address, data });
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
