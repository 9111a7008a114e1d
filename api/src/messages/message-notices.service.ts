import { Injectable, Logger } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { AppConfig } from '../config/configuration';
import { Database } from '../database/database';
import { MailService } from '../mail/mail.service';
import type { OutgoingMail } from '../mail/mail.types';
import { ShopService } from '../shop/shop.service';
import { MessageClock } from './message-clock';
import { MessagesRepository } from './messages.repository';

export interface NoticeRun {
  sent: number;
  skipped: number;
}

/**
 * Tells one side by e-mail of the other side's new messages, once per window.
 *
 * Exactly once: each notice is claimed under `for update skip locked` in the transaction that also
 * queues its mail in the outbox (with the notice's id as the dedupe key) and marks it settled. Two
 * API processes sweeping at once cannot both claim it; a crash before commit leaves it waiting for
 * the next sweep, with no mail queued. Delivery is the outbox's, never an inline send.
 *
 * A notice whose messages the recipient's side has already read in the app is settled 'skipped':
 * nobody needs a mail about what they have seen.
 */
@Injectable()
export class MessageNoticesService {
  private readonly logger = new Logger('MessageNotices');

  constructor(
    private readonly db: Database,
    private readonly repository: MessagesRepository,
    private readonly mail: MailService,
    private readonly shop: ShopService,
    private readonly clock: MessageClock,
    private readonly config: ConfigService<AppConfig, true>,
  ) {}

  /** Settles every notice whose window has closed by `now`, one transaction each. */
  async sendDue(now: Date = this.clock.now(), limit = 200): Promise<NoticeRun> {
    const run: NoticeRun = { sent: 0, skipped: 0 };
    for (let i = 0; i < limit; i += 1) {
      const outcome = await this.db.transaction().execute(async (trx) => {
        const [notice] = await this.repository.claimDueNotices(trx, now, 1);
        if (!notice) return null;
        const messages = await this.repository.noticeMessages(trx, notice.booking_id, notice.side, notice.from_seq);
        const people = await this.repository.noticeRecipients(notice.booking_id, trx);
        if (messages.length === 0 || !people) {
          await this.repository.settleNotice(trx, notice.id, { state: 'skipped', message_count: 0, outbox_id: null, settled_at: now });
          return 'skipped' as const;
        }
        const publicUrl = this.config.get('app', { infer: true }).publicUrl;
        const lines = messages.map((m) => ({
          author: m.author_name,
          body: m.body,
          at: new Date(m.created_at).toISOString(),
          photos: Number(m.photo_count),
        }));
        let mail: Pick<OutgoingMail<'build-messages'>, 'to' | 'userId' | 'data'>;
        if (notice.side === 'player') {
          mail = {
            to: people.customer_email,
            userId: people.customer_id,
            data: {
              audience: 'player',
              name: people.customer_name,
              reference: people.reference,
              messages: lines,
              bookingUrl: `${publicUrl}/builds/${people.id}`,
            },
          };
        } else {
          const shop = await this.shop.profile();
          mail = {
            to: people.builder_email ?? shop.contactEmail,
            userId: people.builder_user_id,
            data: {
              audience: 'shop',
              name: people.builder_name ?? shop.name,
              playerName: people.customer_name,
              reference: people.reference,
              messages: lines,
              bookingUrl: `${publicUrl}/backoffice/builds/${people.id}`,
            },
          };
        }
        const row = await this.mail.enqueue(trx, {
          template: 'build-messages',
          bookingId: people.id,
          dedupeKey: `message-notice:${notice.id}`,
          ...mail,
        });
        await this.repository.settleNotice(trx, notice.id, {
          state: 'sent',
          message_count: messages.length,
          outbox_id: row?.id ?? null,
          settled_at: now,
        });
        return 'sent' as const;
      });
      if (!outcome) break;
      run[outcome] += 1;
    }
    if (run.sent) this.logger.log(`Queued ${run.sent} message notice(s)`);
    return run;
  }
}
