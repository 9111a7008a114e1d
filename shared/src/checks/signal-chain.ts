import type { PedalInput, PedalKind, RigConfiguration } from '../estimate/types';
import type { RigDevice, SignalChain } from './types';
import { DEFAULT_VOLTAGE, typicalHardware } from './typical-hardware';

/** A pedal listed without a kind is recognised by the usual words in its name, else counted as a plain pedal. */
function kindOf(pedal: PedalInput): PedalKind {
  if (pedal.kind) return pedal.kind;
  const name = pedal.name.toLowerCase();
  if (/\btuner\b/.test(name)) return 'tuner';
  if (/\b(wah|volume|expression)\b/.test(name)) return 'treadle';
  if (/\bbuffer\b/.test(name)) return 'buffer';
  if (/\bmini\b/.test(name)) return 'mini';
  return 'other';
}

function deviceFrom(pedal: PedalInput, listIndex: number | null, loop: number | null): RigDevice {
  const kind = kindOf(pedal);
  const typical = typicalHardware[kind];
  const hasFootprint = pedal.widthMm !== undefined && pedal.depthMm !== undefined;
  return {
    id: listIndex === null ? 'switcher' : `p${listIndex + 1}`,
    number: 0,
    listIndex,
    name: pedal.name,
    kind,
    powered: pedal.powered,
    loop,
    voltage: pedal.voltage ?? DEFAULT_VOLTAGE,
    supply: pedal.supply ?? 'dc',
    polarity: pedal.polarity ?? 'center_negative',
    currentMa: pedal.currentMa ?? null,
    budgetMa: pedal.powered ? (pedal.currentMa ?? typical.currentMa) : 0,
    drawFromMemory: pedal.powered && pedal.currentMa === undefined,
    widthMm: hasFootprint ? pedal.widthMm! : typical.widthMm,
    depthMm: hasFootprint ? pedal.depthMm! : typical.depthMm,
    footprintFromMemory: !hasFootprint,
    powerOutput: pedal.powerOutput ?? null,
    digital: pedal.digital ?? (kind === 'large_digital' || kind === 'switcher' || /\bdigital\b/i.test(pedal.name)),
  };
}

/** The player's list, or the quick count spelled out as plain powered pedals in series. */
export function listedPedals(config: RigConfiguration): PedalInput[] {
  if (config.pedals && config.pedals.length > 0) return config.pedals;
  return Array.from({ length: config.pedalCount ?? 0 }, (_, i) => ({
    name: `Pedal ${i + 1}`,
    kind: 'other' as const,
    powered: true,
    inLoop: false,
  }));
}

/**
 * The board in signal order. On a switcher board the loop pedals hang off the switcher, which
 * sits in the main chain where the player listed it, or else where the first loop pedal was.
 * Every pedal wired through the switcher takes a loop of its own.
 */
export function signalChainOf(config: RigConfiguration): SignalChain {
  const pedals = listedPedals(config);
  const devices: RigDevice[] = [];
  const main: string[] = [];
  const loops: SignalChain['loops'] = [];
  if (config.routing.mode === 'serial') {
    pedals.forEach((pedal, i) => {
      const device = deviceFrom(pedal, i, null);
      devices.push(device);
      main.push(device.id);
    });
    return numbered({ routing: 'serial', devices, main, loops, switcherId: null, fromCount: !config.pedals?.length });
  }

  const listedSwitcher = pedals.findIndex((p) => kindOf(p) === 'switcher');
  let switcher: RigDevice;
  if (listedSwitcher >= 0) {
    switcher = deviceFrom(pedals[listedSwitcher], listedSwitcher, null);
  } else {
    // The player's own figures for a switcher they did not list as a pedal (Routing step).
    const own = config.routing.switcher ?? {};
    switcher = deviceFrom({ ...own, name: own.name ?? 'Loop switcher', kind: 'switcher', powered: true, inLoop: false }, null, null);
  }
  let switcherPlaced = false;
  const placeSwitcher = () => {
    if (switcherPlaced) return;
    switcherPlaced = true;
    devices.push(switcher);
    main.push(switcher.id);
  };
  pedals.forEach((pedal, i) => {
    if (i === listedSwitcher) return placeSwitcher();
    if (pedal.inLoop) {
      if (listedSwitcher < 0) placeSwitcher();
      const device = deviceFrom(pedal, i, loops.length + 1);
      devices.push(device);
      loops.push({ loop: device.loop!, deviceId: device.id });
      return;
    }
    const device = deviceFrom(pedal, i, null);
    devices.push(device);
    main.push(device.id);
  });
  placeSwitcher();
  return numbered({ routing: 'switcher', devices, main, loops, switcherId: switcher.id, fromCount: !config.pedals?.length });
}

/** Device ids in the order the signal meets them: the main chain, each loop right after the switcher. */
export function signalOrder(chain: Pick<SignalChain, 'main' | 'loops' | 'switcherId'>): string[] {
  const order: string[] = [];
  for (const id of chain.main) {
    order.push(id);
    if (id === chain.switcherId) for (const { deviceId } of chain.loops) order.push(deviceId);
  }
  return order;
}

/**
 * Numbers the devices in signal order (as signalOrder lists them). The chain is the one built
 * above: its main chain is its devices outside the loops, in their order, and its loops are the
 * loop devices in theirs, so the order needs no lookup by id.
 */
function numbered(chain: SignalChain): SignalChain {
  let n = 0;
  for (const d of chain.devices) {
    if (d.loop !== null) continue;
    d.number = ++n;
    if (d.id === chain.switcherId) for (const l of chain.devices) if (l.loop !== null) l.number = ++n;
  }
  return chain;
}

export function deviceById(chain: SignalChain, id: string): RigDevice {
  const device = chain.devices.find((d) => d.id === id);
  if (!device) throw new Error(`No device ${id} in the chain`);
  return device;
}
