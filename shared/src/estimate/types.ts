import type { BuilderLevel } from '../domain';
import type { RigChecks } from '../checks/types';

/** What the player tells us about their rig. POST /api/estimates takes this shape. */
export interface RigConfiguration {
  surfaceId: string;
  caseId: string;
  routing: { mode: RoutingMode; switcher?: SwitcherInput };
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

/** The player's own loop switcher, when they did not list it among the pedals: its figures win over typical ones. */
export interface SwitcherInput {
  name?: string;
  currentMa?: number;
  voltage?: number;
  polarity?: 'center_negative' | 'center_positive';
  supply?: 'dc' | 'ac';
  widthMm?: number;
  depthMm?: number;
  /** Index into `powerSupply.outputs` when the player pins the switcher to an output. */
  powerOutput?: number;
}

export type PedalKind = 'mini' | 'compact' | 'large' | 'large_digital' | 'tuner' | 'treadle' | 'buffer' | 'switcher' | 'other';

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
  /** A digital pedal (or any with a microprocessor) wants an output of its own; large digital kinds are digital unless told otherwise. */
  digital?: boolean;
  /** Index into `powerSupply.outputs` when the player pins it to an output: kept by the plan and checked. */
  powerOutput?: number;
}

export interface PowerOutputInput {
  label?: string;
  voltage: number;
  currentMa: number;
  isolated: boolean;
  supply?: 'dc' | 'ac';
  /** Barrel polarity the output delivers; supplies are centre-negative unless they say otherwise. */
  polarity?: 'center_negative' | 'center_positive';
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
  /**
   * Labor lines: what the hours count, without the rate ("2 pedals: about an hour each"). The
   * explanation adds the rate in the shop's money; a firm quote words it again at one rate.
   */
  basis?: string;
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
  /** Written for the player ("your supply…"): the configurator, the quote and the build page. */
  notes: string[];
  /** The same facts written for the shop (backoffice, build sheet); absent on estimates saved before it existed. */
  staffNotes?: string[];
  /** Engineering checks (power budget, board fit, cable schedule, complexity); shapes in ../checks/types. */
  checks?: RigChecks;
}
