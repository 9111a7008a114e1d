import type { BuilderLevel } from '../domain';
import type { PedalKind } from '../estimate/types';

/** Whether a device or an output runs on direct or alternating current (a few pedals take AC). */
export type SupplyKind = 'dc' | 'ac';

/** DC barrel polarity; most pedals and supplies are centre-negative (common practice, no published source). */
export type BarrelPolarity = 'center_negative' | 'center_positive';

/** ok: nothing to act on · warning: worth a look · problem: the rig will not work as listed · unknown: not enough data. */
export type CheckStatus = 'ok' | 'warning' | 'problem' | 'unknown';

/** One device on the board, with the figures the checks use (the player's own, or typical ones). */
export interface RigDevice {
  id: string;
  /**
   * Position in the signal's path, from 1 at the guitar: the main chain in order, each switcher
   * loop right after the switcher. The drawing, the cable list and the build sheet all use it.
   */
  number: number;
  /** Position in the player's pedal list; null for the switcher the routing implies. */
  listIndex: number | null;
  name: string;
  kind: PedalKind;
  powered: boolean;
  /** Loop number on the switcher (1-based), null when the device sits in the main chain. */
  loop: number | null;
  voltage: number;
  supply: SupplyKind;
  polarity: BarrelPolarity;
  /** The player's figure, or null when unknown. */
  currentMa: number | null;
  /** The figure the budget uses: the player's, or the typical one for the kind. */
  budgetMa: number;
  drawFromMemory: boolean;
  widthMm: number;
  depthMm: number;
  footprintFromMemory: boolean;
  powerOutput: number | null;
  /** Digital (or told so by the player): wants an output of its own. */
  digital: boolean;
}

export interface SignalChain {
  routing: 'serial' | 'switcher';
  devices: RigDevice[];
  /** Device ids in signal order, the switcher standing for all of its loops. */
  main: string[];
  loops: Array<{ loop: number; deviceId: string }>;
  /** The switcher's id on a switcher board. */
  switcherId: string | null;
  /** The player gave a quick count, not a list: the pedals have no names or figures of their own. */
  fromCount?: boolean;
}

export interface PatchCable {
  number: number;
  from: string;
  to: string;
  /** Signal numbers of the two ends' devices (null for a function's patch routed at the bench). */
  fromDevice: number | null;
  toDevice: number | null;
  purpose: 'chain' | 'loop_send' | 'loop_return' | 'function';
  lengthFeet: string;
  spareFeet: string;
  plugs: number;
}

export interface PowerLead {
  device: string;
  voltage: number;
  supply: SupplyKind;
  polarity: BarrelPolarity;
  connector: string;
}

export interface CableSchedule {
  patches: PatchCable[];
  patchCount: number;
  plugCount: number;
  /** Cable to buy: every patch's length plus its spare allowance. */
  cableFeet: string;
  spareFeet: string;
  powerLeads: PowerLead[];
  barrelPlugCount: number;
}

export interface PowerOutputLoad {
  output: number;
  label: string;
  voltage: number;
  supply: SupplyKind;
  polarity: BarrelPolarity;
  isolated: boolean;
  ratingMa: number;
  loadMa: number;
  headroomMa: number;
  ratingW: number;
  loadW: number;
  headroomW: number;
  /** Ohm's law, R = V / I: the smallest load this output is rated to drive, and the load it sees. */
  minimumLoadOhms: number;
  loadOhms: number | null;
  devices: string[];
  flags: string[];
}

export interface PowerAssignment {
  device: string;
  deviceId: string;
  output: number | null;
  voltage: number;
  currentMa: number;
  drawFromMemory: boolean;
  /** The player chose this output; the plan keeps it and checks it. */
  pinned: boolean;
  /** Why this device must not share its output (digital, high draw, reversed polarity); null when it may. */
  ownOutputReason: string | null;
  /** A centre-positive pedal on a centre-negative output (or the other way): needs a polarity-reversing lead. */
  reversingLead: boolean;
}

/** The trade's limits a shop sets in its price book. */
export interface PowerRules {
  /** The most pedals one output may feed as a daisy chain. */
  maxDaisyChain: number;
  /** Above this draw a pedal gets an output of its own, analog or not. */
  highDrawMa: number;
}

export interface PowerBudget {
  status: CheckStatus;
  supplyListed: boolean;
  outputs: PowerOutputLoad[];
  assignments: PowerAssignment[];
  unassigned: Array<{ device: string; deviceId: string; reason: string }>;
  /** What would make a plan possible, in words ("one more isolated output of at least 300 mA at 9 V DC, for …"). */
  fixes: string[];
  /** Fewest outputs proven (false only when the search gave up on a very large rig and kept its best plan). */
  optimal: boolean;
  outputsUsed: number;
  spareOutputs: number;
  rules: PowerRules;
  totalDrawMa: number;
  totalDrawW: number;
  totalRatingMa: number | null;
  totalRatingW: number | null;
  totalHeadroomMa: number | null;
  totalHeadroomW: number | null;
  warnings: string[];
}

export interface LayoutPlacement {
  device: string;
  deviceId: string;
  /** The device's signal number, printed on the drawing and listed in its key. */
  number: number;
  /** Where the drawing puts it: the main chain, a switcher loop, or the front row's switcher and treadles. */
  group: 'chain' | 'loop' | 'front';
  row: number;
  /** Millimetres from the surface's back-left corner (a top view: x to the right, y towards the player). */
  x: number;
  y: number;
  widthMm: number;
  depthMm: number;
}

export interface BoardFit {
  status: CheckStatus;
  surfaceId: string;
  usableWidthMm: number;
  usableDepthMm: number;
  spacingMm: number;
  footprintAreaMm2: number;
  /** Footprints grown by the spacing allowance. */
  requiredAreaMm2: number;
  usableAreaMm2: number;
  /** requiredAreaMm2 / usableAreaMm2; above 1 nothing can fit. */
  fillRatio: number;
  areaFits: boolean;
  layoutFits: boolean;
  layout: LayoutPlacement[];
  /** 'signal': in signal order, input on the right, front row for the switcher and treadles; 'packed': a tighter packing that gives up the order. */
  layoutKind: 'signal' | 'packed';
  rows: number;
  tiered: boolean;
  unplaced: string[];
  smallestFittingSurfaceId: string | null;
  warnings: string[];
}

export interface Complexity {
  minimumLevel: BuilderLevel;
  reasons: string[];
  loops: number;
  functionCount: number;
  voltages: number[];
}

export interface RigChecks {
  signalChain: SignalChain;
  cableSchedule: CableSchedule;
  powerBudget: PowerBudget;
  boardFit: BoardFit;
  complexity: Complexity;
}
