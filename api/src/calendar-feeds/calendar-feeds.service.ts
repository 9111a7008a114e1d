import { createHmac, hkdfSync, timingSafeEqual } from 'node:crypto';
import { Injectable, NotFoundException } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { AuthUser, CalendarFeedLink } from '@loomwright/shared';
import ical, { ICalCalendarMethod } from 'ical-generator';
import { addDays, todayIn } from '../bench/calendar-days';
import type { AppConfig } from '../config/configuration';
import { CalendarFeedsRepository } from './calendar-feeds.repository';

/** Past builds stay in a feed this long, so last month's work is still there to look back on. */
const PAST_DAYS = 90;

const stateWords: Record<string, string> = {
  scheduled: 'scheduled, pedals on their way',
  pedals_received: 'pedals received',
  on_bench: 'on the bench',
  testing: 'testing',
  ready: 'ready, balance requested',
  delivered: 'delivered',
};

type FeedRow = NonNullable<Awaited<ReturnType<CalendarFeedsRepository['find']>>>;

/**
 * Private iCalendar feeds (RFC 5545) of the bench: one per builder and one for the shop, each
 * behind a secret link. The link's secret is an HMAC of the feed's id and generation under a key
 * derived from the server's secret (HKDF, RFC 5869), so the database holds nothing that opens a
 * feed, and rotating (generation + 1) retires the old link at once.
 */
@Injectable()
export class CalendarFeedsService {
  private readonly key: Buffer;
  private readonly publicUrl: string;

  constructor(
    private readonly feeds: CalendarFeedsRepository,
    config: ConfigService<AppConfig, true>,
  ) {
    const secret = config.get('auth', { infer: true }).jwtSecret;
    this.key = Buffer.from(hkdfSync('sha256', secret, 'loomwright', 'calendar-feeds', 32));
    this.publicUrl = config.get('app', { infer: true }).publicUrl;
  }

  private tokenFor(id: string, generation: number): string {
    return createHmac('sha256', this.key).update(`${id}:${generation}`).digest('base64url');
  }

  private link(feed: FeedRow): CalendarFeedLink {
    const url = `${this.publicUrl}/api/calendar-feeds/${feed.id}/${this.tokenFor(feed.id, feed.generation)}/bench.ics`;
    return {
      id: feed.id,
      scope: feed.builder_id ? 'builder' : 'shop',
      builderId: feed.builder_id,
      builderName: feed.builder_name,
      url,
      webcalUrl: url.replace(/^https?:/, 'webcal:'),
      rotatedAt: feed.rotated_at ? new Date(feed.rotated_at).toISOString() : null,
    };
  }

  async list(): Promise<CalendarFeedLink[]> {
    await this.feeds.ensureFeeds();
    return (await this.feeds.list()).map((f) => this.link(f));
  }

  /** The feed of the signed-in builder's own bench (none for an account without a bench). */
  async mine(user: AuthUser): Promise<CalendarFeedLink[]> {
    await this.feeds.ensureFeeds();
    return (await this.feeds.list()).filter((f) => f.user_id === user.id).map((f) => this.link(f));
  }

  async rotate(id: string, user: AuthUser): Promise<CalendarFeedLink> {
    const done = await this.feeds.rotate(id, user.id);
    if (!done) throw new NotFoundException('There is no calendar feed with that id.');
    return this.link((await this.feeds.find(id))!);
  }

  /** The feed's calendar text; the same 404 for an unknown feed and a wrong or retired secret. */
  async calendar(id: string, token: string): Promise<string> {
    const feed = await this.feeds.find(id);
    const expected = feed ? Buffer.from(this.tokenFor(feed.id, feed.generation)) : null;
    const given = Buffer.from(token);
    if (!feed || !expected || expected.length !== given.length || !timingSafeEqual(expected, given)) {
      throw new NotFoundException(
        'There is no calendar at this address: the link may have been replaced. Ask the owner for the current one.',
      );
    }
    const shop = await this.feeds.shop();
    const builds = await this.feeds.builds(feed.builder_id, addDays(todayIn(shop.timezone), -PAST_DAYS));
    const calendar = ical({
      name: feed.builder_name ? `${shop.name}: ${feed.builder_name}’s bench` : `${shop.name}: the bench`,
      prodId: { company: 'Loomwright', product: 'bench-feed', language: 'EN' },
      method: ICalCalendarMethod.PUBLISH,
      // RFC 7986 REFRESH-INTERVAL / X-PUBLISHED-TTL: ask calendar programs to look again every hour.
      ttl: 3600,
    });
    for (const b of builds) {
      const first = b.days[0]?.day ?? b.bench_date!;
      const last = b.days.at(-1)?.day ?? b.expected_completion ?? b.bench_date!;
      const [y1, m1, d1] = first.split('-').map(Number);
      const [y2, m2, d2] = last.split('-').map(Number);
      const booked = b.days.reduce((s, d) => s + Number(d.hours), 0);
      const hours = b.quoted_hours ? Number(b.quoted_hours) : booked;
      const link = `${this.publicUrl}/backoffice/builds/${b.id}`;
      calendar.createEvent({
        // RFC 5545 §3.8.4.7: the same UID on every fetch, so a moved build moves in the calendar.
        id: `bench-${b.reference}@loomwright.app`,
        sequence: b.calendar_sequence,
        // All-day: DTSTART;VALUE=DATE on the first bench day, DTEND the day after the last (exclusive, §3.6.1).
        start: new Date(Date.UTC(y1, m1 - 1, d1)),
        end: new Date(Date.UTC(y2, m2 - 1, d2 + 1)),
        allDay: true,
        summary: `${b.reference} · ${b.customer_name} · ${hours} h`,
        description: [
          `Build ${b.reference} for ${b.customer_name}: ${hours} h quoted, ${stateWords[b.state] ?? b.state}.`,
          b.builder_name && !feed.builder_id ? `Builder: ${b.builder_name}.` : null,
          b.days.length > 0 ? `Bench hours: ${b.days.map((d) => `${d.day} ${Number(d.hours)} h`).join(', ')}.` : null,
          `Open the build: ${link}`,
        ]
          .filter(Boolean)
          .join('\n'),
        url: link,
        stamp: new Date(),
        lastModified: new Date(b.updated_at),
      });
    }
    return calendar.toString();
  }
}
