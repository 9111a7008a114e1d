import type { PowerOutputInput } from '../estimate/types';
import type { BarrelPolarity, PowerRules, RigDevice, SupplyKind } from './types';

/**
 * Defaults when a price book sets no power rules: at most three analog pedals on one output, and
 * anything drawing more than 100 mA on an output of its own (common practice, no published source).
 */
export const DEFAULT_POWER_RULES: PowerRules = { maxDaisyChain: 3, highDrawMa: 100 };

/** A supply output as the plan sees it; a virtual one stands for an output the supply lacks. */
interface Slot {
  index: number;
  voltage: number;
  supply: SupplyKind;
  polarity: BarrelPolarity;
  isolated: boolean;
  ratingMa: number;
  virtual: boolean;
  /** Outputs that are interchangeable share a key, so the search tries only one of them when empty. */
  key: string;
}

interface Load {
  ma: number;
  count: number;
  /** Holds a device that must be alone (only the pinned may break this, and it is then flagged). */
  solo: boolean;
}

export const outputPolarity = (o: PowerOutputInput): BarrelPolarity => o.polarity ?? 'center_negative';
const outputSupply = (o: PowerOutputInput) => o.supply ?? 'dc';

/**
 * Why a device must have an output to itself, or null when it may join a daisy chain. Digital
 * pedals put switching noise on a shared ground and high-draw pedals eat a shared output's
 * headroom (common practice, no published source).
 */
export function ownOutputReason(d: RigDevice, rules: PowerRules): string | null {
  if (d.kind === 'switcher') return 'a loop switcher is digital';
  if (d.digital) return 'digital';
  if (d.budgetMa > rules.highDrawMa) return `draws more than ${rules.highDrawMa} mA`;
  return null;
}

/**
 * Whether `d` may be powered from `slot` at all, alone. Voltage and AC/DC must match. On DC, a
 * pedal of the other polarity needs a polarity-reversing lead, which is only safe on an isolated
 * output it has to itself: on a shared ground the reversed barrel would short the supply through
 * the audio cables' shields (common practice, no published source).
 */
function fitsAlone(d: RigDevice, slot: Slot): boolean {
  if (slot.virtual) return true;
  if (slot.voltage !== d.voltage || slot.supply !== d.supply) return false;
  if (d.budgetMa > slot.ratingMa) return false;
  if (d.supply === 'dc' && d.polarity !== slot.polarity && !slot.isolated) return false;
  return true;
}

const needsReversal = (d: RigDevice, slot: { supply: SupplyKind; polarity: BarrelPolarity; virtual?: boolean }) =>
  !slot.virtual && d.supply === 'dc' && slot.supply === 'dc' && d.polarity !== slot.polarity;

export interface PlanResult {
  /** Output index per device (null: no output); virtual outputs are numbered after the real ones. */
  outputOf: Map<RigDevice, number | null>;
  /** Devices that only a missing output could take, grouped by the output each would need. */
  virtualGroups: RigDevice[][];
  optimal: boolean;
}

/** Search nodes before the search keeps its best plan so far (large rigs only; small ones finish far below). */
const NODE_BUDGET = 4000;

/**
 * Assigns every unpinned powered device to an output, keeping the pinned ones where the player put
 * them. Among all assignments that obey the rules (matching voltage, AC/DC and polarity; no output
 * past its rating; digital, high-draw and reversed-polarity devices alone; daisy chains only of
 * the rest and no longer than the price book allows) it finds the one using the fewest outputs,
 * by a depth-first search with bounds. A device no real output can take goes to a "virtual"
 * output; the plan with fewest of those wins first, and they become the fix the player is told.
 */
