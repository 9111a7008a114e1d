import type { BuilderLevel } from '../domain';
import type { PowerRules } from '../checks/types';

/**
 * A shop's price book as published. Every amount is a decimal string (never a float); every item
 * has an `id` that stays the same across versions, so a configuration keeps pointing at it.
 */
export interface PriceBook {
  currency: string;
  surfaces: SurfaceItem[];
  cases: CaseItem[];
  materials: MaterialsRates;
  labor: LaborRates;
  functions: FunctionItem[];
  levels: LevelItem[];
  depositPolicy: DepositPolicy;
  /** Daisy-chain limit and high-draw mark for the power plan; absent means the defaults (DEFAULT_POWER_RULES). */
  power?: PowerRules;
}

/** How a surface is laid out: its rows (tiers on a tiered board) and where its description puts the switcher. */
export interface SurfaceLayout {
  /** Rows of pedals, front to back; on a tiered board, its tiers. */
  rows: number;
  tiered: boolean;
  /** Where the loop switcher and treadles sit: the front row (the player's side) or the back. */
  switcherRow: 'front' | 'back';
}

export interface SurfaceItem {
  id: string;
  name: string;
  description: string;
  /** Usable mounting area. */
  widthMm: number;
  depthMm: number;
  price: string;
  custom: boolean;
  /** Absent: rows are worked out from the depth, switcher at the front. */
  layout?: SurfaceLayout;
}

export type CaseKind = 'hard_case' | 'road_case' | 'soft_bag';

export interface CaseItem {
  id: string;
  name: string;
  kind: CaseKind;
  description: string;
  price: string;
  /** Soft bags: allowed, but flagged as not recommended for a loaded board. */
  notRecommended: boolean;
  caution: string | null;
  /** The surfaces this case fits; empty means any. */
  fitsSurfaceIds: string[];
}

export interface MaterialsRates {
  /** Fasteners, tie-down mounts and zip ties, per pedal. */
  fastenersPerPedalSerial: string;
  fastenersPerPedalSwitcher: string;
  hookAndLoopFeetPerPedal: string;
  hookAndLoopPricePerFoot: string;
  cablePricePerFoot: string;
  /** Each audio patch cable takes two plugs. */
  plugPrice: string;
  /** Default length of one patch cable, before the spare allowance. */
  patchLengthFeet: string;
  /** Extra cable bought per patch for mistakes and re-routing. */
  spareFeetPerPatch: string;
  /** One re-terminated DC barrel plug per powered device (the switcher too). */
  barrelPlugPrice: string;
}

export interface LaborRates {
  hoursPerDeviceSerial: string;
  hoursPerDeviceSwitcher: string;
}

export interface FunctionItem {
  id: string;
  code: string;
  name: string;
  description: string;
  laborHours: string;
  /** How many functions this counts as (wet/dry/wet counts as two). */
  functionCount: number;
  /** Extra audio patch cables (two plugs each) the function adds. */
  extraPatchCables: number;
  /** The least experienced level the shop lets wire this function; absent means journeyman. */
  minimumLevel?: BuilderLevel;
}

export interface LevelItem {
  id: string;
  code: BuilderLevel;
  name: string;
  description: string;
  rateLow: string;
  rateHigh: string;
}

export interface DepositPolicy {
  /** Share of the high end of the estimate, e.g. "25" for 25 %. */
  percent: string;
  /** The deposit is never below this amount. */
  minimum: string;
  /** Plain words shown before payment. */
  description: string;
}

/** GET /api/catalog. */
export interface Catalog {
  priceBookVersion: number;
  publishedAt: string;
  currency: string;
  surfaces: SurfaceItem[];
  cases: CaseItem[];
  functions: FunctionItem[];
  levels: LevelItem[];
  depositPolicy: DepositPolicy;
  materials: MaterialsRates;
  labor: LaborRates;
  power?: PowerRules;
}

/** One published version, as listed in the backoffice. */
export interface PriceBookVersionSummary {
  version: number;
  currency: string;
  notes: string;
  publishedAt: string;
  publishedBy: string | null;
}

/** GET /api/price-book (staff): the current book in full and every version published so far. */
export interface PriceBookOverview {
  current: PriceBookVersionSummary & { book: PriceBook };
  versions: PriceBookVersionSummary[];
}

/** POST /api/price-book (owner): the whole new book; it becomes the next version. */
export interface PublishPriceBookRequest {
  book: PriceBook;
  notes?: string;
}
