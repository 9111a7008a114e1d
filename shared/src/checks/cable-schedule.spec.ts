import { describe, expect, it } from 'vitest';
import { demoPriceBook } from '../price-book/demo-price-book';
import type { PedalInput, RigConfiguration } from '../estimate/types';
import { referenceBoard } from '../estimate/reference-rigs.fixture';
import { cableScheduleOf } from './cable-schedule';
import { signalChainOf } from './signal-chain';

const rates = demoPriceBook.materials;
const fn = (code: string) => demoPriceBook.functions.find((f) => f.code === code)!;
const p = (name: string, inLoop = false, powered = true): PedalInput => ({ name, powered, inLoop });
const schedule = (config: RigConfiguration, functions: string[] = []) => cableScheduleOf(signalChainOf(config), functions.map(fn), rates);

// Hand-worked examples (common practice, no published source): the player's own instrument and
// amp cables reach the two ends of the board, so n devices in series take n − 1 patches; a loop
// takes a send and a return; every patch has two plugs.
describe('cable schedule', () => {
  it('serial: tuner → fuzz → delay is 2 patches, 4 plugs, 4 ft with spare', () => {
    const s = schedule({ ...referenceBoard('serial', 'master'), pedals: [p('tuner'), p('fuzz'), p('delay')] });
    expect(s.patches.map((c) => `${c.from} → ${c.to}`)).toEqual(['tuner output → fuzz input', 'fuzz output → delay input']);
    expect(s).toMatchObject({ patchCount: 2, plugCount: 4, cableFeet: '4.00', spareFeet: '1.00', barrelPlugCount: 3 });
  });

  it('serial reference board: 13 devices, 12 patches, 24 plugs', () => {
    expect(schedule(referenceBoard('serial', 'master'))).toMatchObject({ patchCount: 12, plugCount: 24, cableFeet: '24.00' });
  });

  it('switcher reference board: 3 chain patches up to the switcher and 2 × 10 loop patches', () => {
    const s = schedule(referenceBoard('switcher', 'master'));
    // buffer → tuner, tuner → wah, wah → switcher input; then send and return for each loop.
    expect(s.patches.filter((c) => c.purpose === 'chain')).toHaveLength(3);
    expect(s.patches.filter((c) => c.purpose === 'loop_send')).toHaveLength(10);
    expect(s.patches.filter((c) => c.purpose === 'loop_return')).toHaveLength(10);
    expect(s).toMatchObject({ patchCount: 23, plugCount: 46, cableFeet: '46.00', barrelPlugCount: 14 });
    expect(s.patches[3]).toMatchObject({ from: 'Loop switcher loop 1 send', to: 'fuzz input' });
    expect(s.patches[4]).toMatchObject({ from: 'fuzz output', to: 'Loop switcher loop 1 return' });
  });

  it('switcher with a pedal after it: tuner → switcher → volume, two loops: 2 + 4 patches', () => {
    const s = schedule({
      ...referenceBoard('switcher', 'master'),
      pedals: [p('tuner'), p('fuzz', true), p('delay', true), p('volume', false, false)],
    });
    expect(s.patches.filter((c) => c.purpose === 'chain').map((c) => `${c.from} → ${c.to}`)).toEqual([
      'tuner output → Loop switcher input',
      'Loop switcher output → volume input',
    ]);
    // The unpowered volume pedal takes no barrel plug; tuner, two loop pedals and the switcher do.
    expect(s).toMatchObject({ patchCount: 6, plugCount: 12, barrelPlugCount: 4 });
  });

  it('functions add their patches: stereo output 1, wet/dry/wet 3', () => {
    const s = schedule({ ...referenceBoard('serial', 'master'), pedals: [p('fuzz'), p('reverb')] }, ['stereo_output', 'wet_dry_wet']);
    expect(s).toMatchObject({ patchCount: 5, plugCount: 10 });
  });
});
