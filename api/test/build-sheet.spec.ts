import { demoPriceBook, estimateRig, type EstimateResult, type RigConfiguration } from '@loomwright/shared';
// pdf-parse 1.x: a general-purpose PDF text extractor (over Mozilla's pdf.js). The inner module
// is imported because the package's index runs a self-test when it has no parent module.
import pdfParse from 'pdf-parse/lib/pdf-parse.js';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { referenceBoard } from '../../shared/src/estimate/reference-rigs.fixture';
import { createTestApp, type TestApp } from './support/test-app';
import { signIn } from './support/bench-fixtures';

const binary = (res: supertest.Response, cb: (err: Error | null, body: Buffer) => void) => {
  const stream = res as unknown as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (c: Buffer) => chunks.push(c));
  stream.on('end', () => cb(null, Buffer.concat(chunks)));
};

describe('GET /api/bookings/:id/build-sheet', () => {
  let t: TestApp;
  let bookingId: string;
  const config: RigConfiguration = {
    ...referenceBoard('switcher', 'master'),
    functions: ['stereo_output'],
    powerSupply: {
      outputs: [
        { voltage: 9, currentMa: 500, isolated: true },
        ...Array.from({ length: 7 }, () => ({ voltage: 9, currentMa: 100, isolated: true })),
      ],
    },
  };

  const signedIn = (email: string) => signIn(t.app, email);

  /** A quote row of the booking for this board and estimate, good for 30 days. */
  const quoteOn = (estimate: EstimateResult) => ({
    booking_id: bookingId,
    price_book_version: 1,
    currency: 'USD',
    configuration: JSON.stringify(config),
    estimate: JSON.stringify(estimate),
    labor_hours: estimate.laborHours,
    total_low: estimate.totalLow,
    total_high: estimate.totalHigh,
    deposit: estimate.deposit,
    expires_at: new Date(Date.now() + 30 * 86_400_000),
  });

  beforeAll(async () => {
    t = await createTestApp();
    const player = await t.db.selectFrom('users').select('id').where('email', '=', 'player@mail.example').executeTakeFirstOrThrow();
    const builder = await t.db
      .selectFrom('builders')
      .innerJoin('users', 'users.id', 'builders.user_id')
      .select('builders.id')
      .where('users.email', '=', 'builder@shop.example')
      .executeTakeFirstOrThrow();
    const booking = await t.db
      .insertInto('bookings')
      .values({
        reference: 'CRW-7001',
        customer_id: player.id,
        state: 'scheduled',
        configuration: JSON.stringify(config),
        customer_notes: 'Please keep the wah at the right edge; I play it with my right foot.',
        builder_id: builder.id,
        bench_date: '2027-01-12',
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    bookingId = booking.id;
    const estimate = estimateRig(config, demoPriceBook, { version: 1 });
    await t.db
      .insertInto('quotes')
      .values({ ...quoteOn(estimate), kind: 'estimate' })
      .execute();
  });
  afterAll(async () => {
    await t?.close();
  });

  it('prints a PDF whose text holds the cable schedule, the loops, the power assignment, the notes and the cautions', async () => {
    const builder = await signedIn('builder@shop.example');
    const res = await builder.get(`/api/bookings/${bookingId}/build-sheet`).buffer(true).parse(binary).expect(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    // Chromium's PDF viewer embeds the document and styles its page inline, so the sheet's own
    // CSP allows exactly that and still forbids framing (see security/security-headers.ts).
    expect(res.headers['content-security-policy']).toMatch(/object-src 'self'.*frame-ancestors 'none'/);
    expect(res.headers['content-security-policy']).not.toMatch(/script-src/);
    const body = res.body as Buffer;
    expect(body.subarray(0, 5).toString()).toBe('%PDF-');
    const { text, numpages } = await pdfParse(body);
    const flat = text.replace(/\s+/g, ' ');
    expect(numpages).toBeGreaterThanOrEqual(1);
    expect(flat).toContain('Build sheet CRW-7001');
    expect(flat).toContain('Cable schedule');
    // 23 audio patches for this board plus 1 for the stereo output, worked by hand in the engine tests.
    expect(flat).toContain('24 patch cables, 48 plugs, 48.00 ft of cable including 12.00 ft spare.');
    for (const patch of [
      'Input/output buffer output',
      'Tuner input',
      'Wah output',
      'Loop switcher input',
      'Loop switcher loop 1 send',
      'fuzz input',
      'Loop switcher loop 10 return',
    ]) {
      expect(flat).toContain(patch);
    }
    expect(flat).toContain('Loop assignments');
    // One numbering for the chain, the loops, the cables and the drawing's key: buffer 1, tuner 2,
    // wah 3, switcher 4, then its loops from 5 (fuzz first).
    expect(flat).toContain('4. Loop switcher (loops 1–10: 5, 6, 7, 8, 9, 10, 11, 12, 13, 14)');
    expect(flat).toContain('4 Loop switcher loop 1 send');
    expect(flat).toContain('5 fuzz input');
    expect(flat).toMatch(/1 Input\/output buffer · 2 Tuner · 3 Wah · 4 Loop switcher · 5 fuzz/);
    expect(flat).toContain('Power assignment');
    expect(flat).toContain('14 DC barrel plugs');
    expect(flat).toContain('Stereo output');
    expect(flat).toContain('keep the wah at the right edge');
    expect(flat).toContain('qualified person');
    expect(flat).toContain('two-person lift');
    expect(flat).toContain('lead');
  });

  it("prints the booking's money from its money facts: firm quote lines that add up, extras, each payment and refund at its own time in the shop's zone, and the balance", async () => {
    // A worked example checked in whole cents (BigInt), not with the code under test: the rule the
    // shop states is balance = firm total + approved extras − (paid − refunded) (common practice,
    // no published source). Rate 125.00/h is the seeded master builder's.
    const estimate = (await t.db.selectFrom('quotes').select('estimate').where('booking_id', '=', bookingId).executeTakeFirstOrThrow())
      .estimate;
    const cents = (v: string) => BigInt(Math.round(Number(v) * 100));
    const hoursCentis = cents(estimate.laborHours); // hours × 100
    const laborCents = (12500n * hoursCentis) / 100n; // 125.00 × hours, exact for quarter hours
    const totalCents = laborCents + cents(estimate.materialsTotal);
    const dollars = (c: bigint) => `$${(c / 100n).toLocaleString('en-US')}.${String(c % 100n).padStart(2, '0')}`;
    await t.db
      .insertInto('quotes')
      .values({
        ...quoteOn(estimate),
        kind: 'firm',
        hourly_rate: '125.00',
        labor_total: (Number(laborCents) / 100).toFixed(2),
        total: (Number(totalCents) / 100).toFixed(2),
      })
      .execute();
    await t.db
      .insertInto('booking_extras')
      .values([
        { booking_id: bookingId, description: 'Longer road case', amount: '45.50', reason: 'The board grew', status: 'approved' },
        { booking_id: bookingId, description: 'Second buffer', amount: '60.00', reason: 'Long cable run', status: 'proposed' },
        { booking_id: bookingId, description: 'Engraved plate', amount: '25.00', reason: 'Asked at intake', status: 'declined' },
      ])
      .execute();
    await t.db
      .insertInto('payments')
      .values([
        {
          booking_id: bookingId,
          kind: 'deposit',
          amount: estimate.deposit,
          amount_minor: Number(cents(estimate.deposit)),
          currency: 'USD',
          status: 'paid',
          paid_at: new Date('2026-11-30T15:00:00Z'),
        },
        // A balance payment taken twice by mistake and refunded a day later.
        {
          booking_id: bookingId,
          kind: 'balance',
          amount: '100.00',
          amount_minor: 10000,
          currency: 'USD',
          status: 'refunded',
          paid_at: new Date('2026-12-01T16:30:00Z'),
          refunded_at: new Date('2026-12-02T17:45:00Z'),
        },
      ])
      .execute();
    await t.db.updateTable('shop_settings').set({ timezone: 'America/Denver', locale: 'en-US' }).execute();

    const owner = await signedIn('owner@shop.example');
    const res = await owner.get(`/api/bookings/${bookingId}/build-sheet`).buffer(true).parse(binary).expect(200);
    const flat = (await pdfParse(res.body as Buffer)).text.replace(/[\s\u202f]+/g, ' ');
    const balanceCents = totalCents + 4550n - cents(estimate.deposit);
    expect(flat).toContain('Money');
    expect(flat).toContain(`Firm total ${dollars(totalCents)}`);
    expect(flat).toContain(`Approved extras${dollars(4550n)}`);
    expect(flat).toContain(`Balance due${dollars(balanceCents)}`);
    // The API's own figure agrees with the paper.
    const detail = (await owner.get(`/api/bookings/${bookingId}`).expect(200)).body;
    expect(cents(detail.money.balanceDue)).toBe(balanceCents);
    // Each movement at its own time, in the shop's zone (America/Denver is UTC−7 in winter: IANA tz database).
    expect(flat).toContain('Deposit paidMon, Nov 30, 2026, 8:00 AM MST');
    expect(flat).toContain('Balance paidTue, Dec 1, 2026, 9:30 AM MST');
    expect(flat).toContain('Balance refundedWed, Dec 2, 2026, 10:45 AM MST');
    expect(flat).toContain("Extras waiting for the player's answer ($60.00) are not counted until approved.");
    expect(flat).toMatch(/Engraved plate ?declined ?\$25\.00/);
    // The firm quote's lines (labor at the one rate) add up to its total, to the cent.
    // (The rate inside each line's explanation, "at $125.00 per hour", is words, not an amount.)
    const amounts = [
      ...flat.slice(flat.indexOf('Firm quoteQuantityAmount'), flat.indexOf('Firm total')).matchAll(/(?<!at )\$([\d,]+\.\d{2})/g),
    ].map((m) => cents(m[1]!.replace(/,/g, '')));
    expect(amounts.length).toBeGreaterThan(3);
    expect(flat.slice(flat.indexOf('Firm quoteQuantityAmount'), flat.indexOf('Firm total'))).toContain('at $125.00 per hour'); // en-US dollars as ECMA-402 Intl.NumberFormat writes them (CLDR ¤#,##0.00)
    expect(flat.slice(flat.indexOf('Firm quoteQuantityAmount'), flat.indexOf('Firm total'))).not.toMatch(/per hour.*–|–.*per hour/);
    expect(amounts.reduce((a, b) => a + b, 0n)).toBe(totalCents);
  });

  it('is for staff only, and answers 404 for an unknown booking and 400 for a malformed id', async () => {
    await t.http().get(`/api/bookings/${bookingId}/build-sheet`).expect(401);
    const player = await signedIn('player@mail.example');
    await player.get(`/api/bookings/${bookingId}/build-sheet`).expect(403);
    const owner = await signedIn('owner@shop.example');
    await owner.get('/api/bookings/00000000-0000-4000-8000-000000000000/build-sheet').expect(404);
    await owner.get('/api/bookings/not-a-uuid/build-sheet').expect(400);
  });
});
