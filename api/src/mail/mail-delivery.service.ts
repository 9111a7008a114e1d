import { Injectable, Logger } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import pLimit from 'p-limit';
import type { ShopProfile } from '@loomwright/shared';
import type { AppConfig } from '../config/configuration';
import { ShopService } from '../shop/shop.service';
import { MailOutboxRepository } from './mail-outbox.repository';
import { classifySmtpError, describeSmtpError, MailTransport } from './mail-transport';
import { MailDataError, renderStoredMail, type RenderedMail } from './templates/render';

export type DeliveryOutcome = 'sent' | 'retry' | 'failed' | 'unknown' | 'skipped';

/** How long a claim may stay in 'sending' before we conclude its sender died mid-send. */
export const SEND_LEASE_SECONDS = 15 * 60;

/** Tries at writing down 'sent' once the mail server has taken a message (a database blip is not a failure). */
const RECORD_SENT_ATTEMPTS = 4;

export const OUTCOME_UNKNOWN =
  'Outcome unknown: the mail server may have received this message. The sender stopped while handing it over, ' +
  'before the answer was recorded. It was not sent again, so the recipient cannot get it twice by itself; ' +
  'ask them whether it arrived before resending it.';

type ClaimedRow = NonNullable<Awaited<ReturnType<MailOutboxRepository['claim']>>>;

/**
 * Delivers outbox rows: one (`deliverOne`, a pg-boss job's work) or a batch claimed in one
 * statement and handed to the mail server `MAIL_CONCURRENCY` at a time (`deliverBatch`,
 * `deliverPending`). Each row still has its own claim, send and record, so a batch changes speed
 * only, never the guarantee below.
 *
 * The guarantee, precisely:
 * 1. A row is handed to SMTP only by the sender that moved it queued → sending (one UPDATE under a
 *    `for update skip locked` row lock, committed before the send). Concurrent senders — the
 *    worker's retries, a second replica, deliverPending() — cannot both win that claim.
 * 2. A row in 'sent' is never claimed again; a retried job (pg-boss retries a job whose handler
 *    crashed after the mail went out) finds nothing to claim and ends.
 * 3. Only a definite "not taken" goes back to 'queued': a refused connection, or an SMTP 4yz reply.
 *    A 5yz reply, or data the template cannot render, ends in 'failed' with the reason.
 * 4. A message the server accepted is never 'failed': once the send resolves, only 'sent' is
 *    written (retried through a database blip). A claim whose outcome is unknown — the connection
 *    dropped or went silent once the SMTP session was under way (see classifySmtpError), or a
 *    sender that died or lost the database between the claim and marking it sent (found by the
 *    sweep after SEND_LEASE_SECONDS) — ends in 'unknown' with OUTCOME_UNKNOWN, never re-sent by
 *    itself: the owner decides in the mail log, where a resend asks for confirmation first.
 * So no automatic path hands one row to the mail server twice, and no row is dropped silently:
 * each ends 'sent', 'failed' or 'unknown' with its reason in the log. Every send carries the row's
 * stable Message-ID (RFC 5322 §3.6.4), so even a copy the owner resends by hand is recognisable.
 *
 * Single-use links (singleUseLinkKeys) leave the row's data in the same UPDATE that writes 'sent',
 * 'failed' or 'unknown', so no usable link token stays readable in the database after its message.
 */
@Injectable()
export class MailDeliveryService {
  private readonly logger = new Logger('Mail');
  private readonly maxAttempts: number;
  private readonly publicUrl: string;
  private readonly concurrency: number;

  constructor(
    private readonly outbox: MailOutboxRepository,
    private readonly transport: MailTransport,
    private readonly shop: ShopService,
    private readonly config: ConfigService<AppConfig, true>,
  ) {
    this.maxAttempts = config.get('mail', { infer: true }).maxAttempts;
    this.concurrency = config.get('mail', { infer: true }).concurrency;
    this.publicUrl = config.get('app', { infer: true }).publicUrl;
  }

  async deliverOne(id: string): Promise<DeliveryOutcome> {
    const row = await this.outbox.claim(id);
    if (!row) return 'skipped';
    return this.deliverClaimed(row);
  }

