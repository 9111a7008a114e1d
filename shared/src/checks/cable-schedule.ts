import { figure, plus, timesInt, toFixedText } from '../estimate/exact';
import type { FunctionItem, MaterialsRates } from '../price-book/types';
import type { CableSchedule, PatchCable, RigDevice, SignalChain } from './types';
import { BARREL_CONNECTOR } from './typical-hardware';

/**
 * Every audio patch the routing needs, computed once: the estimate prices these counts and the
 * build sheet prints them. A serial chain of n devices takes n − 1 patches (the player's own
 * instrument and amp cables reach the ends); each switcher loop takes a send and a return patch;
 * each function adds the patches the price book lists for it. Two plugs per patch.
 */
export function cableScheduleOf(chain: SignalChain, functions: FunctionItem[], rates: MaterialsRates): CableSchedule {
  const lengthFeet = figure(rates.patchLengthFeet);
  const spareFeet = figure(rates.spareFeetPerPatch);
  const lengthText = toFixedText(lengthFeet, 2);
  const spareText = toFixedText(spareFeet, 2);
  const byId = new Map<string, RigDevice>();
  for (const d of chain.devices) byId.set(d.id, d);
  const patches: PatchCable[] = [];
  const add = (from: string, to: string, purpose: PatchCable['purpose'], fromId?: string, toId?: string) =>
    patches.push({
      number: patches.length + 1,
      from,
      to,
      fromDevice: fromId ? (byId.get(fromId)?.number ?? null) : null,
      toDevice: toId ? (byId.get(toId)?.number ?? null) : null,
      purpose,
      lengthFeet: lengthText,
      spareFeet: spareText,
      plugs: 2,
    });
  const nameOf = (id: string) => byId.get(id)?.name ?? id;

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
    cableFeet: toFixedText(timesInt(plus(lengthFeet, spareFeet), patches.length), 2),
    spareFeet: toFixedText(timesInt(spareFeet, patches.length), 2),
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
