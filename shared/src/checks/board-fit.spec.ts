import { describe, expect, it } from 'vitest';
import { demoPriceBook } from '../price-book/demo-price-book';
import type { SurfaceItem } from '../price-book/types';
import type { PedalInput, RigConfiguration } from '../estimate/types';
import { estimateRig } from '../estimate/estimate-rig';
import { referenceBoard } from '../estimate/reference-rigs.fixture';
import { boardFitOf, SPACING_MM } from './board-fit';
import { signalChainOf } from './signal-chain';

const surface = (id: string, widthMm: number, depthMm: number): SurfaceItem => ({ id, name: id, description: '', widthMm, depthMm, price: '100.00', custom: false });
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
    expect(exact).toMatchObject({ requiredAreaMm2: 52900, usableAreaMm2: 52900, fillRatio: 1, areaFits: true, layoutFits: true, status: 'ok' });
    expect(exact.layout.map((l) => [l.row, l.x, l.y])).toEqual([
      [0, 7.5, 122.5],
      [0, 122.5, 122.5],
      [1, 7.5, 7.5],
      [1, 122.5, 7.5],
    ]);
    const short = boardFitOf(chain, surface('short', 229, 230), [surface('short', 229, 230), surface('exact', 230, 230), surface('big', 500, 500)]);
    expect(short).toMatchObject({ requiredAreaMm2: 52900, usableAreaMm2: 52670, areaFits: false, layoutFits: false, status: 'problem', smallestFittingSurfaceId: 'exact' });
  });

  it('tells the player the reference board does not fit the smallest surface, and names one that does', () => {
    const r = estimateRig({ ...referenceBoard('serial', 'master'), surfaceId: 'slate-46' }, demoPriceBook, { version: 1 });
    const fit = r.checks!.boardFit;
    // Wah 115 × 275, buffer 115 × 75, tuner and ten compacts 11 × 85 × 140 (typical sizes from
    // memory, plus spacing) = 171,150 mm², more than the 460 × 310 = 142,600 mm² surface.
    expect(fit).toMatchObject({ requiredAreaMm2: 171150, usableAreaMm2: 142600, areaFits: false, status: 'problem', smallestFittingSurfaceId: 'ridge-81' });
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
