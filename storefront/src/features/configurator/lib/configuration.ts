import { builderLevels, levelRank, type BuilderLevel, type Catalog, type RigConfiguration } from '@loomwright/shared';

/**
 * Where every configuration starts: nothing chosen yet. The player's own first choice (a surface)
 * starts the estimate; no surface, case or pedals are chosen for them, so nothing is priced that
 * they did not pick. The level starts at the first rung; the rig may raise it.
 */
export function startingConfiguration(_catalog?: Catalog): RigConfiguration {
  return { surfaceId: '', caseId: '', routing: { mode: 'serial' }, functions: [], level: 'apprentice' };
}

/** What the estimate still needs from the player, in step order. */
export type MissingChoice = 'surface' | 'case' | 'pedals';

export function missingChoices(c: Partial<RigConfiguration> | undefined): MissingChoice[] {
  const missing: MissingChoice[] = [];
  if (!c?.surfaceId) missing.push('surface');
  if (!c?.caseId) missing.push('case');
  if (!(c?.pedals?.length || c?.pedalCount)) missing.push('pedals');
  return missing;
}

/**
 * Reads whatever a URL or a stored draft held and keeps only what still makes sense against
 * today's catalog; a surface or case the shop no longer offers is left to choose again. The API
 * validates in full.
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
  const switcher =
    mode === 'switcher' && partial.routing?.switcher && typeof partial.routing.switcher === 'object' ? partial.routing.switcher : undefined;
  const configuration: RigConfiguration = { surfaceId, caseId, routing: switcher ? { mode, switcher } : { mode }, functions, level };
  if (Array.isArray(partial.pedals)) configuration.pedals = partial.pedals;
  else if (typeof partial.pedalCount === 'number') configuration.pedalCount = partial.pedalCount;
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
