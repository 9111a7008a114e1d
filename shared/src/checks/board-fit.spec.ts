import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { demoPriceBook } from '../price-book/demo-price-book';
import type { SurfaceItem } from '../price-book/types';
import type { PedalInput, RigConfiguration } from '../estimate/types';
import { estimateRig } from '../estimate/estimate-rig';
import { referenceBoard } from '../estimate/reference-rigs.fixture';
import { boardFitOf, SPACING_MM } from './board-fit';
import { signalChainOf } from './signal-chain';

const surface = (id: string, widthMm: number, depthMm: number): SurfaceItem => ({
  id,
  name: id,
  description: '',
  widthMm,
  depthMm,
  price: '100.00',
  custom: false,
});
const square = (name: string): PedalInput => ({ name, powered: true, inLoop: false, widthMm: 100, depthMm: 100 });
const fourSquares: RigConfiguration = { ...referenceBoard('serial', 'master'), pedals: ['a', 'b', 'c', 'd'].map(square) };

describe('board fit', () => {
  // Exact bound, worked by hand: four 100 × 100 mm pedals with 15 mm spacing need 4 × 115² =
  // 52,900 mm². A 230 × 230 surface is exactly that (and holds them in two rows of two); one
  // millimetre narrower is below the bound, so nothing can fit.
  it('fits exactly at the area bound and fails one millimetre under it', () => {
    expect(SPACING_MM).toBe(15);
    const chain = signalChainOf(fourSquares);
    const exact = boardFitOf(chain, surface('exact', 230, 230), []);
    expect(exact).toMatchObject({
      requiredAreaMm2: 52900,
      usableAreaMm2: 52900,
      fillRatio: 1,
      areaFits: true,
      layoutFits: true,
      status: 'ok',
    });
    // In signal order, right to left along the back row, then the next row forward (rows counted
    // from the front): a at the back right, b back left, c front right, d front left; 15 mm
    // between neighbours and none at the rim, so the right-hand pedals sit flush with it.
    expect(exact.layout.map((l) => [l.device, l.number, l.row, l.x, l.y])).toEqual([
      ['a', 1, 1, 130, 0],
      ['b', 2, 1, 15, 0],
      ['c', 3, 0, 130, 115],
      ['d', 4, 0, 15, 115],
    ]);
    expect(exact.layoutKind).toBe('signal');
    const short = boardFitOf(chain, surface('short', 229, 230), [
      surface('short', 229, 230),
      surface('exact', 230, 230),
      surface('big', 500, 500),
    ]);
    expect(short).toMatchObject({
      requiredAreaMm2: 52900,
      usableAreaMm2: 52670,
      areaFits: false,
      layoutFits: false,
      status: 'problem',
      smallestFittingSurfaceId: 'exact',
    });
  });

  it('tells the player the reference board does not fit the smallest surface, and names one that does', () => {
    const r = estimateRig({ ...referenceBoard('serial', 'master'), surfaceId: 'slate-46' }, demoPriceBook, { version: 1 });
    const fit = r.checks!.boardFit;
    // Wah 115 × 275, buffer 115 × 75, tuner and ten compacts 11 × 85 × 140 (typical sizes from
    // memory, plus spacing) = 171,150 mm², more than the 460 × 310 = 142,600 mm² surface.
    expect(fit).toMatchObject({
      requiredAreaMm2: 171150,
      usableAreaMm2: 142600,
      areaFits: false,
      status: 'problem',
      smallestFittingSurfaceId: 'ridge-81',
    });
    expect(r.notes.some((n) => n.includes('more than the Slate 46'))).toBe(true);
    expect(r.notes.some((n) => n.includes('Ridge 81'))).toBe(true);
  });

  it('keeps every placement inside the surface without overlaps', () => {
    const fit = estimateRig(referenceBoard('switcher', 'master'), demoPriceBook, { version: 1 }).checks!.boardFit;
    expect(fit.layoutFits).toBe(true);
    for (const a of fit.layout) {
      expect(a.x).toBeGreaterThanOrEqual(0);
      expect(a.y).toBeGreaterThanOrEqual(0);
      expect(a.x + a.widthMm).toBeLessThanOrEqual(fit.usableWidthMm);
      expect(a.y + a.depthMm).toBeLessThanOrEqual(fit.usableDepthMm);
      for (const b of fit.layout) {
        if (a === b) continue;
        const apart = a.x + a.widthMm <= b.x || b.x + b.widthMm <= a.x || a.y + a.depthMm <= b.y || b.y + b.depthMm <= a.y;
        expect(apart).toBe(true);
      }
    }
  });
});

