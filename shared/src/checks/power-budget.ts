import type { PowerOutputInput } from '../estimate/types';
import { DEFAULT_POWER_RULES, describeMissingOutput, outputPolarity, ownOutputReason, planPower } from './power-plan';
import type { PowerAssignment, PowerBudget, PowerOutputLoad, PowerRules, RigDevice, SignalChain } from './types';

/** P = V × I, with I in mA; rounded to the milliwatt for display. */
export const wattsOf = (volts: number, milliamps: number): number => Math.round(volts * milliamps) / 1000;

/** R = V / I (Ohm's law), I in mA; rounded to a tenth of an ohm. Null for no current. */
export const ohmsOf = (volts: number, milliamps: number): number | null =>
  milliamps > 0 ? Math.round((volts * 10000) / milliamps) / 10 : null;

const describe = (d: RigDevice) =>
  `${d.name} (${d.voltage} V${d.supply === 'ac' ? ' AC' : ''}, ${d.budgetMa} mA${d.drawFromMemory ? ' assumed' : ''})`;

/**
 * The power plan: every powered device on an output of the player's supply by the trade's rules
 * (see planPower), pinned choices kept and checked, each output's load against its rating in mA
 * and W, and, when no plan exists, what would fix it.
 */
export function powerBudgetOf(
  chain: SignalChain,
  outputs: PowerOutputInput[] | undefined,
  rules: PowerRules = DEFAULT_POWER_RULES,
): PowerBudget {
  const powered = chain.devices.filter((d) => d.powered);
  const warnings: string[] = [];
  const unknown = powered.filter((d) => d.drawFromMemory);
  // The typical figures are from memory (see typical-hardware.ts); the words say "typical" only.
  if (unknown.length > 0 && chain.fromCount) {
    warnings.push(
      `Power is planned at a typical draw for each of the ${unknown.length} pedals counted; list your pedals on the Pedals step with the figures from their labels or manuals for a firm plan.`,
    );
  } else if (unknown.length > 0) {
    warnings.push(
      `Current draw unknown for ${unknown.map((d) => d.name).join(', ')}: planned at a typical figure; enter the figure from the label or manual on the Pedals step${chain.switcherId && unknown.some((d) => d.id === chain.switcherId) ? ' (the switcher on the Routing step)' : ''}.`,
    );
  }
  const totalDrawMa = powered.reduce((s, d) => s + d.budgetMa, 0);
  const totalDrawW = Math.round(powered.reduce((s, d) => s + d.voltage * d.budgetMa, 0)) / 1000;
  const reasonOf = (d: RigDevice) => ownOutputReason(d, rules);

  if (!outputs || outputs.length === 0) {
    for (const d of powered.filter((p) => p.polarity === 'center_positive')) {
      warnings.push(
        `${d.name} is centre-positive: it needs a polarity-reversing lead on an isolated output of its own; the wrong polarity can damage it.`,
      );
    }
    if (powered.length > 0) warnings.push('No power supply listed: add its outputs to plan the power before you ship it.');
    return {
      status: powered.length === 0 ? 'ok' : 'unknown',
      supplyListed: false,
      outputs: [],
      assignments: powered.map((d) => ({
        device: d.name,
        deviceId: d.id,
        output: null,
        voltage: d.voltage,
        currentMa: d.budgetMa,
        drawFromMemory: d.drawFromMemory,
        pinned: false,
        ownOutputReason: reasonOf(d),
        reversingLead: false,
      })),
      unassigned: [],
      fixes: [],
      optimal: true,
      outputsUsed: 0,
      spareOutputs: 0,
      rules,
      totalDrawMa,
      totalDrawW,
      totalRatingMa: null,
      totalRatingW: null,
      totalHeadroomMa: null,
      totalHeadroomW: null,
      warnings,
    };
  }

  const plan = planPower(powered, outputs, rules);
  const onOutput = outputs.map(() => [] as RigDevice[]);
  for (const d of powered) {
    const o = plan.outputOf.get(d);
    if (o !== null && o !== undefined) onOutput[o].push(d);
  }

  const outputLoads: PowerOutputLoad[] = outputs.map((output, i) => {
    const devices = onOutput[i];
    const loadMa = devices.reduce((s, d) => s + d.budgetMa, 0);
    const voltage = output.voltage;
    const supply = output.supply ?? 'dc';
    const polarity = outputPolarity(output);
    const flags: string[] = [];
    // Only pinned devices can break a rule: the planner never does.
    for (const d of devices) {
      if (d.voltage !== voltage) flags.push(`Voltage mismatch: ${d.name} needs ${d.voltage} V, this output gives ${voltage} V.`);
      if (d.supply !== supply)
        flags.push(`Supply mismatch: ${d.name} needs ${d.supply.toUpperCase()}, this output gives ${supply.toUpperCase()}.`);
      if (d.supply === 'dc' && supply === 'dc' && d.polarity !== polarity && (!output.isolated || devices.length > 1)) {
        flags.push(
          `Polarity: ${d.name} is ${d.polarity === 'center_positive' ? 'centre-positive' : 'centre-negative'}; reversing it is only safe on an isolated output of its own.`,
        );
      }
    }
    if (loadMa > output.currentMa) flags.push(`Overloaded: ${loadMa} mA drawn from a ${output.currentMa} mA output.`);
    if (devices.length > 1) {
      for (const d of devices.filter((x) => reasonOf(x) !== null)) {
        flags.push(`Shared: ${d.name} (${reasonOf(d)}) needs an output of its own.`);
      }
      if (devices.length > rules.maxDaisyChain)
        flags.push(`Daisy chain of ${devices.length}: the shop allows at most ${rules.maxDaisyChain} pedals on one output.`);
    }
    return {
      output: i,
      label: output.label ?? `Output ${i + 1}`,
      voltage,
      supply,
      polarity,
      isolated: output.isolated,
      ratingMa: output.currentMa,
      loadMa,
      headroomMa: output.currentMa - loadMa,
      ratingW: wattsOf(voltage, output.currentMa),
      loadW: wattsOf(voltage, loadMa),
      headroomW: wattsOf(voltage, output.currentMa - loadMa),
      minimumLoadOhms: ohmsOf(voltage, output.currentMa)!,
      loadOhms: ohmsOf(voltage, loadMa),
      devices: devices.map((d) => d.name),
      flags,
    };
  });

  const unassigned: PowerBudget['unassigned'] = [];
  for (const d of powered) {
    if (plan.outputOf.get(d) !== null) continue;
    const pinnedAway = d.powerOutput !== null && d.powerOutput >= outputs.length;
    unassigned.push({
      device: d.name,
      deviceId: d.id,
      reason: pinnedAway ? `output ${d.powerOutput! + 1} is not on the supply` : noOutputReason(d, outputs, rules),
    });
  }
  const fixes =
    plan.virtualGroups.length === 0
      ? []
      : plan.virtualGroups.length === 1
        ? [`One more ${describeMissingOutput(plan.virtualGroups[0], rules)}.`]
        : [
            `A supply with ${plan.virtualGroups.length} more outputs: ${plan.virtualGroups.map((g) => describeMissingOutput(g, rules)).join('; ')}.`,
          ];
  for (const o of outputLoads) {
    if (o.flags.length === 0) continue;
    const pinned = onOutput[o.output].filter((d) => d.powerOutput === o.output).map((d) => d.name);
    fixes.push(`${o.label}: move ${pinned.length ? pinned.join(' or ') : 'a pedal'} to another output, or let the plan choose.`);
  }

  for (const u of unassigned) warnings.push(`${u.device} has no output: ${u.reason}.`);
  for (const o of outputLoads) {
    for (const f of o.flags) {
      warnings.push(
        f.startsWith('Overloaded')
          ? `${o.label}: ${f.replace(/\.$/, '')} (${onOutput[o.output].map(describe).join('; ')}).`
          : `${o.label}: ${f}`,
      );
    }
  }
  const assignments: PowerAssignment[] = powered.map((d) => {
    const o = plan.outputOf.get(d) ?? null;
    return {
      device: d.name,
      deviceId: d.id,
      output: o,
      voltage: d.voltage,
      currentMa: d.budgetMa,
      drawFromMemory: d.drawFromMemory,
      pinned: d.powerOutput !== null,
      ownOutputReason: reasonOf(d),
      reversingLead: o !== null && d.supply === 'dc' && d.polarity !== outputLoads[o].polarity,
    };
  });
  for (const a of assignments.filter((x) => x.reversingLead)) {
    warnings.push(
      `${a.device} is ${powered.find((d) => d.id === a.deviceId)!.polarity === 'center_positive' ? 'centre-positive' : 'centre-negative'}: its lead from ${outputLoads[a.output!].label} is a polarity-reversing one; the wrong polarity can damage it.`,
    );
  }
  if (!outputs.some((o) => o.isolated) && powered.some((d) => reasonOf(d) === 'digital' || d.kind === 'switcher')) {
    warnings.push(
      'None of the outputs is isolated: digital pedals and the switcher share one ground with the rest, a common source of hum.',
    );
  }

  const totalRatingMa = outputs.reduce((s, o) => s + o.currentMa, 0);
  const totalRatingW = Math.round(outputs.reduce((s, o) => s + o.voltage * o.currentMa, 0)) / 1000;
  const outputsUsed = onOutput.filter((d) => d.length > 0).length;
  const problem = unassigned.length > 0 || outputLoads.some((o) => o.flags.length > 0);
  const warning = unknown.length > 0 || assignments.some((a) => a.reversingLead);
  return {
    status: problem ? 'problem' : warning ? 'warning' : 'ok',
    supplyListed: true,
    outputs: outputLoads,
    assignments,
    unassigned,
    fixes,
    optimal: plan.optimal,
    outputsUsed,
    spareOutputs: outputs.length - outputsUsed,
    rules,
    totalDrawMa,
    totalDrawW,
    totalRatingMa,
    totalRatingW,
    totalHeadroomMa: totalRatingMa - totalDrawMa,
    totalHeadroomW: Math.round((totalRatingW - totalDrawW) * 1000) / 1000,
    warnings,
  };
}

/** Why no output of the supply can take a device, in words. */
function noOutputReason(d: RigDevice, outputs: PowerOutputInput[], rules: PowerRules): string {
  const kind = `${d.voltage} V ${d.supply.toUpperCase()}`;
  const matching = outputs.filter((o) => o.voltage === d.voltage && (o.supply ?? 'dc') === d.supply);
  if (matching.length === 0) return `no ${kind} output on the supply`;
  if (!matching.some((o) => o.currentMa >= d.budgetMa)) return `no ${kind} output is rated for its ${d.budgetMa} mA`;
  if (d.supply === 'dc' && !matching.some((o) => outputPolarity(o) === d.polarity || o.isolated)) {
    return `it is ${d.polarity === 'center_positive' ? 'centre-positive' : 'centre-negative'} and no ${kind} output is isolated for a reversing lead`;
  }
  return ownOutputReason(d, rules) !== null
    ? `every ${kind} output that could hold it alone is taken`
    : `every ${kind} output that could hold it is full or at the daisy-chain limit of ${rules.maxDaisyChain}`;
}
