import type { PowerOutputInput } from '../estimate/types';
import type { PowerAssignment, PowerBudget, PowerOutputLoad, RigDevice, SignalChain } from './types';

/** P = V × I, with I in mA; rounded to the milliwatt for display. */
export const wattsOf = (volts: number, milliamps: number): number => Math.round(volts * milliamps) / 1000;

/** R = V / I (Ohm's law), I in mA; rounded to a tenth of an ohm. Null for no current. */
export const ohmsOf = (volts: number, milliamps: number): number | null =>
  milliamps > 0 ? Math.round((volts * 10000) / milliamps) / 10 : null;

const describe = (d: RigDevice) => `${d.name} (${d.voltage} V${d.supply === 'ac' ? ' AC' : ''}, ${d.budgetMa} mA${d.drawFromMemory ? ' assumed' : ''})`;

/**
 * Assigns every powered device to an output of the player's supply and checks each output's load
 * against its rating. Pedals the player already placed keep their output (and a mismatch is
 * flagged); the rest go, largest draw first, to a free output of the same voltage and kind
 * (smallest rating that holds the draw), and only then share an output (a daisy chain).
 */
export function powerBudgetOf(chain: SignalChain, outputs: PowerOutputInput[] | undefined): PowerBudget {
  const powered = chain.devices.filter((d) => d.powered);
  const warnings: string[] = [];
  const unknown = powered.filter((d) => d.drawFromMemory);
  if (unknown.length > 0) {
    warnings.push(
      `Current draw unknown for ${unknown.map((d) => d.name).join(', ')}: budgeted at a typical figure (from memory); check the label or manual.`,
    );
  }
  for (const d of powered.filter((p) => p.polarity === 'center_positive')) {
    warnings.push(`${d.name} is centre-positive: it needs a polarity-reversing lead; the wrong polarity can damage it.`);
  }
  const totalDrawMa = powered.reduce((s, d) => s + d.budgetMa, 0);
  const totalDrawW = Math.round(powered.reduce((s, d) => s + d.voltage * d.budgetMa, 0)) / 1000;

  if (!outputs || outputs.length === 0) {
    if (powered.length > 0) warnings.push("No power supply listed: add its outputs to check the budget before you ship it.");
    return {
      status: powered.length === 0 ? 'ok' : 'unknown',
      supplyListed: false,
      outputs: [],
      assignments: powered.map((d) => ({ device: d.name, output: null, voltage: d.voltage, currentMa: d.budgetMa, drawFromMemory: d.drawFromMemory })),
      unassigned: [],
      totalDrawMa,
      totalDrawW,
      totalRatingMa: null,
      totalRatingW: null,
      totalHeadroomMa: null,
      totalHeadroomW: null,
      warnings,
    };
  }

  const loads: Array<{ output: PowerOutputInput; devices: RigDevice[]; flags: string[]; loadMa: number }> = outputs.map((output) => ({
    output,
    devices: [],
    flags: [],
    loadMa: 0,
  }));
  const assignedTo = new Map<RigDevice, number | null>();
  const unassigned: PowerBudget['unassigned'] = [];
  const supplyOf = (o: PowerOutputInput) => o.supply ?? 'dc';
  const place = (d: RigDevice, i: number) => {
    loads[i].devices.push(d);
    loads[i].loadMa += d.budgetMa;
    assignedTo.set(d, i);
  };

  for (const d of powered) {
    if (d.powerOutput === null) continue;
    const slot = loads[d.powerOutput];
    if (!slot) {
      unassigned.push({ device: d.name, reason: `output ${d.powerOutput + 1} is not on the supply` });
      assignedTo.set(d, null);
      continue;
    }
    place(d, d.powerOutput);
    if (slot.output.voltage !== d.voltage) {
      slot.flags.push(`Voltage mismatch: ${d.name} needs ${d.voltage} V, this output gives ${slot.output.voltage} V.`);
    }
    if (supplyOf(slot.output) !== d.supply) {
      slot.flags.push(`Supply mismatch: ${d.name} needs ${d.supply.toUpperCase()}, this output gives ${supplyOf(slot.output).toUpperCase()}.`);
    }
  }

  const rest = powered.filter((d) => !assignedTo.has(d)).sort((a, b) => b.budgetMa - a.budgetMa);
  for (const d of rest) {
    // Free output holding the draw with the least to spare; else the largest free one; else the
    // matching output with the most headroom left (a daisy chain).
    let holding = -1;
    let largestFree = -1;
    let mostHeadroom = -1;
    loads.forEach((slot, i) => {
      if (slot.output.voltage !== d.voltage || supplyOf(slot.output) !== d.supply) return;
      const rating = slot.output.currentMa;
      if (slot.devices.length === 0) {
        if (rating >= d.budgetMa && (holding < 0 || rating < loads[holding].output.currentMa)) holding = i;
        if (largestFree < 0 || rating > loads[largestFree].output.currentMa) largestFree = i;
      }
      if (mostHeadroom < 0 || rating - slot.loadMa > loads[mostHeadroom].output.currentMa - loads[mostHeadroom].loadMa) mostHeadroom = i;
    });
    const pick = holding >= 0 ? holding : largestFree >= 0 ? largestFree : mostHeadroom;
    if (pick < 0) {
      unassigned.push({ device: d.name, reason: `no ${d.voltage} V ${d.supply.toUpperCase()} output on the supply` });
      assignedTo.set(d, null);
      continue;
    }
    place(d, pick);
  }

  const outputLoads: PowerOutputLoad[] = loads.map(({ output, devices, flags, loadMa }, i) => {
    if (loadMa > output.currentMa) {
      flags.push(`Overloaded: ${loadMa} mA drawn from a ${output.currentMa} mA output.`);
    }
    if (devices.length > 1) {
      flags.push(
        output.isolated
          ? `Shared by ${devices.length} pedals (a daisy chain): keep digital pedals on outputs of their own to avoid noise.`
          : `Shared by ${devices.length} pedals on a non-isolated output: fine for analog pedals, a noise risk for digital ones.`,
      );
    }
    return {
      output: i,
      label: output.label ?? `Output ${i + 1}`,
      voltage: output.voltage,
      supply: supplyOf(output),
      isolated: output.isolated,
      ratingMa: output.currentMa,
      loadMa,
      headroomMa: output.currentMa - loadMa,
      ratingW: wattsOf(output.voltage, output.currentMa),
      loadW: wattsOf(output.voltage, loadMa),
      headroomW: wattsOf(output.voltage, output.currentMa - loadMa),
      minimumLoadOhms: ohmsOf(output.voltage, output.currentMa)!,
      loadOhms: ohmsOf(output.voltage, loadMa),
      devices: devices.map((d) => d.name),
      flags,
    };
  });

  for (const u of unassigned) warnings.push(`${u.device} has no output: ${u.reason}.`);
  for (const o of outputLoads) {
    for (const f of o.flags) {
      if (f.startsWith('Overloaded')) warnings.push(`${o.label}: ${f.replace(/\.$/, '')} (${loads[o.output].devices.map(describe).join('; ')}).`);
      else if (!f.startsWith('Shared')) warnings.push(`${o.label}: ${f}`);
    }
  }

  const totalRatingMa = outputs.reduce((s, o) => s + o.currentMa, 0);
  const totalRatingW = Math.round(outputs.reduce((s, o) => s + o.voltage * o.currentMa, 0)) / 1000;
  const assignments: PowerAssignment[] = powered.map((d) => ({
    device: d.name,
    output: assignedTo.get(d) ?? null,
    voltage: d.voltage,
    currentMa: d.budgetMa,
    drawFromMemory: d.drawFromMemory,
  }));
  const problem = unassigned.length > 0 || outputLoads.some((o) => o.flags.some((f) => !f.startsWith('Shared')));
  const warning = unknown.length > 0 || powered.some((d) => d.polarity === 'center_positive') || outputLoads.some((o) => o.flags.length > 0);
  return {
    status: problem ? 'problem' : warning ? 'warning' : 'ok',
    supplyListed: true,
    outputs: outputLoads,
    assignments,
    unassigned,
    totalDrawMa,
    totalDrawW,
    totalRatingMa,
    totalRatingW,
    totalHeadroomMa: totalRatingMa - totalDrawMa,
    totalHeadroomW: Math.round((totalRatingW - totalDrawW) * 1000) / 1000,
    warnings,
  };
}
