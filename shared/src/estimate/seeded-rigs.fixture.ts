import { builderLevels } from '../domain';
import { demoPriceBook } from '../price-book/demo-price-book';
import type { PriceBook } from '../price-book/types';
import { parseRigConfiguration, pedalKinds } from './schema';
import type { PedalInput, PowerOutputInput, RigConfiguration } from './types';

/**
 * A broad, repeatable set of rig configurations for pinning the engine's answers: every one comes
 * from a small seeded generator (mulberry32), so the same seed gives the same configurations on
 * any machine, and each passes the API's own input schema before it is priced.
 */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * Price books the configurations are priced against: the demo book, and invented variants that
 * reach the engine's other paths (a whole-unit currency, odd figures that round, no surface
 * layouts and no power rules, cases that fit only some surfaces, a book without apprentice rates).
 */
export const pinBooks: Record<string, PriceBook> = {
  demo: demoPriceBook,
  yen: {
    ...demoPriceBook,
    currency: 'JPY',
    surfaces: demoPriceBook.surfaces.map((s, i) => ({ ...s, price: String(18_500 + i * 2_345) })),
    cases: demoPriceBook.cases.map((c, i) => ({ ...c, price: String(9_500 + i * 6_001) })),
    materials: {
      fastenersPerPedalSerial: '210',
      fastenersPerPedalSwitcher: '415',
      hookAndLoopFeetPerPedal: '1.25',
      hookAndLoopPricePerFoot: '333',
      cablePricePerFoot: '87.5',
      plugPrice: '405',
      patchLengthFeet: '1.5',
      spareFeetPerPatch: '0.25',
      barrelPlugPrice: '133.3',
    },
    levels: demoPriceBook.levels.map((l, i) => ({ ...l, rateLow: String(4_250 + i * 3_333), rateHigh: String(5_500 + i * 4_999) })),
    depositPolicy: { ...demoPriceBook.depositPolicy, percent: '33.3', minimum: '10000' },
  },
  odd: {
    ...demoPriceBook,
    currency: 'EUR',
    surfaces: demoPriceBook.surfaces.map(({ layout: _layout, ...s }, i) => ({ ...s, price: (180.125 + i * 17.333).toFixed(3) })),
    cases: demoPriceBook.cases.map((c, i) => ({
      ...c,
      price: (99.995 + i * 50.005).toFixed(3),
      fitsSurfaceIds: i === 1 ? ['ridge-81', 'ridge-100'] : [],
    })),
    materials: {
      fastenersPerPedalSerial: '1.995',
      fastenersPerPedalSwitcher: '3.335',
      hookAndLoopFeetPerPedal: '0.75',
      hookAndLoopPricePerFoot: '4.99',
      cablePricePerFoot: '0.765',
      plugPrice: '3.895',
      patchLengthFeet: '1.75',
      spareFeetPerPatch: '0.4',
      barrelPlugPrice: '1.125',
    },
    labor: { hoursPerDeviceSerial: '0.75', hoursPerDeviceSwitcher: '1.25' },
    levels: demoPriceBook.levels.filter((l) => l.code !== 'apprentice').map((l) => ({ ...l, rateLow: '72.50', rateHigh: '97.125' })),
    power: undefined,
    depositPolicy: { ...demoPriceBook.depositPolicy, percent: '12.5', minimum: '75.00' },
  },
};

const names = [
  'fuzz',
  'overdrive',
  'compressor',
  'chorus',
  'phaser',
  'analog delay',
  'digital delay',
  'reverb',
  'tuner',
  'wah',
  'volume',
  'expression',
  'octave',
  'mini drive',
  'input buffer',
  'looper',
];
const locales = [undefined, 'en-US', 'de-DE'];

export interface SeededRig {
  bookName: string;
  config: RigConfiguration;
  meta: { version: number; locale?: string };
}

