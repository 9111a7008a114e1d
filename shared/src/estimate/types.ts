import type { BuilderLevel } from '../domain';
import type { BarrelPolarity, RigChecks, SupplyKind } from '../checks/types';

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

/**
 * The figures a player may give for one of their devices (a pedal, or their own loop switcher):
 * each left out falls back to the typical one for its kind.
 */
export interface DeviceFigures {
  currentMa?: number;
  voltage?: number;
  /** DC barrel polarity; most pedals are centre-negative (common practice). */
  polarity?: BarrelPolarity;
  /** A few pedals run on AC; the power check must not assume DC. */
  supply?: SupplyKind;
  widthMm?: number;
  depthMm?: number;
  /** Index into `powerSupply.outputs` when the player pins the device to an output: kept by the plan and checked. */
  powerOutput?: number;
}

/** The player's own loop switcher, when they did not list it among the pedals: its figures win over typical ones. */
export interface SwitcherInput extends DeviceFigures {
  name?: string;
}

export type PedalKind = 'mini' | 'compact' | 'large' | 'large_digital' | 'tuner' | 'treadle' | 'buffer' | 'switcher' | 'other';

export interface PedalInput extends DeviceFigures {
  name: string;
  kind?: PedalKind;
  powered: boolean;
  /** Wired through a loop of the switcher (switcher routing only). */
  inLoop: boolean;
  /** A digital pedal (or any with a microprocessor) wants an output of its own; large digital kinds are digital unless told otherwise. */
  digital?: boolean;
}

export interface PowerOutputInput {
  label?: string;
  voltage: number;
  currentMa: number;
  isolated: boolean;
  supply?: SupplyKind;
  /** Barrel polarity the output delivers; supplies are centre-negative unless they say otherwise. */
  polarity?: BarrelPolarity;
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
