import Decimal from 'decimal.js';
import type { FunctionItem, MaterialsRates } from '../price-book/types';
import type { CableSchedule, PatchCable, SignalChain } from './types';
import { BARREL_CONNECTOR } from './typical-hardware';

/**
 * Every audio patch the routing needs, computed once: the estimate prices these counts and the
 * build sheet prints them. A serial chain of n devices takes n − 1 patches (the player's own
 * instrument and amp cables reach the ends); each switcher loop takes a send and a return patch;
 * each function adds the patches the price book lists for it. Two plugs per patch.
 */
export function cableScheduleOf(chain: SignalChain, functions: FunctionItem[], rates: MaterialsRates): CableSchedule {
  const lengthFeet = new Decimal(rates.patchLengthFeet);
  const spareFeet = new Decimal(rates.spareFeetPerPatch);
  const lengthText = lengthFeet.toFixed(2);
  const spareText = spareFeet.toFixed(2);
  const names = new Map(chain.devices.map((d) => [d.id, d.name]));
  const numbers = new Map(chain.devices.map((d) => [d.id, d.number]));
  const patches: PatchCable[] = [];
  const add = (from: string, to: string, purpose: PatchCable['purpose'], fromId?: string, toId?: string) =>
    patches.push({
      number: patches.length + 1,
      from,
      to,
      fromDevice: fromId ? (numbers.get(fromId) ?? null) : null,
      toDevice: toId ? (numbers.get(toId) ?? null) : null,
      purpose,
      lengthFeet: lengthText,
      spareFeet: spareText,
      plugs: 2,
    });
  const nameOf = (id: string) => names.get(id) ?? id;

  for (let i = 0; i + 1 < chain.main.length; i++) {
    add(`${nameOf(chain.main[i])} output`, `${nameOf(chain.main[i + 1])} input`, 'chain', chain.main[i], chain.main[i + 1]);
  }
  if (chain.switcherId) {
    const switcher = nameOf(chain.switcherId);
    for (const { loop, deviceId } of chain.loops) {
      add(`${switcher} loop ${loop} send`, `${nameOf(deviceId)} input`, 'loop_send', chain.switcherId, deviceId);
      add(`${nameOf(deviceId)} output`, `${switcher} loop ${loop} return`, 'loop_return', deviceId, chain.switcherId);
    }
  }
  for (const fn of functions) {
    for (let j = 1; j <= fn.extraPatchCables; j++) {
      add(`${fn.name}: extra patch ${j} of ${fn.extraPatchCables}`, 'routed to suit the function at the bench', 'function');
    }
  }

  const powered = chain.devices.filter((d) => d.powered);
  return {
    patches,
    patchCount: patches.length,
    plugCount: patches.length * 2,
    cableFeet: lengthFeet.plus(spareFeet).times(patches.length).toFixed(2),
    spareFeet: spareFeet.times(patches.length).toFixed(2),
    powerLeads: powered.map((d) => ({
      device: d.name,
      voltage: d.voltage,
      supply: d.supply,
      polarity: d.polarity,
      connector: BARREL_CONNECTOR,
    })),
    barrelPlugCount: powered.length,
  };
}
