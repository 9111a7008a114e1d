import { jargonIn, type RigConfiguration } from '@loomwright/shared';
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

const usd = (amount: string) => new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' }).format(Number(amount));

describe('POST /api/quotes/pdf', () => {
  let t: TestApp;
  const configuration: RigConfiguration = {
    ...referenceBoard('switcher', 'journeyman'),
    functions: ['stereo_output'],
    routing: { mode: 'switcher', switcher: { currentMa: 300 } },
    powerSupply: {
      outputs: [
        { voltage: 9, currentMa: 500, isolated: true },
        ...Array.from({ length: 7 }, () => ({ voltage: 9, currentMa: 250, isolated: true })),
      ],
    },
  };

  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => {
    await t?.close();
  });

  it('prints, for anyone, a PDF whose text holds the same totals as the estimate, the lines, the power plan, the cable list, the cautions and the price-book version', async () => {
    const estimate = (await t.http().post('/api/estimates').send(configuration).expect(200)).body;
    const res = await t.http().post('/api/quotes/pdf').send({ configuration }).buffer(true).parse(binary).expect(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const body = res.body as Buffer;
    expect(body.subarray(0, 5).toString()).toBe('%PDF-');
    // The demo shop is in the US: US Letter, 8.5 × 11 in = 612 × 792 pt (ANSI/ASME Y14.1; CLDR paperSize US-Letter).
    expect(body.toString('latin1')).toMatch(/\/MediaBox \[0 0 612 792\]/);
    const { text } = await pdfParse(body);
    const flat = text.replace(/\s+/g, ' ');
    // Totals as the API priced them, formatted the way any en-US reader writes dollars (ECMA-402).
    expect(flat).toContain(`Estimated total: ${usd(estimate.totalLow)} – ${usd(estimate.totalHigh)}`);
    expect(flat).toContain(`Materials: ${usd(estimate.materialsTotal)}`);
    expect(flat).toContain(`Deposit to book bench time: ${usd(estimate.deposit)}`);
    expect(flat).toContain(`price book version ${estimate.priceBookVersion}`);
    // The day in the demo shop's calendar (America/Chicago), as CLDR en writes it (yMMMEd).
    expect(flat).toContain(
      `quote dated ${new Intl.DateTimeFormat('en-US', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', timeZone: 'America/Chicago' }).format(new Date())}`,
    );
    for (const line of estimate.lines as Array<{ label: string }>) expect(flat).toContain(line.label);
    expect(flat).toContain('Power plan');
    expect(flat).toContain('Patch cables');
    expect(flat).toContain(`${estimate.checks.cableSchedule.patchCount} patch cables`);
    expect(flat).toContain('4 Loop switcher loop 1 send');
    expect(flat).toContain('qualified person');
    expect(flat).toContain('two-person lift');
  });

  it.each([
    ['no configuration', {}, 'configuration'],
    [
      'a configuration with an unknown routing',
      { configuration: { ...configuration, routing: { mode: 'daisy' } } },
      'configuration.routing.mode',
    ],
    ['an unknown field', { configuration, extra: 1 }, ''],
  ])('answers 400 in words, never 500, to %s', async (_what, body, field) => {
    const res = await t.http().post('/api/quotes/pdf').send(body).expect(400);
    const messages: string[] = res.body.details;
    expect(messages.length).toBeGreaterThan(0);
    if (field) expect(res.body.issues.some((i: { path: string }) => i.path === field)).toBe(true);
    expect(messages.flatMap(jargonIn)).toEqual([]);
  });

  it('answers 400 naming the field for a surface the price book does not hold', async () => {
    const res = await t
      .http()
      .post('/api/quotes/pdf')
      .send({ configuration: { ...configuration, surfaceId: 'plank-9000' } })
      .expect(400);
    expect(res.body.details.join(' ')).toContain('plank-9000');
  });
});
