import Decimal from 'decimal.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { builderLevels } from '../domain';
import { demoPriceBook } from '../price-book/demo-price-book';
import type { PriceBook } from '../price-book/types';
import { EstimateInputError } from './errors';
import { depositFor, estimateRig } from './estimate-rig';
import { minorUnitDigits, roundToMinorUnit } from './money';
import { countedBoard, referenceBoard, expectedLaborRanges } from './reference-rigs.fixture';
import { pedalKinds } from './schema';
import type { EstimateResult, PedalInput, RigConfiguration } from './types';

const v1 = { version: 1 };
const line = (r: EstimateResult, code: string) => {
  const found = r.lines.find((l) => l.code === code);
  if (!found) throw new Error(`no line ${code}`);
  return found;
};

describe('the reference board against labor ranges (common practice, no published source)', () => {
  // Expected ranges: common practice, no published source. Each computed range must lie inside the
  // expected one widened by 5% at each end, with its midpoint within 10% of the expected midpoint.
  it.each(expectedLaborRanges)('$mode board at $level rates: $low–$high', ({ mode, level, low, high }) => {
    const r = estimateRig(referenceBoard(mode, level), demoPriceBook, v1);
    const laborLow = Number(r.laborLow);
    const laborHigh = Number(r.laborHigh);
    expect(laborLow).toBeGreaterThanOrEqual(low * 0.95);
    expect(laborHigh).toBeLessThanOrEqual(high * 1.05);
    expect(laborLow).toBeLessThanOrEqual(laborHigh);
    const expectedMid = (low + high) / 2;
    expect(Math.abs((laborLow + laborHigh) / 2 - expectedMid)).toBeLessThanOrEqual(expectedMid * 0.1);
  });

  it('takes 14 h in series (13 devices and the supply) and 20 h with ten loops', () => {
    expect(estimateRig(referenceBoard('serial', 'master'), demoPriceBook, v1).laborHours).toBe('14.00');
    // 3 devices before the switcher + the switcher + the supply at 1 h, 10 loop pedals at 1.5 h.
    expect(estimateRig(referenceBoard('switcher', 'master'), demoPriceBook, v1).laborHours).toBe('20.00');
  });
});

