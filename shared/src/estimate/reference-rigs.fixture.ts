import type { BuilderLevel } from '../domain';
import type { PedalInput, RigConfiguration } from './types';

/**
 * A full board for checking labor figures: an input/output buffer box, a tuner, a wah and ten
 * more pedals, the customer supplying the power supply (common practice, no published source).
 * On the switcher version the ten pedals after the wah sit in ten loops.
 */
export function referenceBoard(mode: 'serial' | 'switcher', level: BuilderLevel): RigConfiguration {
  const pedals: PedalInput[] = [
    { name: 'Input/output buffer', kind: 'buffer', powered: true, inLoop: false },
    { name: 'Tuner', kind: 'tuner', powered: true, inLoop: false },
    { name: 'Wah', kind: 'treadle', powered: true, inLoop: false },
    ...['fuzz', 'overdrive', 'distortion', 'compressor', 'chorus', 'phaser', 'tremolo', 'analog delay', 'digital delay', 'reverb'].map(
      (name): PedalInput => ({ name, kind: 'compact', powered: true, inLoop: mode === 'switcher' }),
    ),
  ];
  return { surfaceId: 'ridge-100', caseId: 'shell-hard', routing: { mode }, pedals, functions: [], level };
}

/** Labor ranges in dollars for the reference board (common practice, no published source). */
export const expectedLaborRanges: Array<{ mode: 'serial' | 'switcher'; level: BuilderLevel; low: number; high: number }> = [
  { mode: 'serial', level: 'master', low: 1400, high: 2100 },
  { mode: 'serial', level: 'journeyman', low: 1100, high: 1400 },
  { mode: 'serial', level: 'apprentice', low: 500, high: 700 },
  { mode: 'switcher', level: 'master', low: 2100, high: 3200 },
  { mode: 'switcher', level: 'journeyman', low: 1600, high: 2100 },
  { mode: 'switcher', level: 'apprentice', low: 800, high: 1000 },
];

/**
 * A board priced by its pedal count alone (plain powered pedals, no list): by default the demo price
 * book's slate-61 surface and hard case, in series, with no added functions.
 */
export function countedBoard(pedalCount: number, level: BuilderLevel = 'journeyman', surfaceId = 'slate-61'): RigConfiguration {
  return { surfaceId, caseId: 'shell-hard', routing: { mode: 'serial' }, pedalCount, functions: [], level };
}

/**
 * Pedals in series for the power checks, with the outputs the player brings (or none): the rig
 * around them is a placeholder, since the power checks read only the pedals and the supply.
 */
export function seriesOfPedals(pedals: PedalInput[], powerSupply?: RigConfiguration['powerSupply']): RigConfiguration {
  return { surfaceId: 's', caseId: 'c', routing: { mode: 'serial' }, pedals, functions: [], level: 'master', powerSupply };
}
