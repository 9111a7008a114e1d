import type { RigConfiguration } from './estimate/types';

/** One thing the player sends in, at its place in the rig. */
export interface IntakeChecklistItem {
  /** Stable across recordings: 'chain:<index of the pedal in the rig>', 'switcher', 'supply', or 'other:<name>'. */
  key: string;
  item: string;
  /** Signal-chain order: the pedals as the rig lists them (input to output), then switcher and supply, then anything else. */
  position: number;
}

const SWITCHER_POSITION = 9_000;
const SUPPLY_POSITION = 9_100;
const OTHER_POSITION = 10_000;

/** What intake checks, in signal-chain order: every pedal of the rig, the switcher when there is one, and the supply. */
export function intakeChecklist(config: RigConfiguration): IntakeChecklistItem[] {
  const pedals = config.pedals ?? [];
  const names = pedals.length ? pedals.map((p) => p.name) : Array.from({ length: config.pedalCount ?? 0 }, (_, i) => `Pedal ${i + 1}`);
  const items = names.map((item, i) => ({ key: `chain:${i}`, item, position: i }));
  const listsSwitcher = pedals.some((p) => p.kind === 'switcher');
  if (config.routing?.mode === 'switcher' && !listsSwitcher)
    items.push({ key: 'switcher', item: 'Loop switcher', position: SWITCHER_POSITION });
  items.push({ key: 'supply', item: 'Power supply', position: SUPPLY_POSITION });
  return items;
}

const sameName = (a: string, b: string) => a.trim().toLocaleLowerCase('en') === b.trim().toLocaleLowerCase('en');

/**
 * Places recorded item names on the checklist: each name takes the first checklist item of that
 * name not already taken in this recording; a name the rig does not list is 'other:<name>'.
 * Recording the same list twice therefore lands on the same keys, so nothing is duplicated.
 */
export function placeIntakeItems(checklist: IntakeChecklistItem[], names: string[]): IntakeChecklistItem[] {
  const taken = new Set<string>();
  return names.map((name) => {
    const match = checklist.find((c) => !taken.has(c.key) && sameName(c.item, name));
    const placed = match ?? { key: `other:${name.trim().toLocaleLowerCase('en')}`, item: name.trim(), position: OTHER_POSITION };
    taken.add(placed.key);
    return { ...placed, item: name.trim() };
  });
}