describe('trade facts per item (common practice, no published source)', () => {
  const serial = estimateRig(referenceBoard('serial', 'journeyman'), demoPriceBook, v1);
  const switcher = estimateRig(referenceBoard('switcher', 'journeyman'), demoPriceBook, v1);

  it('fasteners, mounts and zip ties: about $2 per pedal serial, $4 per pedal on a switcher board', () => {
    expect(line(serial, 'fasteners')).toMatchObject({ quantity: '13', unitPrice: '2.00', amount: '26.00' });
    // 13 pedals and the switcher itself are mounted.
    expect(line(switcher, 'fasteners')).toMatchObject({ quantity: '14', unitPrice: '4.00', amount: '56.00' });
  });

  it('hook-and-loop: about one foot, $5, per pedal', () => {
    expect(line(serial, 'hook_and_loop')).toMatchObject({ quantity: '13.00', unit: 'ft', unitPrice: '5.00', amount: '65.00' });
  });

  it('plugs about $4 each, two per patch cable; cable under $1 per foot with a spare allowance', () => {
    expect(line(serial, 'patch_plugs')).toMatchObject({ quantity: '24', unitPrice: '4.00', amount: '96.00' });
    expect(Number(line(serial, 'patch_cable').unitPrice)).toBeLessThan(1);
    // 12 patches × (1.5 ft + 0.5 ft spare) = 24 ft.
    expect(line(serial, 'patch_cable')).toMatchObject({ quantity: '24.00', amount: '19.20' });
  });

  it('about $1.25 of DC barrel plug per powered device, the switcher too', () => {
    expect(line(serial, 'dc_barrel_plugs')).toMatchObject({ quantity: '13', unitPrice: '1.25', amount: '16.25' });
    expect(line(switcher, 'dc_barrel_plugs')).toMatchObject({ quantity: '14', amount: '17.50' });
  });

  it('an hour per added function; wet/dry/wet counts as two', () => {
    const config: RigConfiguration = { ...referenceBoard('switcher', 'master'), functions: ['stereo_output', 'wet_dry_wet'] };
    const r = estimateRig(config, demoPriceBook, v1);
    expect(line(r, 'function_stereo_output').quantity).toBe('1.00');
    expect(line(r, 'function_wet_dry_wet').quantity).toBe('2.00');
    expect(r.laborHours).toBe('23.00');
    expect(r.checks!.complexity.functionCount).toBe(3);
  });

  it('explains each labor line at the level’s rates with the currency, in the shop’s locale', () => {
    const r = estimateRig(referenceBoard('switcher', 'master'), demoPriceBook, v1);
    // Master rates 100.00–150.00 an hour in the demo book. Expected words from ECMA-402
    // Intl.NumberFormat#formatRange as the runtime's CLDR data writes US dollars (en-US) and euros (de-DE).
    const usd = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' });
    const range = (usd as unknown as { formatRange(a: number, b: number): string }).formatRange(100, 150);
    expect(range).toContain('$100.00');
    for (const l of r.lines.filter((x) => x.kind === 'labor')) expect(l.explanation).toBe(`${l.basis}, at ${range} per hour`);
    const de = estimateRig(referenceBoard('switcher', 'master'), { ...demoPriceBook, currency: 'EUR' }, { ...v1, locale: 'de-DE' });
    const eur = (
      new Intl.NumberFormat('de-DE', { style: 'currency', currency: 'EUR' }) as unknown as { formatRange(a: number, b: number): string }
    ).formatRange(100, 150);
    expect(eur).toContain('€');
    expect(de.lines.find((x) => x.kind === 'labor')!.explanation).toMatch(new RegExp(`, at ${eur.replace(/[.$]/g, '\\$&')} per hour$`));
  });

  it('a soft bag is allowed but flagged as not recommended for a loaded board', () => {
    const r = estimateRig({ ...referenceBoard('serial', 'master'), caseId: 'gig-bag' }, demoPriceBook, v1);
    expect(r.notes.some((n) => n.includes('not recommended'))).toBe(true);
  });

  it('switcher loops and functions raise the minimum builder level', () => {
    expect(serial.minimumLevel).toBe('apprentice');
    expect(switcher.minimumLevel).toBe('master');
    const fewLoops = referenceBoard('switcher', 'apprentice');
    fewLoops.pedals = fewLoops.pedals!.map((p, i) => ({ ...p, inLoop: i >= 11 }));
    const r = estimateRig(fewLoops, demoPriceBook, v1);
    expect(r.minimumLevel).toBe('journeyman');
    expect(r.notes.some((n) => n.includes('at least a Journeyman'))).toBe(true);
  });
});

