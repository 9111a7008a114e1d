import { demoPriceBook, estimateRig, jargonIn } from '@loomwright/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { countedBoard, referenceBoard, expectedLaborRanges } from '../../shared/src/estimate/reference-rigs.fixture';
import { createTestApp, type TestApp } from './support/test-app';

describe('POST /api/estimates', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => {
    await t?.close();
  });

  it.each(expectedLaborRanges)(
    'prices the $mode reference board at $level rates with the engine’s numbers, inside the expected range (common practice, no published source)',
    async ({ mode, level, low, high }) => {
      const config = referenceBoard(mode, level);
      const res = await t.http().post('/api/estimates').send(config).expect(200);
      // The seeded book is the demo book, version 1: the HTTP answer is the engine's answer.
      const expected = estimateRig(config, demoPriceBook, { version: 1 });
      expect(res.body).toEqual(JSON.parse(JSON.stringify(expected)));
      // Stated figures (common practice, no published source) widened by 5% at each end.
      expect(Number(res.body.laborLow)).toBeGreaterThanOrEqual(low * 0.95);
      expect(Number(res.body.laborHigh)).toBeLessThanOrEqual(high * 1.05);
      const mid = (Number(res.body.laborLow) + Number(res.body.laborHigh)) / 2;
      expect(Math.abs(mid - (low + high) / 2)).toBeLessThanOrEqual(((low + high) / 2) * 0.1);
    },
  );

  it('answers a quick pedal count on a serial board', async () => {
    const res = await t
      .http()
      .post('/api/estimates')
      .send({ surfaceId: 'slate-46', caseId: 'shell-hard', routing: { mode: 'serial' }, pedalCount: 5, functions: [], level: 'apprentice' })
      .expect(200);
    expect(res.body.priceBookVersion).toBe(1);
    expect(res.body.currency).toBe('USD');
    // 5 pedals in series: 4 patches, 8 plugs, 5 barrel plugs; 5 h + 1 h for the supply.
    const line = (code: string) => res.body.lines.find((l: { code: string }) => l.code === code);
    expect(line('patch_plugs').quantity).toBe('8');
    expect(line('dc_barrel_plugs').quantity).toBe('5');
    expect(res.body.laborHours).toBe('6.00');
  });

  it('tells the player about an under-sized supply and a surface too small, with the checks beside the price', async () => {
    const config = {
      ...referenceBoard('serial', 'journeyman'),
      surfaceId: 'slate-46',
      pedals: referenceBoard('serial', 'journeyman').pedals!.map((p) => ({ ...p, currentMa: 90 })),
      powerSupply: {
        outputs: [
          { voltage: 9, currentMa: 500, isolated: false },
          { voltage: 9, currentMa: 500, isolated: false },
        ],
      },
    };
    const res = await t.http().post('/api/estimates').send(config).expect(200);
    const { powerBudget, boardFit, cableSchedule } = res.body.checks;
    // 13 pedals × 90 mA = 1170 mA against 2 × 500 mA: 170 mA short, 1.53 W at 9 V (P = V × I).
    expect(powerBudget).toMatchObject({
      status: 'problem',
      totalDrawMa: 1170,
      totalRatingMa: 1000,
      totalHeadroomMa: -170,
      totalHeadroomW: -1.53,
    });
    expect(boardFit).toMatchObject({ status: 'problem', areaFits: false, smallestFittingSurfaceId: 'ridge-81' });
    expect(cableSchedule).toMatchObject({ patchCount: 12, plugCount: 24 });
    // The digital delay takes an output of its own and three analog 90 mA pedals share the other
    // (the demo book's daisy-chain limit): 4 of the 13 are powered, the other 9 need 3 more outputs.
    expect(powerBudget.unassigned).toHaveLength(9);
    expect(powerBudget.outputs.every((o: { loadMa: number; ratingMa: number }) => o.loadMa <= o.ratingMa)).toBe(true);
    expect(res.body.notes.some((n: string) => n.startsWith('To power every pedal: a supply with 3 more outputs'))).toBe(true);
    expect(res.body.notes.some((n: string) => n.includes('Slate 46'))).toBe(true);
  });

  it("plans the switcher's own draw on an output of its own, and keeps a pedal the player pinned", async () => {
    const config = {
      ...referenceBoard('switcher', 'master'),
      routing: { mode: 'switcher', switcher: { currentMa: 350 } },
      pedals: referenceBoard('switcher', 'master').pedals!.map((p, i) => ({ ...p, currentMa: 20, ...(i === 0 ? { powerOutput: 1 } : {}) })),
      powerSupply: {
        outputs: [
          { voltage: 9, currentMa: 500, isolated: true },
          { voltage: 9, currentMa: 100, isolated: true },
          ...Array.from({ length: 6 }, () => ({ voltage: 9, currentMa: 250, isolated: true })),
        ],
      },
    };
    const res = await t.http().post('/api/estimates').send(config).expect(200);
    const plan = res.body.checks.powerBudget;
    const switcher = plan.assignments.find((a: { deviceId: string }) => a.deviceId === 'switcher');
    // 350 mA only fits the 500 mA output; a switcher is digital, so it is alone there.
    expect(switcher).toMatchObject({ output: 0, currentMa: 350, drawFromMemory: false });
    expect(plan.outputs[0].devices).toEqual(['Loop switcher']);
    expect(plan.assignments[0]).toMatchObject({ device: 'Input/output buffer', output: 1, pinned: true });
    expect(plan.status).toBe('ok');
  });

  const base = countedBoard(4);
  const bad: Array<[string, unknown, string]> = [
    ['an unknown surface', { ...base, surfaceId: 'plank-9000' }, 'surfaceId'],
    ['an unknown case', { ...base, caseId: 'shoebox' }, 'caseId'],
    ['an unknown function', { ...base, functions: ['laser_show'] }, 'functions[0]'],
    ['a switcher on a serial board', { ...base, routing: { mode: 'serial', switcher: { currentMa: 300 } } }, 'routing.switcher'],
    [
      'a negative switcher draw',
      {
        ...base,
        pedalCount: undefined,
        pedals: [{ name: 'fuzz', powered: true, inLoop: true }],
        routing: { mode: 'switcher', switcher: { currentMa: -5 } },
      },
      'routing.switcher.currentMa',
    ],
    [
      'a pedal pinned to an output the supply lacks',
      {
        ...base,
        pedalCount: undefined,
        pedals: [{ name: 'fuzz', powered: true, inLoop: false, powerOutput: 2 }],
        powerSupply: { outputs: [{ voltage: 9, currentMa: 100, isolated: true }] },
      },
      'pedals[0].powerOutput',
    ],
    ['a negative pedal count', { ...base, pedalCount: -3 }, 'pedalCount'],
    ['an absurd pedal count', { ...base, pedalCount: 100000 }, 'pedalCount'],
    ['a fractional pedal count', { ...base, pedalCount: 2.5 }, 'pedalCount'],
    ['a pedal count as text', { ...base, pedalCount: 'lots' }, 'pedalCount'],
    [
      'a loop pedal on a serial board',
      { ...base, pedalCount: undefined, pedals: [{ name: 'fuzz', powered: true, inLoop: true }] },
      'pedals[0].inLoop',
    ],
    ['an unknown level', { ...base, level: 'wizard' }, 'level'],
    ['an unknown routing', { ...base, routing: { mode: 'wireless' } }, 'routing.mode'],
    ['no pedals at all', { ...base, pedalCount: undefined }, 'pedals'],
    [
      'a negative current draw',
      { ...base, pedalCount: undefined, pedals: [{ name: 'fuzz', powered: true, inLoop: false, currentMa: -5 }] },
      'pedals[0].currentMa',
    ],
  ];
  it.each(bad)('answers 400 naming the field for %s', async (_what, body, field) => {
    const res = await t
      .http()
      .post('/api/estimates')
      .send(body as object);
    expect(res.status).toBe(400);
    // The words are for a person; the field's path travels beside them for programs.
    const issues: Array<{ path: string; message: string }> = res.body.issues;
    expect(issues.some((i) => i.path === field)).toBe(true);
    const messages: string[] = Array.isArray(res.body.message) ? res.body.message : [res.body.message];
    expect(messages.flatMap(jargonIn)).toEqual([]);
  });

  const garbage: Array<[string, string]> = [
    ['malformed JSON', '{"surfaceId": '],
    ['a JSON string', '"serial please"'],
    ['a JSON number', '42'],
    ['null', 'null'],
    ['an array', '[1,2,3]'],
    ['an empty object', '{}'],
    ['deeply wrong types', '{"surfaceId":{"$gt":""},"caseId":[],"routing":"serial","pedals":"many","functions":{},"level":7}'],
    ['a prototype key', '{"__proto__":{"polluted":true},"surfaceId":"slate-61"}'],
    [
      'huge numbers',
      '{"surfaceId":"slate-61","caseId":"shell-hard","routing":{"mode":"serial"},"pedals":[{"name":"x","powered":true,"inLoop":false,"currentMa":1e308,"widthMm":1e400}],"functions":[],"level":"master"}',
    ],
  ];
  it.each(garbage)('answers 400, never 500, to %s', async (_what, raw) => {
    const res = await t.http().post('/api/estimates').set('content-type', 'application/json').send(raw);
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body.message)).toBeTruthy();
  });

  it('answers 415 in words to a form-encoded or text body (see csrf.spec.ts)', async () => {
    const text = await t.http().post('/api/estimates').set('content-type', 'text/plain').send('pedals=12');
    expect(text.status).toBe(415);
    expect(text.body.message).toMatch(/must be sent as application\/json/);
    const form = await t.http().post('/api/estimates').type('form').send({ surfaceId: 'slate-61' });
    expect(form.status).toBe(415);
  });
});

describe('GET /api/catalog', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => {
    await t?.close();
  });

  it('answers the current book: surfaces, cases, functions, levels, deposit policy, each with an id', async () => {
    const res = await t.http().get('/api/catalog').expect(200);
    expect(res.body).toMatchObject({ priceBookVersion: 1, currency: 'USD' });
    for (const key of ['surfaces', 'cases', 'functions', 'levels'] as const) {
      expect(res.body[key].length).toBeGreaterThan(0);
      for (const item of res.body[key]) expect(typeof item.id).toBe('string');
    }
    for (const fn of res.body.functions) expect(typeof fn.code).toBe('string');
    expect(res.body.levels.map((l: { code: string }) => l.code).sort()).toEqual(['apprentice', 'journeyman', 'master']);
    expect(res.body.depositPolicy).toEqual({ percent: '25', minimum: '100.00', description: expect.any(String) });
    expect(res.body.cases.find((c: { kind: string }) => c.kind === 'soft_bag').notRecommended).toBe(true);
  });
});
