import { Client } from 'pg';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startApiProcess, Visitor, type ApiProcess } from './support/api-process';
import { eventually, payDepositAs } from './support/payment-harness';
import { countedBoard } from '../../shared/src/estimate/reference-rigs.fixture';
import { objectStoreEnv, startProcessFakes, startScratchObjectStore } from './support/fakes-env';

const WEBHOOK_SECRET = 'whsec_two_replicas_0123456789';
// 10 a minute per address and e-mail is the API's default (common practice, no published source);
// the address alone may make three times as many attempts, which the sign-ups below stay within.
const THROTTLE_LIMIT = 10;
// Stripe testing documentation, "Test card numbers": 4242 4242 4242 4242 succeeds.
const CARD = '4242424242424242';
const board = countedBoard(5);

/**
 * Two built API processes (as `npm run replica` runs them) on ONE database, one bucket, one payment
 * fake and one mail fake, with the work spread across both as a load balancer would spread it.
 * Whatever either does is counted afterwards in the database and at the fakes: nothing lost,
 * nothing twice. Child-process logs are kept in memory and printed only when a check fails.
 */
describe('two API replicas on one database', () => {
  let a: ApiProcess;
  let b: ApiProcess;
  let fakes: Awaited<ReturnType<typeof startProcessFakes>>;
  let store: Awaited<ReturnType<typeof startScratchObjectStore>>;
  let db: Client;

  beforeAll(async () => {
    fakes = await startProcessFakes('lw_replicas', { secretKey: 'sk_test_two_replicas', webhookSecret: WEBHOOK_SECRET });
    store = await startScratchObjectStore('lw-replicas');
    const shared = {
      ...fakes.env,
      RUN_WORKERS: 'true',
      JWT_SECRET: 'two-replicas-secret-0123456789abcdef',
      ...objectStoreEnv(store),
      AUTH_THROTTLE_LIMIT: String(THROTTLE_LIMIT),
      AUTH_THROTTLE_SECONDS: '120',
      LOG_LEVEL: 'warn',
    };
    // The first migrates and seeds; the second only joins, as `npm run replica` does.
    a = await startApiProcess({ ...shared, SEED_DEMO: 'true' }, 120_000);
    b = await startApiProcess({ ...shared, SEED_DEMO: 'false' }, 120_000);
    db = new Client({ connectionString: fakes.databaseUrl });
    await db.connect();
  }, 240_000);

  afterAll(async () => {
    await db?.end();
    await Promise.all([a?.stop(), b?.stop()]);
    await store?.dispose();
    await fakes?.close();
  });

  /** Runs a check; on failure prints the last lines of both processes' logs. */
  async function withLogs(run: () => Promise<void>) {
    try {
      await run();
    } catch (error) {
      console.error(`replica A:\n${a.lines.slice(-40).join('\n')}\nreplica B:\n${b.lines.slice(-40).join('\n')}`);
      throw error;
    }
  }
  const signIn = async (base: string, email: string) => {
    const v = new Visitor(base);
    const r = await v.call('POST', '/api/auth/sign-in', { email, password: 'demo-pass-2026' });
    expect(r.status, r.text).toBe(200);
    return v;
  };
  /** The same person on the other replica: the session cookie is valid on both (one sessions table). */
  const onOther = (v: Visitor, base: string) => {
    const other = new Visitor(base);
    other.cookies = new Map(v.cookies);
    return other;
  };

  it(
    'both workers drain one outbox: every message delivered exactly once',
    () =>
      withLogs(async () => {
        // Sign-ups through either replica each queue a welcome message with its delivery job.
        const count = 12;
        const emails = Array.from({ length: count }, (_, i) => `drain.${i}@mail.example`);
        await Promise.all(
          emails.map(async (email, i) => {
            const r = await new Visitor(i % 2 ? b.url : a.url).call('POST', '/api/auth/sign-up', {
              name: `Drain Player ${i}`,
              email,
              password: `long-enough-pass-${i}-x`,
            });
            expect(r.status, r.text).toBe(201);
          }),
        );
        await eventually(
          async () => {
            const r = await db.query(
              `select count(*)::int as n from mail_outbox where template = 'welcome' and state = 'sent' and to_address = any($1)`,
              [emails],
            );
            return r.rows[0].n === count;
          },
          'every welcome message sent',
          60_000,
        );
        // A little time for any stray second send, then count at the mail server.
        await new Promise((r) => setTimeout(r, 1_500));
        for (const email of emails)
          expect(
            fakes.mail.messages.filter((m) => m.to.includes(email)),
            email,
          ).toHaveLength(1);
        const states = await db.query(`select state, count(*)::int as n from mail_outbox where to_address = any($1) group by state`, [
          emails,
        ]);
        expect(states.rows).toEqual([{ state: 'sent', n: count }]);
      }),
    120_000,
  );

  it(
    'records each deposit once whichever replica the payment events reach, and lets one of two raced accepts win',
    () =>
      withLogs(async () => {
        const playerA = await signIn(a.url, 'player@mail.example');
        const playerB = onOther(playerA, b.url);
        const bookings: string[] = [];
        // The first deposit's events go to A, the second's to B; then every event is delivered again
        // to the other replica, as the provider retries (same event id, fresh signature).
        for (const [player, target] of [
          [playerA, a],
          [playerB, b],
        ] as const) {
          const booking = await player.call('POST', '/api/bookings', { configuration: board });
          expect(booking.status, booking.text).toBe(201);
          fakes.payments.webhooks.url = `${target.url}/api/payments/webhook`;
          await payDepositAs(player, booking.body.id, CARD);
          bookings.push(booking.body.id);
        }
        const sentIds = fakes.payments.events.map((e) => e.id);
        fakes.payments.webhooks.url = `${b.url}/api/payments/webhook`;
        for (const id of sentIds) fakes.payments.resend(id);
        expect(await fakes.payments.webhooks.settled(sentIds, 20_000)).toBe(true);
        await eventually(
          async () => fakes.payments.webhooks.attempts.filter((x) => x.status !== null && x.status < 300).length >= sentIds.length * 2,
          'every event delivered twice',
          20_000,
        );
        const deposits = await db.query(
          `select booking_id, count(*)::int as n from payments where kind = 'deposit' and status = 'paid' and booking_id = any($1::uuid[]) group by booking_id order by booking_id`,
          [bookings],
        );
        expect(deposits.rows.map((r) => r.n)).toEqual([1, 1]);

        // Two people at the shop accept the same request at the same moment, one through each replica.
        const ownerA = await signIn(a.url, 'owner@shop.example');
        const ownerB = onOther(ownerA, b.url);
        const suggest = await ownerA.call('GET', `/api/bench/suggest?bookingId=${bookings[0]}`);
        expect(suggest.status, suggest.text).toBe(200);
        const pick = suggest.body.suggestions[0];
        const body = { builderId: pick.builder.id, benchDate: pick.benchDate };
        const raced = await Promise.all([
          ownerA.call('POST', `/api/bookings/${bookings[0]}/accept`, body),
          ownerB.call('POST', `/api/bookings/${bookings[0]}/accept`, body),
        ]);
        expect(raced.map((r) => r.status).sort()).toEqual([200, 409]);
        const loser = raced.find((r) => r.status === 409)!;
        expect(loser.body.message).toMatch(/[a-z]+ [a-z]+/i);
        expect(loser.body.statusCode).toBe(409);
        const slices = await db.query('select count(*)::int as n from bench_allocations where booking_id = $1', [bookings[0]]);
        expect(slices.rows[0].n).toBe(1);
      }),
    120_000,
  );

  it(
    'serves a photo sent to one replica from the other, same bytes and type',
    () =>
      withLogs(async () => {
        const player = await signIn(a.url, 'player@mail.example');
        const booking = await player.call('POST', '/api/bookings', { configuration: board });
        expect(booking.status, booking.text).toBe(201);
        const png = await sharp({ create: { width: 40, height: 30, channels: 3, background: { r: 20, g: 120, b: 90 } } })
          .png()
          .toBuffer();
        const form = new FormData();
        form.append('file', new Blob([png], { type: 'image/png' }), 'board.png');
        const cookie = player.cookieHeader();
        const uploaded = await fetch(`${a.url}/api/bookings/${booking.body.id}/photos`, {
          method: 'POST',
          headers: { cookie },
          body: form,
        });
        const photo = (await uploaded.json()) as { url: string };
        expect(uploaded.status, JSON.stringify(photo)).toBe(201);
        const fromA = await fetch(`${a.url}${photo.url}`, { headers: { cookie } });
        const fromB = await fetch(`${b.url}${photo.url}`, { headers: { cookie } });
        expect(fromB.status).toBe(200);
        expect(fromB.headers.get('content-type')).toBe('image/png');
        expect(Buffer.compare(Buffer.from(await fromB.arrayBuffer()), Buffer.from(await fromA.arrayBuffer()))).toBe(0);
      }),
    120_000,
  );

  it(
    'counts failed sign-ins spread over both replicas against one limit',
    () =>
      withLogs(async () => {
        const statuses: number[] = [];
        for (let i = 0; i < THROTTLE_LIMIT; i++) {
          const r = await new Visitor(i % 2 ? b.url : a.url).call('POST', '/api/auth/sign-in', {
            email: 'junior@shop.example',
            password: 'not-the-password',
          });
          statuses.push(r.status);
        }
        expect(statuses).toEqual(Array(THROTTLE_LIMIT).fill(401));
        for (const base of [a.url, b.url]) {
          const over = await new Visitor(base).call('POST', '/api/auth/sign-in', {
            email: 'junior@shop.example',
            password: 'not-the-password',
          });
          expect(over.status).toBe(429);
          expect(over.body.message).toMatch(/Too many attempts/);
        }
      }),
    120_000,
  );

  it(
    'the public lead time each replica holds in memory follows a closure made through the other',
    () =>
      withLogs(async () => {
        const lead = async (base: string) => {
          const r = await new Visitor(base).call('GET', '/api/bench/lead-time?hours=7.00&level=journeyman');
          expect(r.status, r.text).toBe(200);
          return r.body.earliestBenchDate as string;
        };
        const day = await lead(a.url);
        expect(await lead(b.url)).toBe(day);
        const owner = await signIn(a.url, 'owner@shop.example');
        const closure = await owner.call('POST', '/api/settings/closures', { startsOn: day, endsOn: day, reason: 'Stocktaking' });
        expect(closure.status, closure.text).toBe(201);
        // The replica that wrote: its very next answer; the other: once PostgreSQL's notification arrives.
        const moved = await lead(a.url);
        expect(moved > day).toBe(true);
        await eventually(async () => (await lead(b.url)) === moved, 'replica B moves its lead time past the closure', 5_000);
        const removed = await onOther(owner, b.url).call('DELETE', `/api/settings/closures/${closure.body.id}`, {});
        expect(removed.status, removed.text).toBe(204);
        expect(await lead(b.url)).toBe(day);
        await eventually(async () => (await lead(a.url)) === day, 'replica A back to the first day', 5_000);
      }),
    60_000,
  );
});