describe('deposit rounding to the minor unit (ISO 4217 with the payment provider’s charge rules)', () => {
  // Published references: ISO 4217 minor units (USD 2, JPY 0, BHD 3), and the payment provider's
  // "Three-decimal currencies" rule (docs.stripe.com/currencies): BHD charges end in 0, so the
  // product counts BHD in hundredths. The full tables are checked in money/minor-units.spec.ts.
  it('reads the minor unit from ISO 4217 and the provider’s tables', () => {
    expect(minorUnitDigits('USD')).toBe(2);
    expect(minorUnitDigits('JPY')).toBe(0);
    expect(minorUnitDigits('BHD')).toBe(2);
    expect(minorUnitDigits('XYZ')).toBeUndefined();
  });

  it('rounds half up to 2, 0 and (for a three-decimal currency) 2 decimals', () => {
    expect(roundToMinorUnit('1234.565', 'USD').toFixed()).toBe('1234.57');
    expect(roundToMinorUnit('1234.5', 'JPY').toFixed()).toBe('1235');
    expect(roundToMinorUnit('12.3450', 'BHD').toFixed()).toBe('12.35');
    expect(roundToMinorUnit('12.3449', 'BHD').toFixed()).toBe('12.34');
  });

  // A one-pedal serial board at apprentice rates, worked by hand: materials 185 + 255 + 2 + 5 +
  // 1.25 = 448.25; labor 2 h (the pedal and the supply) × 40–50 = 80–100; high end 548.25.
  // A 33% deposit is 180.9225 before rounding (in yen, whose lines round first, 548 × 0.33 = 180.84).
  // BHD and KWD are counted in hundredths (the provider's three-decimal rule: the last digit is 0);
  // HUF in whole forints (the provider's special case), so its 1.25 plug line is 1 and the total 548.
  const onePedal = countedBoard(1, 'apprentice', 'slate-46');
  const bookIn = (currency: string): PriceBook => ({
    ...demoPriceBook,
    currency,
    depositPolicy: { ...demoPriceBook.depositPolicy, percent: '33', minimum: '10' },
  });
  it.each([
    ['USD', '548.25', '180.92'],
    ['JPY', '548', '181'],
    ['BHD', '548.25', '180.92'],
    ['KWD', '548.25', '180.92'],
    ['HUF', '548', '181'],
    ['IDR', '548.25', '180.92'],
  ])('%s: total %s, deposit %s', (currency, totalHigh, deposit) => {
    const r = estimateRig(onePedal, bookIn(currency), v1);
    expect(r.totalHigh).toBe(totalHigh);
    expect(r.deposit).toBe(deposit);
  });

  it('never takes less than the policy minimum, nor more than the low end of the estimate', () => {
    const r = estimateRig(onePedal, demoPriceBook, v1);
    // 25% of 548.25 is 137.06, above the $100 minimum.
    expect(r.deposit).toBe('137.06');
    const steep = estimateRig(onePedal, { ...demoPriceBook, depositPolicy: { ...demoPriceBook.depositPolicy, minimum: '1000.00' } }, v1);
    expect(steep.deposit).toBe(steep.totalLow);
    const floor = estimateRig(onePedal, { ...demoPriceBook, depositPolicy: { ...demoPriceBook.depositPolicy, percent: '5' } }, v1);
    expect(floor.deposit).toBe('100.00');
  });

  it('depositFor gives the same deposit from strings or Decimals, and refuses a currency ISO 4217 does not list', () => {
    // 25% of 548.25 is 137.0625, rounded half up to the cent; 25% of 300 is 75, so the $100 minimum.
    expect(depositFor('548.25', '498.25', demoPriceBook).toFixed()).toBe('137.06');
    expect(depositFor(new Decimal('300'), new Decimal('280'), demoPriceBook).toFixed()).toBe('100');
    // A minimum above the low end gives the low end.
    expect(depositFor('90.00', '80.50', demoPriceBook).toFixed()).toBe('80.5');
    expect(depositFor('548', '498', demoPriceBook, 'JPY').toFixed()).toBe('137');
    expect(() => depositFor('548.25', '498.25', demoPriceBook, 'ZZZ')).toThrow(/Unknown ISO 4217 currency ZZZ/);
  });
});

describe('ids the price book does not hold', () => {
  it.each([
    ['surfaceId', { surfaceId: 'plank' }],
    ['caseId', { caseId: 'crate' }],
    ['functions[1]', { functions: ['stereo_output', 'fog_machine'] }],
  ])('names %s', (field, patch) => {
    const config = { ...referenceBoard('serial', 'master'), ...patch } as RigConfiguration;
    expect(() => estimateRig(config, demoPriceBook, v1)).toThrow(EstimateInputError);
    try {
      estimateRig(config, demoPriceBook, v1);
    } catch (e) {
      expect((e as EstimateInputError).field).toBe(field);
    }
  });
});

