import { demoPriceBook, estimateRig, type RigConfiguration } from '@loomwright/shared';
// pdf-parse 1.x: a general-purpose PDF text extractor (over Mozilla's pdf.js). The inner module
// is imported because the package's index runs a self-test when it has no parent module.
import pdfParse from 'pdf-parse/lib/pdf-parse.js';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { referenceBoard } from '../../shared/src/estimate/reference-rigs.fixture';
import { createTestApp, type TestApp } from './support/test-app';

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
    powerSupply: { outputs: [{ voltage: 9, currentMa: 500, isolated: true }, ...Array.from({ length: 7 }, () => ({ voltage: 9, currentMa: 100, isolated: true }))] },
  };

  const signedIn = async (email: string) => {
    const agent = supertest.agent(t.app.getHttpServer());
    await agent.post('/api/auth/sign-in').send({ email, password: 'demo-pass-2026' }).expect(200);
    return agent;
  };

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
      .values({
        booking_id: bookingId,
        kind: 'estimate',
        price_book_version: 1,
        currency: 'USD',
        configuration: JSON.stringify(config),
        estimate: JSON.stringify(estimate),
        labor_hours: estimate.laborHours,
        total_low: estimate.totalLow,
        total_high: estimate.totalHigh,
        deposit: estimate.deposit,
        expires_at: new Date(Date.now() + 30 * 86_400_000),
      })
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
    for (const patch of ['Input/output buffer output', 'Tuner input', 'Wah output', 'Loop switcher input', 'Loop switcher loop 1 send', 'fuzz input', 'Loop switcher loop 10 return']) {
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

  it('is for staff only, and answers 404 for an unknown booking and 400 for a malformed id', async () => {
    await t.http().get(`/api/bookings/${bookingId}/build-sheet`).expect(401);
    const player = await signedIn('player@mail.example');
    await player.get(`/api/bookings/${bookingId}/build-sheet`).expect(403);
    const owner = await signedIn('owner@shop.example');
    await owner.get('/api/bookings/00000000-0000-4000-8000-000000000000/build-sheet').expect(404);
    await owner.get('/api/bookings/not-a-uuid/build-sheet').expect(400);
  });
});
