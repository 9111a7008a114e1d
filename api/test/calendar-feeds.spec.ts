import ICAL from 'ical.js';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CalendarFeedLink } from '@loomwright/shared';
import { builderId, createBooking, signIn } from './support/bench-fixtures';
import { createTestApp, type TestApp } from './support/test-app';

/** The bench feeds, read back with an independent iCalendar parser (ical.js, RFC 5545). */
let t: TestApp;
let owner: Awaited<ReturnType<typeof signIn>>;
let master: string;
let junior: string;
let a: { id: string; reference: string };
let b: { id: string; reference: string };

const pathOf = (url: string) => new URL(url).pathname;

async function feed(url: string) {
  const res = await t.http().get(pathOf(url));
  expect(res.status, res.text).toBe(200);
  expect(res.headers['content-type']).toMatch(/^text\/calendar; charset=utf-8/);
  const component = new ICAL.Component(ICAL.parse(res.text));
  return component.getAllSubcomponents('vevent').map((v) => new ICAL.Event(v));
}

async function place(bookingId: string, builder: string, days: Array<[string, number]>) {
  await t.db.deleteFrom('bench_allocations').where('booking_id', '=', bookingId).execute();
  for (const [day, hours] of days) {
    await t.db
      .insertInto('bench_allocations')
      .values({
        booking_id: bookingId,
        builder_id: builder,
        day,
        hours: sql<string>`numrange(0, ${hours}::numeric, '[)')`,
        day_capacity: '8.00',
      })
      .execute();
  }
  await t.db
    .updateTable('bookings')
    .set({ state: 'scheduled', builder_id: builder, bench_date: days[0][0], expected_completion: days.at(-1)![0] })
    .where('id', '=', bookingId)
    .execute();
}

const future = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

beforeAll(async () => {
  t = await createTestApp({ env: { PUBLIC_URL: 'https://shop.test' } });
  owner = await signIn(t.app, 'owner@shop.example');
  master = await builderId(t.db, 'builder@shop.example');
  junior = await builderId(t.db, 'junior@shop.example');
  a = await createBooking(t.db, { laborHours: '9.50' });
  b = await createBooking(t.db, { laborHours: '3.00' });
  await place(a.id, master, [
    [future(20), 6],
    [future(21), 3.5],
  ]);
  await place(b.id, junior, [[future(22), 3]]);
}, 120_000);

afterAll(async () => {
  await t?.close();
});

