import { builderLevels, levelRank, type BuilderLevel } from '../domain';
import type { FunctionItem } from '../price-book/types';
import type { Complexity, SignalChain } from './types';

/** Eight loops and up is a full switcher rig (common practice, no published source). */
const MASTER_LOOPS = 8;
/** Three or more functions on one board (wet/dry/wet counting as two) is master's work (common practice). */
const MASTER_FUNCTIONS = 3;

/**
 * The least experienced level the rig calls for. Switcher loops, functions, stereo and mixed
 * voltages raise it; the reasons say why in words the player and the owner both read.
 */
export function complexityOf(chain: SignalChain, functions: FunctionItem[]): Complexity {
  let level: BuilderLevel = 'apprentice';
  const reasons: string[] = [];
  const raise = (to: BuilderLevel, reason: string) => {
    reasons.push(reason);
    if (levelRank(to) > levelRank(level)) level = to;
  };

  const loops = chain.loops.length;
  if (loops >= MASTER_LOOPS)
    raise('master', `${loops} switcher loops: a full switcher rig, every loop cabled at both ends and every preset tested`);
  else if (loops > 0) raise('journeyman', `${loops} switcher loop${loops === 1 ? '' : 's'}: both ends of every loop are cabled`);

  for (const fn of functions) {
    raise(fn.minimumLevel ?? 'journeyman', `${fn.name} (function)`);
  }
  const functionCount = functions.reduce((sum, fn) => sum + fn.functionCount, 0);
  if (functionCount >= MASTER_FUNCTIONS) raise('master', `${functionCount} functions on one board`);

  const powered = chain.devices.filter((d) => d.powered);
  const voltages = [...new Set(powered.map((d) => d.voltage))].sort((a, b) => a - b);
  if (voltages.length > 1) raise('journeyman', `mixed supply voltages (${voltages.map((v) => `${v} V`).join(', ')})`);
  if (powered.some((d) => d.supply === 'ac')) raise('journeyman', 'a pedal that runs on AC');
  if (powered.some((d) => d.polarity === 'center_positive')) raise('journeyman', 'a centre-positive pedal among centre-negative ones');

  return { minimumLevel: level, reasons, loops, functionCount, voltages };
}

export const levelsAtLeast = (level: BuilderLevel): BuilderLevel[] => builderLevels.filter((l) => levelRank(l) >= levelRank(level));
