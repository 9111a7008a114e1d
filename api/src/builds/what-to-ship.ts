import type { RigConfiguration } from '@loomwright/shared';

/**
 * What the player sends in, from their configuration: their own pedals, supply and switcher
 * (the shop supplies materials only). The scheduled e-mail adds its own packing advice.
 */
export function whatToShip(configuration: RigConfiguration): string[] {
  const items: string[] = [];
  const pedals = configuration.pedals ?? [];
  if (pedals.length) {
    for (const p of pedals) if (p.kind !== 'switcher') items.push(p.name);
  } else if (configuration.pedalCount) {
    items.push(`Your ${configuration.pedalCount} pedals`);
  }
  items.push('Your power supply with its mains lead, labelled with your name');
  if (configuration.routing?.mode === 'switcher') items.push('Your loop switcher and its power lead, labelled');
  return items;
}