/** `count` schema-valid configurations from `seed`; about one in thirty names an id the book lacks. */
export function seededRigs(count: number, seed: number): SeededRig[] {
  const random = mulberry32(seed);
  const chance = (p: number) => random() < p;
  const int = (lo: number, hi: number) => lo + Math.floor(random() * (hi - lo + 1));
  const pick = <T>(items: readonly T[]): T => items[Math.floor(random() * items.length)];
  const out: SeededRig[] = [];
  while (out.length < count) {
    const bookName = pick(['demo', 'demo', 'demo', 'yen', 'odd']);
    const book = pinBooks[bookName];
    const mode = chance(0.5) ? 'serial' : 'switcher';
    const outputs: PowerOutputInput[] | undefined = chance(0.6)
      ? Array.from({ length: int(1, 12) }, (_, i) => ({
          ...(chance(0.3) ? { label: `Out ${String.fromCharCode(65 + i)}` } : {}),
          voltage: pick([9, 9, 9, 9, 12, 18, 24]),
          currentMa: pick([100, 100, 250, 250, 500, 1000]),
          isolated: chance(0.75),
          ...(chance(0.08) ? { supply: pick(['dc', 'ac'] as const) } : {}),
          ...(chance(0.08) ? { polarity: pick(['center_negative', 'center_positive'] as const) } : {}),
        }))
      : undefined;
    const outputCount = outputs?.length ?? 0;
    const pedal = (): PedalInput => {
      const sized = chance(0.4);
      return {
        name: pick(names),
        ...(chance(0.8) ? { kind: pick(pedalKinds.filter((k) => k !== 'switcher')) } : {}),
        powered: chance(0.9),
        inLoop: mode === 'switcher' && chance(0.7),
        ...(chance(0.6) ? { currentMa: pick([0, 10, 25, 50, 85, 100, 150, 250, 300, 500]) } : {}),
        ...(chance(0.15) ? { voltage: pick([9, 12, 18, 24]) } : {}),
        ...(chance(0.05) ? { polarity: pick(['center_negative', 'center_positive'] as const) } : {}),
        ...(chance(0.04) ? { supply: 'ac' as const } : {}),
        ...(sized ? { widthMm: int(40, 320), depthMm: int(60, 280) } : {}),
        ...(chance(0.1) ? { digital: chance(0.5) } : {}),
        ...(outputCount > 0 && chance(0.15) ? { powerOutput: int(0, outputCount - 1) } : {}),
      };
    };
    const quick = mode === 'serial' && chance(0.12);
    const pedals = quick ? undefined : Array.from({ length: int(1, chance(0.1) ? 40 : 18) }, pedal);
    if (pedals && mode === 'switcher' && chance(0.25)) {
      pedals.splice(int(0, pedals.length), 0, {
        name: 'Loop switcher',
        kind: 'switcher',
        powered: true,
        inLoop: false,
        ...(chance(0.5) ? { currentMa: pick([150, 300, 500]) } : {}),
      });
    }
    const ownSwitcher =
      mode === 'switcher' && chance(0.3)
        ? {
            ...(chance(0.5) ? { name: 'Eight-loop switcher' } : {}),
            ...(chance(0.5) ? { currentMa: pick([120, 250, 400]) } : {}),
            ...(chance(0.2) ? { voltage: pick([9, 12]) } : {}),
            ...(chance(0.3) ? { widthMm: int(200, 480), depthMm: int(80, 140) } : {}),
            ...(outputCount > 0 && chance(0.2) ? { powerOutput: int(0, outputCount - 1) } : {}),
          }
        : undefined;
    const raw = {
      surfaceId: chance(0.01) ? 'no-such-surface' : pick(book.surfaces).id,
      caseId: chance(0.01) ? 'no-such-case' : pick(book.cases).id,
      routing: { mode, ...(ownSwitcher ? { switcher: ownSwitcher } : {}) },
      ...(pedals ? { pedals } : { pedalCount: int(1, 24) }),
      functions: [...book.functions.filter(() => chance(0.12)).map((f) => f.code), ...(chance(0.01) ? ['no_such_extra'] : [])],
      level: pick(builderLevels),
      ...(outputs ? { powerSupply: { outputs } } : {}),
    };
    const parsed = parseRigConfiguration(raw);
    if (!parsed.success) continue;
    const locale = pick(locales);
    out.push({ bookName, config: parsed.data, meta: { version: int(1, 40), ...(locale ? { locale } : {}) } });
  }
  return out;
}
