import { builderLevels, levelRank, type BuilderLevel, type Catalog, type RigConfiguration } from '@loomwright/shared';

/** A common starting rig, so the estimate has figures from the first screen on. */
export function startingConfiguration(catalog: Catalog): RigConfiguration {
  const surfaces = [...catalog.surfaces].sort((a, b) => a.widthMm * a.depthMm - b.widthMm * b.depthMm);
  const surface = surfaces.find((s) => !s.custom && s.widthMm >= 600) ?? surfaces[0];
  const kase =
    catalog.cases.find((c) => !c.notRecommended && (c.fitsSurfaceIds.length === 0 || c.fitsSurfaceIds.includes(surface?.id ?? ''))) ??
    catalog.cases[0];
  return {
    surfaceId: surface?.id ?? '',
    caseId: kase?.id ?? '',
    routing: { mode: 'serial' },
    pedalCount: 6,
    functions: [],
    level: 'apprentice',
  };
}

/**
 * Reads whatever a URL or a stored draft held and keeps only what still makes sense against
 * today's catalog; the rest falls back to the starting rig. The API validates in full.
 */
export function completeConfiguration(partial: Partial<RigConfiguration> | undefined, catalog: Catalog): RigConfiguration {
  const start = startingConfiguration(catalog);
  if (!partial) return start;
  const surfaceId = catalog.surfaces.some((s) => s.id === partial.surfaceId) ? partial.surfaceId! : start.surfaceId;
  const caseId = catalog.cases.some((c) => c.id === partial.caseId) ? partial.caseId! : start.caseId;
  const mode = partial.routing?.mode === 'switcher' ? 'switcher' : 'serial';
  const level: BuilderLevel = builderLevels.includes(partial.level as BuilderLevel) ? (partial.level as BuilderLevel) : start.level;
  const codes = new Set(catalog.functions.map((f) => f.code));
  const functions = Array.isArray(partial.functions) ? partial.functions.filter((code) => codes.has(code)) : [];
  const switcher = mode === 'switcher' && partial.routing?.switcher && typeof partial.routing.switcher === 'object' ? partial.routing.switcher : undefined;
  const configuration: RigConfiguration = { surfaceId, caseId, routing: switcher ? { mode, switcher } : { mode }, functions, level };
  if (Array.isArray(partial.pedals)) configuration.pedals = partial.pedals;
  else configuration.pedalCount = typeof partial.pedalCount === 'number' ? partial.pedalCount : start.pedalCount;
  if (mode === 'switcher' && !configuration.pedals) {
    configuration.pedals = pedalsFromCount(configuration.pedalCount ?? 0);
    delete configuration.pedalCount;
  }
  if (partial.powerSupply && Array.isArray(partial.powerSupply.outputs)) configuration.powerSupply = partial.powerSupply;
  return configuration;
}

/** Turning a quick count into a list: plain powered compact pedals the player can rename. */
export function pedalsFromCount(count: number): NonNullable<RigConfiguration['pedals']> {
  return Array.from({ length: count }, (_, i) => ({
    name: `Pedal ${i + 1}`,
    kind: 'compact' as const,
    powered: true,
    inLoop: false,
  }));
}

export const pedalTotal = (c: RigConfiguration) => c.pedals?.length ?? c.pedalCount ?? 0;

export const higherLevel = (a: BuilderLevel, b: BuilderLevel): BuilderLevel => (levelRank(a) >= levelRank(b) ? a : b);
