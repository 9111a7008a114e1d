import { demoPriceBook, type Catalog, type RigConfiguration } from '@loomwright/shared';
import { describe, expect, it } from 'vitest';
import { extraEffect, levelTotals, localEstimate } from './level-compare';

const catalog: Catalog = { ...demoPriceBook, priceBookVersion: 1, publishedAt: '2026-12-01T00:00:00.000Z' };
const rig = (functions: string[], level: RigConfiguration['level']): RigConfiguration => ({
  surfaceId: 'slate-61',
  caseId: 'shell-hard',
  routing: { mode: 'serial' },
  pedalCount: 8,
  functions,
  level,
});

// Three functions on one board is master's work (common practice, no published source); the
// demo book's journeyman rate is $80–$100 an hour and master's $100–$150.
describe('level changes from extras', () => {
  it('says a third extra raises the minimum to master, with the whole price difference at the higher rate', () => {
    const now = localEstimate(rig(['stereo_output', 'tuner_out'], 'journeyman'), catalog)!;
    expect(now.minimumLevel).toBe('journeyman');
    const effect = extraEffect(rig(['stereo_output', 'tuner_out'], 'journeyman'), 'jack_panel', catalog, now)!;
    expect(effect).toMatchObject({ raises: true, minimumAfter: 'master', levelAfter: 'master' });
    const after = localEstimate(rig(['stereo_output', 'tuner_out', 'jack_panel'], 'master'), catalog)!;
    // Worked by hand: 11 h before (8 pedals, the supply, 2 functions at 1 h) at $80–$100 is
    // $880–$1,100; 12 h after at $100–$150 is $1,200–$1,800; the jack panel's 2 patch cables add
    // 2 × (2 ft × $0.80 + 2 plugs × $4) = $19.20. So +$339.20 to +$719.20.
    expect(now.laborHours).toBe('11.00');
    expect(after.laborHours).toBe('12.00');
    expect(effect.deltaLow).toBe('339.2');
    expect(effect.deltaHigh).toBe('719.2');
  });

  it('says removing it lowers the minimum again', () => {
    const config = rig(['stereo_output', 'tuner_out', 'jack_panel'], 'master');
    const now = localEstimate(config, catalog)!;
    expect(now.minimumLevel).toBe('master');
    const effect = extraEffect(config, 'jack_panel', catalog, now)!;
    expect(effect).toMatchObject({ lowers: true, minimumAfter: 'journeyman', levelAfter: 'master' });
  });

  it('prices the rig at each of the three levels, each total the rate range times the same hours plus the same materials', () => {
    const totals = levelTotals(rig([], 'apprentice'), catalog);
    expect(totals.map((t) => t.level)).toEqual(['apprentice', 'journeyman', 'master']);
    const materials = totals.map((t) => t.estimate!.materialsTotal);
    expect(new Set(materials).size).toBe(1);
    // 9 h (8 pedals and the supply, 1 h each): $40–$50, $80–$100, $100–$150 an hour.
    expect(totals.map((t) => [Number(t.estimate!.laborLow), Number(t.estimate!.laborHigh)])).toEqual([
      [360, 450],
      [720, 900],
      [900, 1350],
    ]);
  });
});
