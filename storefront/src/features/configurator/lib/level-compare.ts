import Decimal from 'decimal.js';
import {
  builderLevels,
  estimateRig,
  levelRank,
  type BuilderLevel,
  type Catalog,
  type EstimateResult,
  type PriceBook,
  type RigConfiguration,
} from '@loomwright/shared';
import { higherLevel } from './configuration';

/** The catalog carries the whole published book, so the storefront can run the same pure engine the API runs. */
export function bookOf(catalog: Catalog): PriceBook {
  const { currency, surfaces, cases, materials, labor, functions, levels, depositPolicy, power } = catalog;
  return { currency, surfaces, cases, materials, labor, functions, levels, depositPolicy, ...(power ? { power } : {}) };
}

/** The engine's answer, or null for a configuration it refuses (the API's answer then says why). */
export function localEstimate(configuration: RigConfiguration, catalog: Catalog): EstimateResult | null {
  try {
    return estimateRig(configuration, bookOf(catalog), { version: catalog.priceBookVersion });
  } catch {
    return null;
  }
}

/** The rig priced at each of the three levels, side by side. */
export function levelTotals(
  configuration: RigConfiguration,
  catalog: Catalog,
): Array<{ level: BuilderLevel; estimate: EstimateResult | null }> {
  return builderLevels.map((level) => ({ level, estimate: localEstimate({ ...configuration, level }, catalog) }));
}

export interface ExtraEffect {
  /** The minimum level with the extra toggled, and whether that is above (adding) or below (removing) today's. */
  minimumAfter: BuilderLevel;
  raises: boolean;
  lowers: boolean;
  /** Level the rig would be priced at after the toggle (the player's choice, raised to the minimum). */
  levelAfter: BuilderLevel;
  /** Change in the estimate's low and high ends, as decimal strings (negative when it falls). */
  deltaLow: string;
  deltaHigh: string;
}

/** a − b as a decimal string (never a float), for "+$509" style differences. */
const difference = (a: string, b: string) => new Decimal(a).minus(b).toFixed();

/** What toggling one extra does to the rig's minimum level and its price. */
export function extraEffect(
  configuration: RigConfiguration,
  code: string,
  catalog: Catalog,
  now: Pick<EstimateResult, 'minimumLevel' | 'totalLow' | 'totalHigh'>,
): ExtraEffect | null {
  const on = configuration.functions.includes(code);
  const functions = on ? configuration.functions.filter((f) => f !== code) : [...configuration.functions, code];
  const probe = localEstimate({ ...configuration, functions }, catalog);
  if (!probe) return null;
  const levelAfter = higherLevel(probe.minimumLevel, configuration.level);
  const after = levelAfter === configuration.level ? probe : localEstimate({ ...configuration, functions, level: levelAfter }, catalog);
  if (!after) return null;
  return {
    minimumAfter: probe.minimumLevel,
    raises: levelRank(probe.minimumLevel) > levelRank(now.minimumLevel),
    lowers: levelRank(probe.minimumLevel) < levelRank(now.minimumLevel),
    levelAfter,
    deltaLow: difference(after.totalLow, now.totalLow),
    deltaHigh: difference(after.totalHigh, now.totalHigh),
  };
}