  /**
   * Claims the listed rows in one statement and delivers the ones this sender won, up to
   * MAIL_CONCURRENCY at once. Answers each listed id's outcome ('skipped' when another sender had it).
   */
  async deliverBatch(ids: string[]): Promise<Map<string, DeliveryOutcome>> {
    const outcomes = new Map<string, DeliveryOutcome>(ids.map((id) => [id, 'skipped']));
    const rows = await this.outbox.claimMany(ids);
    if (rows.length === 0) return outcomes;
    // One read of the shop's name and voice for the whole batch.
    let shop: ShopProfile | undefined;
    try {
      shop = await this.shop.profile();
    } catch {
      // Each row's own render tries again and records its reason.
    }
    const limit = pLimit(this.concurrency);
    await Promise.all(rows.map((row) => limit(async () => outcomes.set(row.id, await this.deliverClaimed(row, shop)))));
    return outcomes;
  }

  private async deliverClaimed(row: ClaimedRow, knownShop?: ShopProfile): Promise<DeliveryOutcome> {
    const id = row.id;
    let rendered: RenderedMail;
    try {
      const shop = knownShop ?? (await this.shop.profile());
      rendered = renderStoredMail(row.template, row.data, { ...shop, publicUrl: this.publicUrl }, { bookingId: row.booking_id });
    } catch (error) {
      const permanent = error instanceof MailDataError;
      const reason = permanent ? `The message cannot be written: ${(error as Error).message}.` : describeSmtpError(error);
      const final = permanent || row.attempts >= this.maxAttempts;
      await this.outbox.release(id, final ? 'failed' : 'queued', reason, null);
      return final ? 'failed' : 'retry';
    }

    try {
      await this.transport.send({
        to: row.to_address,
        subject: rendered.subject,
        text: rendered.text,
        html: rendered.html,
        messageId: row.message_id,
        headers: { 'X-Loomwright-Template': row.template },
        attachments: rendered.attachments.map((a) => ({
          filename: a.filename,
          contentType: a.contentType,
          content: a.content,
          ...(a.encoding && { encoding: a.encoding }),
        })),
      });
    } catch (error) {
      const verdict = classifySmtpError(error);
      const reason = describeSmtpError(error);
      if (verdict === 'unknown') {
        await this.outbox.release(id, 'unknown', `${OUTCOME_UNKNOWN} (${reason})`, rendered.subject);
        return 'unknown';
      }
      const final = verdict === 'permanent' || row.attempts >= this.maxAttempts;
      await this.outbox.release(id, final ? 'failed' : 'queued', reason, rendered.subject);
      if (final) this.logger.warn(`Mail ${row.message_id} to ${row.to_address} failed for good: ${reason}`);
      return final ? 'failed' : 'retry';
    }

    return (await this.recordSent(id, rendered.subject, row.message_id)) ? 'sent' : 'unknown';
  }

  /**
   * The server has taken the message, so the only true record is 'sent'. A database error here is
   * retried a few times; if it persists the row stays 'sending' and the sweep later marks it
   * 'unknown' (never 'failed', never sent again automatically).
   */
  private async recordSent(id: string, subject: string, messageId: string): Promise<boolean> {
    for (let attempt = 1; ; attempt += 1) {
      try {
        await this.outbox.markSent(id, subject);
        return true;
      } catch (error) {
        if (attempt >= RECORD_SENT_ATTEMPTS) {
          this.logger.error(
            `Mail ${messageId} was accepted by the mail server but could not be recorded as sent (${(error as Error).message}); ` +
              'the sweep will mark its outcome unknown',
          );
          return false;
        }
        await new Promise((resolve) => setTimeout(resolve, 200 * 2 ** attempt));
      }
    }
  }

  /**
   * Tries every queued message now, ignoring backoff: for tests, and for anyone who must flush
   * the outbox by hand. Safe beside a running worker (the claim decides who sends).
   */
  async deliverPending(limit = 500): Promise<Record<DeliveryOutcome, number>> {
    const counts: Record<DeliveryOutcome, number> = { sent: 0, retry: 0, failed: 0, unknown: 0, skipped: 0 };
    // The rows queued now, each tried once in this call (one sent back to the queue waits for the next).
    const ids = await this.outbox.queuedIds(limit);
    const chunk = this.config.get('mail', { infer: true }).batchSize;
    for (let start = 0; start < ids.length; start += chunk) {
      for (const outcome of (await this.deliverBatch(ids.slice(start, start + chunk))).values()) counts[outcome] += 1;
    }
    return counts;
  }

  /** Marks claims left by a dead sender as of unknown outcome (see the guarantee). */
  async markStaleClaimsUnknown(leaseSeconds = SEND_LEASE_SECONDS) {
    const rows = await this.outbox.markStaleClaimsUnknown(leaseSeconds, OUTCOME_UNKNOWN);
    if (rows.length) this.logger.warn(`${rows.length} message(s) had an unknown outcome after a sender stopped`);
    return rows.length;
  }
}