// The layout rules below are common practice in the trade, no published source: the signal runs
// from the input at the right to the output at the left as the player stands at the board; the
// switcher and treadles sit in the front row on a tiered board whose description says so.
describe('layout in signal order', () => {
  const tiered = demoPriceBook.surfaces.find((s) => s.id === 'ridge-81')!;
  const switcherRig: RigConfiguration = {
    ...referenceBoard('switcher', 'master'),
    surfaceId: 'ridge-81',
    pedals: [
      { name: 'Tuner', kind: 'tuner', powered: true, inLoop: false },
      { name: 'Wah', kind: 'treadle', powered: true, inLoop: false },
      ...['Fuzz', 'Drive', 'Chorus', 'Delay'].map((name) => ({ name, kind: 'compact' as const, powered: true, inLoop: true })),
    ],
  };

  it('puts the switcher and the wah in the front row of a tiered board that says so, the rest behind in signal order, input at the right', () => {
    expect(tiered.layout).toMatchObject({ tiered: true, switcherRow: 'front' });
    const chain = signalChainOf(switcherRig);
    const fit = boardFitOf(chain, tiered, demoPriceBook.surfaces);
    expect(fit.layoutKind).toBe('signal');
    const at = (name: string) => fit.layout.find((p) => p.device === name)!;
    expect(at('Loop switcher').row).toBe(0);
    expect(at('Wah').row).toBe(0);
    expect(at('Loop switcher').group).toBe('front');
    for (const name of ['Tuner', 'Fuzz', 'Drive', 'Chorus', 'Delay']) expect(at(name).row).toBeGreaterThan(0);
    // Signal order right to left: each later pedal in the back row sits further left.
    const back = fit.layout.filter((p) => p.row > 0).sort((a, b) => a.number - b.number);
    for (let i = 1; i < back.length; i++) expect(back[i].x).toBeLessThan(back[i - 1].x);
  });

  it('numbers the drawing as the signal meets the pedals, the loops right after the switcher, and the cable list uses the same numbers', () => {
    const r = estimateRig(switcherRig, demoPriceBook, { version: 1 });
    const { boardFit, signalChain, cableSchedule } = r.checks!;
    const numberOf = Object.fromEntries(signalChain.devices.map((d) => [d.name, d.number]));
    // Guitar → tuner → wah → switcher → loops 1–4 (fuzz, drive, chorus, delay).
    expect(numberOf).toEqual({ Tuner: 1, Wah: 2, 'Loop switcher': 3, Fuzz: 4, Drive: 5, Chorus: 6, Delay: 7 });
    for (const p of boardFit.layout) expect(p.number).toBe(numberOf[p.device]);
    const send = cableSchedule.patches.find((c) => c.purpose === 'loop_send' && c.to.startsWith('Chorus'))!;
    expect([send.fromDevice, send.toDevice]).toEqual([3, 6]);
  });

  it('puts the switcher at the back where the surface says so', () => {
    const backSwitcher: SurfaceItem = { ...tiered, layout: { rows: 2, tiered: true, switcherRow: 'back' } };
    const fit = boardFitOf(signalChainOf(switcherRig), backSwitcher, []);
    const rows = Math.max(...fit.layout.map((p) => p.row));
    expect(fit.layout.find((p) => p.device === 'Loop switcher')!.row).toBe(rows);
    expect(fit.layout.find((p) => p.device === 'Wah')!.row).toBe(0);
  });

  it('never uses more tiers than a tiered board has: too many pedals for its tiers are packed instead, and said so', () => {
    const many: RigConfiguration = {
      ...switcherRig,
      pedals: [
        ...switcherRig.pedals!,
        ...Array.from({ length: 8 }, (_, i) => ({ name: `Extra ${i + 1}`, kind: 'compact' as const, powered: true, inLoop: true })),
      ],
    };
    const fit = boardFitOf(signalChainOf(many), tiered, []);
    expect(fit.layoutKind).toBe('packed');
    expect(fit.warnings.some((w) => w.includes('signal order'))).toBe(true);
  });
});

describe('the smallest-surface search (fast-check)', () => {
  // An internal agreement, not an outside check: the search asks each smaller surface only whether
  // the pedals fit (no drawing, stopping at the first one left over); that answer must be the one
  // the full layout gives when the player picks that surface.
  const layoutArb = fc.option(
    fc.record({
      rows: fc.integer({ min: 1, max: 4 }),
      tiered: fc.boolean(),
      switcherRow: fc.constantFrom('front' as const, 'back' as const),
    }),
    { nil: undefined },
  );
  const surfaceArb = fc.record({
    widthMm: fc.integer({ min: 150, max: 1200 }),
    depthMm: fc.integer({ min: 100, max: 600 }),
    price: fc.integer({ min: 50, max: 600 }).map(String),
    layout: layoutArb,
  });
  const pedalArb = fc.record({
    name: fc.constantFrom('fuzz', 'wah', 'delay', 'tuner', 'looper'),
    kind: fc.constantFrom('mini', 'compact', 'large', 'large_digital', 'tuner', 'treadle', 'buffer', 'other' as const),
    powered: fc.constant(true),
    inLoop: fc.boolean(),
    size: fc.option(fc.tuple(fc.double({ min: 30, max: 400, noNaN: true }), fc.double({ min: 40, max: 300, noNaN: true })), {
      nil: undefined,
    }),
  });

  it('names the first surface, smallest first, whose own layout holds the pedals', () => {
    fc.assert(
      fc.property(
        fc.array(surfaceArb, { minLength: 1, maxLength: 6 }),
        fc.array(pedalArb, { minLength: 1, maxLength: 24 }),
        fc.constantFrom('serial' as const, 'switcher' as const),
        (drawn, drawnPedals, mode) => {
          const surfaces: SurfaceItem[] = drawn.map((s, i) => ({ id: `s${i}`, name: `s${i}`, description: '', custom: false, ...s }));
          const pedals: PedalInput[] = drawnPedals.map(({ size, ...p }) => ({
            ...p,
            inLoop: mode === 'switcher' && p.inLoop,
            ...(size ? { widthMm: size[0], depthMm: size[1] } : {}),
          }));
          const chain = signalChainOf({ ...fourSquares, routing: { mode }, pedals });
          const sized = [...surfaces].sort((a, b) => a.widthMm * a.depthMm - b.widthMm * b.depthMm || Number(a.price) - Number(b.price));
          const expected = sized.find((s) => boardFitOf(chain, s, [s]).layoutFits)?.id ?? null;
          for (const chosen of surfaces) expect(boardFitOf(chain, chosen, surfaces).smallestFittingSurfaceId).toBe(expected);
        },
      ),
      { numRuns: 300 },
    );
  });
});
