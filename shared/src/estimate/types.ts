import type { BuilderLevel } from '../domain';
import type { RigChecks } from '../checks/types';

/** What the player tells us about their rig. POST /api/estimates takes this shape. */
export interface RigConfiguration {
  surfaceId: string;
  caseId: string;
  routing: { mode: RoutingMode };
  /** An itemized list, or … */
  pedals?: PedalInput[];
  /** … a quick count of plain powered pedals, all in series (only with serial routing). */
  pedalCount?: number;
  /** Codes of the add-on functions (stereo output, four-cable, wet/dry/wet, …). */
  functions: string[];
  level: BuilderLevel;
  powerSupply?: { outputs: PowerOutputInput[] };
}

export type RoutingMode = 'serial' | 'switcher';

export type PedalKind =
  | 'mini'
  | 'compact'
  | 'large'
  | 'large_digital'
  | 'tuner'
  | 'treadle'
  | 'buffer'
  | 'switcher'
  | 'other';

export interface PedalInput {
  name: string;
  kind?: PedalKind;
  powered: boolean;
  /** Wired through a loop of the switcher (switcher routing only). */
  inLoop: boolean;
  currentMa?: number;
  voltage?: number;
  /** DC barrel polarity; most pedals are centre-negative (common practice). */
  polarity?: 'center_negative' | 'center_positive';
  /** A few pedals run on AC; the power check must not assume DC. */
  supply?: 'dc' | 'ac';
  widthMm?: number;
  depthMm?: number;
  /** Index into `powerSupply.outputs` when the player already knows which output feeds it. */
  powerOutput?: number;
}

export interface PowerOutputInput {
  label?: string;
  voltage: number;
  currentMa: number;
  isolated: boolean;
  supply?: 'dc' | 'ac';
}

export interface EstimateLine {
  code: string;
  label: string;
  kind: 'materials' | 'labor';
  quantity: string;
  unit: string;
  unitPrice: string;
  amount: string;
  /** Labor lines are priced at the level's range: amount is the low end, amountHigh the high end. */
  amountHigh?: string;
  explanation?: string;
}

/** POST /api/estimates answers with this. Every amount is a decimal string. */
export interface EstimateResult {
  priceBookVersion: number;
  currency: string;
  level: BuilderLevel;
  lines: EstimateLine[];
  laborHours: string;
  materialsTotal: string;
  laborLow: string;
  laborHigh: string;
  totalLow: string;
  totalHigh: string;
  deposit: string;
  rate: { low: string; high: string };
  minimumLevel: BuilderLevel;
  minimumLevelReasons: string[];
  notes: string[];
  /** Engineering checks (power budget, board fit, cable schedule, complexity); shapes in ../checks/types. */
  checks?: RigChecks;
}
