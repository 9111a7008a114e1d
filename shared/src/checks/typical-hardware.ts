import type { PedalKind } from '../estimate/types';

export interface TypicalHardware {
  label: string;
  widthMm: number;
  depthMm: number;
  /** Upper end of the usual draw at 9 V, so an unknown pedal is budgeted on the safe side. */
  currentMa: number;
}

/**
 * Typical footprints and draws used when the player gives none. From memory of common hardware
 * (the table in PRODUCT.md), not a published source; the player's own figures always win, and
 * every figure taken from here is marked as assumed in the checks.
 */
export const typicalHardware: Record<PedalKind, TypicalHardware> = {
  mini: { label: 'mini pedal', widthMm: 40, depthMm: 95, currentMa: 30 },
  compact: { label: 'compact pedal', widthMm: 70, depthMm: 125, currentMa: 100 },
  large: { label: 'large-box pedal', widthMm: 95, depthMm: 120, currentMa: 100 },
  large_digital: { label: 'large digital pedal', widthMm: 210, depthMm: 130, currentMa: 500 },
  tuner: { label: 'tuner', widthMm: 70, depthMm: 125, currentMa: 100 },
  treadle: { label: 'wah, volume or expression treadle', widthMm: 100, depthMm: 260, currentMa: 10 },
  buffer: { label: 'input/output buffer box', widthMm: 100, depthMm: 60, currentMa: 50 },
  switcher: { label: 'programmable loop switcher', widthMm: 425, depthMm: 110, currentMa: 400 },
  other: { label: 'pedal', widthMm: 70, depthMm: 125, currentMa: 100 },
};

/** Most pedals take 9 V DC, centre-negative, on a 5.5 × 2.1 mm barrel (common practice). */
export const DEFAULT_VOLTAGE = 9;
export const BARREL_CONNECTOR = '5.5 × 2.1 mm DC barrel';
