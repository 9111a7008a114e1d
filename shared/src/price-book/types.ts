import type { BuilderLevel } from '../domain';

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