describe('calendar feeds', () => {
  it('lists a feed for the shop and one per builder, each with its secret link', async () => {
    const links = (await owner.get('/api/calendar-feeds').expect(200)).body as CalendarFeedLink[];
    expect(links[0]).toMatchObject({ scope: 'shop', builderId: null });
    expect(links.filter((l) => l.scope === 'builder').map((l) => l.builderId)).toEqual(expect.arrayContaining([master, junior]));
    for (const l of links) {
      expect(l.url).toMatch(/^https:\/\/shop\.test\/api\/calendar-feeds\/[0-9a-f-]{36}\/[A-Za-z0-9_-]{43}\/bench\.ics$/);
      expect(l.webcalUrl).toBe(l.url.replace('https:', 'webcal:'));
    }
    // Listing again makes no second feed.
    expect(((await owner.get('/api/calendar-feeds').expect(200)).body as CalendarFeedLink[]).map((l) => l.id)).toEqual(
      links.map((l) => l.id),
    );
  });

  it('has each scheduled build as an all-day event with reference, player, hours and a link to the build', async () => {
    const links = (await owner.get('/api/calendar-feeds').expect(200)).body as CalendarFeedLink[];
    const shop = await feed(links.find((l) => l.scope === 'shop')!.url);
    expect(shop.map((e) => e.uid).sort()).toEqual([`bench-${a.reference}@loomwright.app`, `bench-${b.reference}@loomwright.app`].sort());
    const eventA = shop.find((e) => e.uid === `bench-${a.reference}@loomwright.app`)!;
    expect(eventA.startDate.isDate).toBe(true);
    expect(eventA.startDate.toString()).toBe(future(20));
    // RFC 5545 §3.6.1: an all-day event's DTEND is the day after its last day.
    expect(eventA.endDate.toString()).toBe(future(22));
    expect(eventA.summary).toContain(a.reference);
    expect(eventA.summary).toContain('9.5 h');
    expect(eventA.description).toContain(`https://shop.test/backoffice/builds/${a.id}`);
    expect(eventA.description).toMatch(/Builder: /);
    expect(eventA.component.getFirstPropertyValue('url')).toBe(`https://shop.test/backoffice/builds/${a.id}`);

    const mine = await feed(links.find((l) => l.builderId === master)!.url);
    expect(mine.map((e) => e.uid)).toEqual([`bench-${a.reference}@loomwright.app`]);
  });

  it('moves a build in the feed when it moves on the bench: same UID, new days, higher SEQUENCE', async () => {
    const links = (await owner.get('/api/calendar-feeds').expect(200)).body as CalendarFeedLink[];
    const url = links.find((l) => l.scope === 'shop')!.url;
    const before = (await feed(url)).find((e) => e.uid === `bench-${b.reference}@loomwright.app`)!;
    await place(b.id, master, [
      [future(30), 2],
      [future(31), 1],
    ]);
    await t.db
      .updateTable('bookings')
      .set({ calendar_sequence: sql`calendar_sequence + 1` })
      .where('id', '=', b.id)
      .execute();
    const after = (await feed(url)).find((e) => e.uid === `bench-${b.reference}@loomwright.app`)!;
    expect(after.startDate.toString()).toBe(future(30));
    expect(after.endDate.toString()).toBe(future(32));
    expect(after.sequence).toBe(before.sequence + 1);
    // Now the master's, no longer the junior's.
    expect((await feed(links.find((l) => l.builderId === junior)!.url)).map((e) => e.uid)).toEqual([]);
    expect((await feed(links.find((l) => l.builderId === master)!.url)).map((e) => e.uid)).toContain(`bench-${b.reference}@loomwright.app`);
    // A cancelled build leaves the feed.
    await t.db.updateTable('bookings').set({ state: 'cancelled' }).where('id', '=', b.id).execute();
    expect((await feed(url)).map((e) => e.uid)).not.toContain(`bench-${b.reference}@loomwright.app`);
  });

  it('rotating a link retires the old one at once; a wrong secret is a 404 in words', async () => {
    const links = (await owner.get('/api/calendar-feeds').expect(200)).body as CalendarFeedLink[];
    const old = links.find((l) => l.builderId === master)!;
    const rotated = (await owner.post(`/api/calendar-feeds/${old.id}/rotate`).send({}).expect(200)).body as CalendarFeedLink;
    expect(rotated.id).toBe(old.id);
    expect(rotated.url).not.toBe(old.url);
    expect(rotated.rotatedAt).not.toBeNull();
    const gone = await t.http().get(pathOf(old.url));
    expect(gone.status).toBe(404);
    expect(gone.body.message).toMatch(/link may have been replaced/);
    await feed(rotated.url);
    // The other feeds keep their links.
    await feed(links.find((l) => l.scope === 'shop')!.url);
    expect((await t.http().get(`/api/calendar-feeds/${old.id}/x/bench.ics`)).status).toBe(404);
    expect((await t.http().get('/api/calendar-feeds/not-a-uuid/x/bench.ics')).status).toBe(400);
  });

  it('lets only the owner list and rotate', async () => {
    const builder = await signIn(t.app, 'builder@shop.example');
    expect((await builder.get('/api/calendar-feeds')).status).toBe(403);
    expect((await t.http().get('/api/calendar-feeds')).status).toBe(401);
  });

  it('gives each builder their own link (GET /api/calendar-feeds/mine), the same one the owner lists, and follows a rotation', async () => {
    const builder = await signIn(t.app, 'builder@shop.example');
    const mine = (await builder.get('/api/calendar-feeds/mine').expect(200)).body as CalendarFeedLink[];
    expect(mine).toHaveLength(1);
    expect(mine[0]).toMatchObject({ scope: 'builder', builderId: await builderId(t.db, 'builder@shop.example') });
    const listed = ((await owner.get('/api/calendar-feeds').expect(200)).body as CalendarFeedLink[]).find((l) => l.id === mine[0]!.id);
    expect(listed).toEqual(mine[0]);
    // The link opens the builder's feed as iCalendar text (RFC 5545 starts it with BEGIN:VCALENDAR).
    const text = (await t.http().get(new URL(mine[0]!.url).pathname).expect(200)).text;
    expect(text.startsWith('BEGIN:VCALENDAR')).toBe(true);
    const rotated = (await owner.post(`/api/calendar-feeds/${mine[0]!.id}/rotate`).send({}).expect(200)).body as CalendarFeedLink;
    const after = (await builder.get('/api/calendar-feeds/mine').expect(200)).body as CalendarFeedLink[];
    expect(after[0]!.url).toBe(rotated.url);
    expect(after[0]!.url).not.toBe(mine[0]!.url);
    expect((await t.http().get('/api/calendar-feeds/mine')).status).toBe(401);
  });
});