describe('properties (fast-check)', () => {
  const plainKinds = pedalKinds.filter((k) => k !== 'switcher');
  const pedal = (allowLoop: boolean) =>
    fc.record({
      name: fc.constantFrom('fuzz', 'overdrive', 'chorus', 'analog delay', 'reverb', 'tuner', 'wah'),
      kind: fc.option(fc.constantFrom(...plainKinds), { nil: undefined }),
      powered: fc.boolean(),
      inLoop: allowLoop ? fc.boolean() : fc.constant(false),
      currentMa: fc.option(fc.integer({ min: 0, max: 600 }), { nil: undefined }),
    }) as fc.Arbitrary<PedalInput>;
  const config = fc
    .record({
      surfaceId: fc.constantFrom(...demoPriceBook.surfaces.map((s) => s.id)),
      caseId: fc.constantFrom(...demoPriceBook.cases.map((c) => c.id)),
      mode: fc.constantFrom('serial' as const, 'switcher' as const),
      functions: fc.subarray(demoPriceBook.functions.map((f) => f.code)),
      level: fc.constantFrom(...builderLevels),
      pedals: fc.array(pedal(true), { minLength: 1, maxLength: 24 }),
    })
    .map(({ mode, pedals, ...rest }): RigConfiguration => ({
      ...rest,
      routing: { mode },
      pedals: mode === 'serial' ? pedals.map((p) => ({ ...p, inLoop: false })) : pedals,
    }));
  const totals = ['materialsTotal', 'laborLow', 'laborHigh', 'totalLow', 'totalHigh', 'deposit', 'laborHours'] as const;

  it('adding a pedal anywhere never lowers any total', () => {
    fc.assert(
      fc.property(config, pedal(true), fc.nat(), (c, extra, at) => {
        const added = { ...extra, inLoop: c.routing.mode === 'switcher' && extra.inLoop };
        const pedals = [...c.pedals!];
        pedals.splice(at % (pedals.length + 1), 0, added);
        const before = estimateRig(c, demoPriceBook, v1);
        const after = estimateRig({ ...c, pedals }, demoPriceBook, v1);
        for (const key of totals) expect(new Decimal(after[key]).gte(before[key])).toBe(true);
      }),
      { numRuns: 300 },
    );
  });

  it('a switcher board never costs less labor than the same pedals in series', () => {
    fc.assert(
      fc.property(config, (c) => {
        const switched = estimateRig({ ...c, routing: { mode: 'switcher' } }, demoPriceBook, v1);
        const serial = estimateRig(
          { ...c, routing: { mode: 'serial' }, pedals: c.pedals!.map((p) => ({ ...p, inLoop: false })) },
          demoPriceBook,
          v1,
        );
        for (const key of ['laborHours', 'laborLow', 'laborHigh'] as const) {
          expect(new Decimal(switched[key]).gte(serial[key])).toBe(true);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('totalLow ≤ totalHigh, and the lines add up to the totals to the cent', () => {
    fc.assert(
      fc.property(config, (c) => {
        const r = estimateRig(c, demoPriceBook, v1);
        expect(new Decimal(r.totalLow).lte(r.totalHigh)).toBe(true);
        const materials = r.lines.filter((l) => l.kind === 'materials').reduce((s, l) => s.plus(l.amount), new Decimal(0));
        const laborLow = r.lines.filter((l) => l.kind === 'labor').reduce((s, l) => s.plus(l.amount), new Decimal(0));
        const laborHigh = r.lines.filter((l) => l.kind === 'labor').reduce((s, l) => s.plus(l.amountHigh!), new Decimal(0));
        expect(materials.toFixed(2)).toBe(r.materialsTotal);
        expect(laborLow.toFixed(2)).toBe(r.laborLow);
        expect(laborHigh.toFixed(2)).toBe(r.laborHigh);
        expect(materials.plus(laborLow).toFixed(2)).toBe(r.totalLow);
        expect(materials.plus(laborHigh).toFixed(2)).toBe(r.totalHigh);
        // Each line is its quantity × unit price, rounded to the cent.
        for (const l of r.lines) expect(new Decimal(l.quantity).times(l.unitPrice).toFixed(2)).toBe(l.amount);
      }),
      { numRuns: 300 },
    );
  });
});