export function planPower(powered: RigDevice[], outputs: PowerOutputInput[], rules: PowerRules): PlanResult {
  const real: Slot[] = outputs.map((o, index) => ({
    index,
    voltage: o.voltage,
    supply: outputSupply(o),
    polarity: outputPolarity(o),
    isolated: o.isolated,
    ratingMa: o.currentMa,
    virtual: false,
    key: `${o.voltage}|${outputSupply(o)}|${outputPolarity(o)}|${o.isolated}|${o.currentMa}`,
  }));
  const loads: Load[] = real.map(() => ({ ma: 0, count: 0, solo: false }));
  const outputOf = new Map<RigDevice, number | null>();

  for (const d of powered) {
    if (d.powerOutput === null) continue;
    if (d.powerOutput >= real.length) {
      outputOf.set(d, null);
      continue;
    }
    const load = loads[d.powerOutput];
    load.ma += d.budgetMa;
    load.count += 1;
    if (ownOutputReason(d, rules) !== null || needsReversal(d, real[d.powerOutput])) load.solo = true;
    outputOf.set(d, d.powerOutput);
  }

  // Devices that must be alone first (each opens an output), then the largest draws: both make
  // the first plan found a good one and the bounds bite early.
  const free = powered
    .filter((d) => d.powerOutput === null)
    .map((d) => ({ d, solo: ownOutputReason(d, rules) !== null }))
    .sort((a, b) => Number(b.solo) - Number(a.solo) || b.d.budgetMa - a.d.budgetMa);

  const slots: Slot[] = [...real];
  for (let i = 0; i < free.length; i++) {
    slots.push({
      index: real.length + i,
      voltage: 0,
      supply: 'dc',
      polarity: 'center_negative',
      isolated: true,
      ratingMa: Infinity,
      virtual: true,
      key: 'virtual',
    });
    loads.push({ ma: 0, count: 0, solo: false });
  }

  // Interchangeable outputs share a key; the search marks the keys it has tried at a node with that
  // node's stamp instead of building a set of strings per node.
  const keyIds = new Map<string, number>();
  const keyOf = slots.map((slot) => {
    let id = keyIds.get(slot.key);
    if (id === undefined) keyIds.set(slot.key, (id = keyIds.size));
    return id;
  });
  const seenAt = new Array<number>(keyIds.size).fill(0);
  let stamp = 0;

  const baseUsed = loads.filter((l) => l.count > 0).length;
  const pick: number[] = new Array(free.length).fill(-1);
  let best: { cost: number; pick: number[] } | null = null;
  let nodes = 0;
  let exhausted = false;
  // Lexicographic: fewest missing outputs, then fewest outputs in all.
  const VIRTUAL = 1000;

  const canJoin = (d: RigDevice, solo: boolean, slot: Slot, load: Load): boolean => {
    if (load.count === 0) return fitsAlone(d, slot);
    if (solo || load.solo || load.count >= rules.maxDaisyChain) return false;
    if (!slot.virtual && (slot.voltage !== d.voltage || slot.supply !== d.supply || needsReversal(d, slot))) return false;
    if (slot.virtual && !sameNeeds(d, slot.index)) return false;
    return load.ma + d.budgetMa <= slot.ratingMa;
  };
  // A virtual output holds devices of one voltage, supply and polarity, as a real one would.
  const virtualNeeds = new Map<number, RigDevice>();
  const sameNeeds = (d: RigDevice, index: number) => {
    const first = virtualNeeds.get(index);
    return !first || (first.voltage === d.voltage && first.supply === d.supply && first.polarity === d.polarity);
  };

  // Suffix counts for the lower bound: what is still to place from device i on.
  const mustVirtual = free.map(({ d }) => !real.some((slot) => fitsAlone(d, slot)));
  const suffix = (test: (i: number) => boolean) => {
    const out = new Array(free.length + 1).fill(0);
    for (let i = free.length - 1; i >= 0; i--) out[i] = out[i + 1] + (test(i) ? 1 : 0);
    return out;
  };
  const soloLeft = suffix((i) => free[i].solo);
  const chainLeft = suffix((i) => !free[i].solo);
  const virtualSoloLeft = suffix((i) => mustVirtual[i] && free[i].solo);
  const virtualChainLeft = suffix((i) => mustVirtual[i] && !free[i].solo);
  const chain = rules.maxDaisyChain;

  /**
   * A lower bound on the cost of any completion: every device that must be alone opens an output,
   * the rest fill the free places of open daisy chains before opening outputs of `chain` places,
   * and devices no real output can take open virtual ones.
   */
  // The free places of open daisy chains (on real and on virtual outputs) and the empty real
  // outputs, summed over every output: kept up to date as the search places and lifts devices
  // (`count` takes an output's share out before its load changes, and puts it back after).
  let freePlaces = 0;
  let freeVirtualPlaces = 0;
  let realPlaces = 0;
  let realEmpty = 0;
  const count = (s: number, sign: 1 | -1) => {
    const load = loads[s];
    if (load.count === 0) {
      if (!slots[s].virtual) realEmpty += sign;
      return;
    }
    if (load.solo) return;
    const places = sign * (chain - load.count);
    freePlaces += places;
    if (slots[s].virtual) freeVirtualPlaces += places;
    else realPlaces += places;
  };
  for (let s = 0; s < slots.length; s++) count(s, 1);

  const lowerBound = (i: number, cost: number) => {
    // Ignoring voltages and ratings, real outputs hold at most this many more devices; the rest
    // must go to virtual outputs.
    const soloOver = Math.max(0, soloLeft[i] - realEmpty);
    const chainRoom = realPlaces + Math.max(0, realEmpty - soloLeft[i]) * chain + freeVirtualPlaces;
    const newVirtual = Math.max(
      virtualSoloLeft[i] + Math.ceil(Math.max(0, virtualChainLeft[i] - freeVirtualPlaces) / chain),
      soloOver + Math.ceil(Math.max(0, chainLeft[i] - chainRoom) / chain),
    );
    const newOutputs = soloLeft[i] + Math.ceil(Math.max(0, chainLeft[i] - freePlaces) / chain);
    return cost + VIRTUAL * newVirtual + Math.max(newOutputs, newVirtual);
  };

  // Devices alike in every figure the rules read are interchangeable: each takes an output no
  // earlier than the one before it took, so the search never tries the same plan twice.
  const sameAsPrevious = free.map(({ d, solo }, i) => {
    if (i === 0) return false;
    const p = free[i - 1];
    return (
      p.solo === solo && p.d.budgetMa === d.budgetMa && p.d.voltage === d.voltage && p.d.supply === d.supply && p.d.polarity === d.polarity
    );
  });

  /** Whether output a is tried before output b: in use before empty, real before virtual, then the smaller rating. */
  const comesBefore = (a: number, b: number): boolean => {
    const emptyA = loads[a].count === 0;
    if (emptyA !== (loads[b].count === 0)) return !emptyA;
    if (slots[a].virtual !== slots[b].virtual) return !slots[a].virtual;
    return slots[a].ratingMa < slots[b].ratingMa;
  };

  const search = (i: number, cost: number) => {
    if (++nodes > NODE_BUDGET && best) {
      exhausted = true;
      return;
    }
    if (best && lowerBound(i, cost) >= best.cost) return;
    if (i === free.length) {
      best = { cost, pick: [...pick] };
      return;
    }
    const { d, solo } = free[i];
    // Outputs already in use first (costs nothing), then empty ones, smallest rating first; of
    // interchangeable empty outputs only one is tried.
    stamp += 1;
    const order: number[] = [];
    for (let s = sameAsPrevious[i] ? pick[i - 1] : 0; s < slots.length; s++) {
      if (loads[s].count === 0) {
        if (seenAt[keyOf[s]] === stamp) continue;
        seenAt[keyOf[s]] = stamp;
      }
      if (!canJoin(d, solo, slots[s], loads[s])) continue;
      // Inserted in order, after every output it does not come before: a stable sort.
      let at = order.length;
      while (at > 0 && comesBefore(s, order[at - 1])) at--;
      order.splice(at, 0, s);
    }
    for (const s of order) {
      const slot = slots[s];
      const load = loads[s];
      const opens = load.count === 0;
      count(s, -1);
      load.ma += d.budgetMa;
      load.count += 1;
      const wasSolo = load.solo;
      if (solo || needsReversal(d, slot)) load.solo = true;
      count(s, 1);
      if (slot.virtual && opens) virtualNeeds.set(s, d);
      pick[i] = s;
      search(i + 1, cost + (opens ? (slot.virtual ? VIRTUAL + 1 : 1) : 0));
      if (slot.virtual && opens) virtualNeeds.delete(s);
      count(s, -1);
      load.solo = wasSolo;
      load.count -= 1;
      load.ma -= d.budgetMa;
      count(s, 1);
      if (exhausted) return;
    }
  };
  search(0, baseUsed);

  const chosen = (best as { cost: number; pick: number[] } | null)?.pick ?? [];
  const groups = new Map<number, RigDevice[]>();
  free.forEach(({ d }, i) => {
    const s = chosen[i];
    if (s === undefined || s < 0) {
      outputOf.set(d, null);
      return;
    }
    if (slots[s].virtual) {
      outputOf.set(d, null);
      groups.set(s, [...(groups.get(s) ?? []), d]);
    } else {
      outputOf.set(d, s);
    }
  });
  return { outputOf, virtualGroups: [...groups.values()], optimal: !exhausted };
}

/** The output a group stranded on a virtual output would need, in words. */
export function describeMissingOutput(group: RigDevice[], rules: PowerRules): string {
  const first = group[0];
  const total = group.reduce((s, d) => s + d.budgetMa, 0);
  const isolated = group.length === 1 && (ownOutputReason(first, rules) !== null || first.polarity === 'center_positive');
  const kind = `${first.voltage} V ${first.supply.toUpperCase()}${first.supply === 'dc' && first.polarity === 'center_positive' ? ' centre-positive (or an isolated output and a polarity-reversing lead)' : ''}`;
  return `${isolated ? 'isolated ' : ''}output of at least ${total} mA at ${kind}, for ${group.map((d) => d.name).join(', ')}`;
}
