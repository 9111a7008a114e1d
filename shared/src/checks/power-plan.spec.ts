import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { PedalInput, PowerOutputInput, RigConfiguration } from '../estimate/types';
import { powerBudgetOf } from './power-budget';
import { DEFAULT_POWER_RULES, planPower } from './power-plan';
import { signalChainOf } from './signal-chain';
import { seriesOfPedals } from '../estimate/reference-rigs.fixture';
import type { PowerRules, RigDevice } from './types';

/*
 * The rules the plan must obey, written out plainly here as an independent check (none of them
 * has a published source; they are common practice in the trade, no published source):
 *  - a pedal takes the voltage and AC/DC its label states, from an output giving exactly that;
 *  - an output's load (sum of draws) stays within its current rating (the output's rating is
 *    its limit: the supply maker's figure; P = V × I gives the same bound in watts);
 *  - digital pedals, the switcher and pedals over the price book's high-draw mark are alone on
 *    their output;
 *  - a pedal of the other barrel polarity needs a reversing lead, only on an isolated output of
 *    its own (on a shared ground the reversed barrel shorts through the cable shields);
 *  - a daisy chain holds at most the price book's limit.
 */
function validAssignment(devices: RigDevice[], outputs: PowerOutputInput[], rules: PowerRules, at: number[]): boolean {
  const groups = outputs.map(() => [] as RigDevice[]);
  devices.forEach((d, i) => groups[at[i]].push(d));
  return groups.every((group, o) => {
    const out = outputs[o];
    if (group.length === 0) return true;
    if (group.length > rules.maxDaisyChain) return false;
    if (group.reduce((s, d) => s + d.budgetMa, 0) > out.currentMa) return false;
    return group.every((d) => {
      if (d.voltage !== out.voltage || d.supply !== (out.supply ?? 'dc')) return false;
      const alone = d.kind === 'switcher' || d.digital || d.budgetMa > rules.highDrawMa;
      const reversed = d.supply === 'dc' && d.polarity !== (out.polarity ?? 'center_negative');
      if ((alone || reversed) && group.length > 1) return false;
      if (reversed && !out.isolated) return false;
      return true;
    });
  });
}

/** Every assignment of devices to outputs (outputs^devices of them): the fewest outputs any valid one uses, or null. */
function bruteForceFewestOutputs(devices: RigDevice[], outputs: PowerOutputInput[], rules: PowerRules): number | null {
  let best: number | null = null;
  const at = new Array(devices.length).fill(0);
  const total = outputs.length ** devices.length;
  for (let n = 0; n < total; n++) {
    let rest = n;
    for (let i = 0; i < devices.length; i++) {
      at[i] = rest % outputs.length;
      rest = Math.floor(rest / outputs.length);
    }
    if (!validAssignment(devices, outputs, rules, at)) continue;
    const used = new Set(at).size;
    if (best === null || used < best) best = used;
  }
  return best;
}

const serial = (pedals: PedalInput[], outputs: PowerOutputInput[]) => seriesOfPedals(pedals, { outputs });

const voltageArb = fc.constantFrom(9, 9, 9, 12, 18);
const pedalArb = fc.record({
  name: fc.constantFrom('fuzz', 'drive', 'chorus', 'delay', 'tremolo'),
  powered: fc.constant(true),
  inLoop: fc.constant(false),
  currentMa: fc.constantFrom(5, 10, 30, 60, 100, 150, 300, 500),
  voltage: voltageArb,
  digital: fc.boolean(),
  polarity: fc.constantFrom<'center_negative' | 'center_positive'>(
    'center_negative',
    'center_negative',
    'center_negative',
    'center_positive',
  ),
  supply: fc.constantFrom<'dc' | 'ac'>('dc', 'dc', 'dc', 'dc', 'ac'),
}) satisfies fc.Arbitrary<PedalInput>;
const outputArb = fc.record({
  voltage: voltageArb,
  currentMa: fc.constantFrom(100, 250, 300, 500),
  isolated: fc.boolean(),
  supply: fc.constantFrom<'dc' | 'ac'>('dc', 'dc', 'dc', 'dc', 'ac'),
}) satisfies fc.Arbitrary<PowerOutputInput>;
const rulesArb = fc.record({ maxDaisyChain: fc.integer({ min: 1, max: 3 }), highDrawMa: fc.constantFrom(100, 150) });
const smallRig = fc.record({
  pedals: fc.array(pedalArb, { minLength: 1, maxLength: 5 }),
  outputs: fc.array(outputArb, { minLength: 1, maxLength: 4 }),
  rules: rulesArb,
});

describe('power plan against a brute-force search over every assignment (small rigs)', () => {
  it('uses the fewest outputs any valid assignment uses, and finds one whenever one exists', () => {
    fc.assert(
      fc.property(smallRig, ({ pedals, outputs, rules }) => {
        const devices = signalChainOf(serial(pedals, outputs)).devices;
        const best = bruteForceFewestOutputs(devices, outputs, rules);
        const budget = powerBudgetOf(signalChainOf(serial(pedals, outputs)), outputs, rules);
        if (best === null) {
          expect(budget.unassigned.length).toBeGreaterThan(0);
          expect(budget.fixes.length).toBeGreaterThan(0);
          expect(budget.status).toBe('problem');
        } else {
          expect(budget.unassigned).toEqual([]);
          expect(budget.outputsUsed).toBe(best);
          expect(budget.optimal).toBe(true);
          const at = budget.assignments.map((a) => a.output!);
          expect(validAssignment(devices, outputs, rules, at)).toBe(true);
        }
      }),
      { numRuns: 400 },
    );
  });

  it('never overloads an output or mismatches a voltage, AC/DC or polarity, on larger rigs too', () => {
    const largerRig = fc.record({
      pedals: fc.array(pedalArb, { minLength: 1, maxLength: 16 }),
      outputs: fc.array(outputArb, { minLength: 1, maxLength: 10 }),
      rules: rulesArb,
    });
    fc.assert(
      fc.property(largerRig, ({ pedals, outputs, rules }) => {
        const budget = powerBudgetOf(signalChainOf(serial(pedals, outputs)), outputs, rules);
        for (const o of budget.outputs) {
          expect(o.loadMa).toBeLessThanOrEqual(o.ratingMa);
          expect(o.flags).toEqual([]);
        }
        const devices = signalChainOf(serial(pedals, outputs)).devices;
        for (const a of budget.assignments) {
          if (a.output === null) continue;
          const d = devices.find((x) => x.id === a.deviceId)!;
          expect(d.voltage).toBe(outputs[a.output].voltage);
          expect(d.supply).toBe(outputs[a.output].supply ?? 'dc');
        }
      }),
      { numRuns: 200 },
    );
  });

  it('when no plan exists, the outputs it names as the fix make one exist', () => {
    fc.assert(
      fc.property(smallRig, ({ pedals, outputs, rules }) => {
        const devices = signalChainOf(serial(pedals, outputs)).devices;
        const plan = planPower(devices, outputs, rules);
        const added: PowerOutputInput[] = plan.virtualGroups.map((group) => ({
          voltage: group[0].voltage,
          supply: group[0].supply,
          polarity: group[0].polarity,
          isolated: true,
          currentMa: group.reduce((s, d) => s + d.budgetMa, 0),
        }));
        const fixed = powerBudgetOf(signalChainOf(serial(pedals, [...outputs, ...added])), [...outputs, ...added], rules);
        expect(fixed.unassigned).toEqual([]);
        expect(fixed.status).not.toBe('problem');
      }),
      { numRuns: 300 },
    );
  });

  it('keeps every pinned pedal where the player put it, and plans the rest around it without breaking a rule', () => {
    const pinnedRig = smallRig.chain((rig) =>
      fc.record({
        rig: fc.constant(rig),
        pins: fc.array(fc.option(fc.integer({ min: 0, max: rig.outputs.length - 1 }), { nil: undefined }), {
          minLength: rig.pedals.length,
          maxLength: rig.pedals.length,
        }),
      }),
    );
    fc.assert(
      fc.property(pinnedRig, ({ rig, pins }) => {
        const pedals = rig.pedals.map((p, i) => (pins[i] === undefined ? p : { ...p, powerOutput: pins[i] }));
        const budget = powerBudgetOf(signalChainOf(serial(pedals, rig.outputs)), rig.outputs, rig.rules);
        budget.assignments.forEach((a, i) => {
          if (pins[i] !== undefined) {
            expect(a.output).toBe(pins[i]);
            expect(a.pinned).toBe(true);
          }
        });
        // An output the plan alone filled never carries a flag; a flagged one holds a pinned pedal.
        for (const o of budget.outputs) {
          if (o.flags.length === 0) continue;
          expect(budget.assignments.some((a) => a.output === o.output && a.pinned)).toBe(true);
        }
      }),
      { numRuns: 300 },
    );
  });
});

const isolated8: PowerOutputInput[] = [
  { voltage: 9, currentMa: 500, isolated: true, label: 'A' },
  { voltage: 9, currentMa: 500, isolated: true, label: 'B' },
  { voltage: 9, currentMa: 250, isolated: true, label: 'C' },
  { voltage: 9, currentMa: 250, isolated: true, label: 'D' },
  { voltage: 9, currentMa: 100, isolated: true, label: 'E' },
  { voltage: 9, currentMa: 100, isolated: true, label: 'F' },
  { voltage: 9, currentMa: 100, isolated: true, label: 'G' },
  { voltage: 9, currentMa: 100, isolated: true, label: 'H' },
];

describe('power plan on a full rig', () => {
  // A 12-pedal switcher rig on an 8-output isolated supply; draws are typical label figures for
  // each sort of pedal (from memory, manufacturer-neutral).
  const pedals: PedalInput[] = [
    { name: 'Tuner', kind: 'tuner', powered: true, inLoop: false, currentMa: 60 },
    { name: 'Wah', kind: 'treadle', powered: true, inLoop: false, currentMa: 10 },
    { name: 'Compressor', powered: true, inLoop: true, currentMa: 15 },
    { name: 'Overdrive one', powered: true, inLoop: true, currentMa: 8 },
    { name: 'Overdrive two', powered: true, inLoop: true, currentMa: 12 },
    { name: 'Fuzz', powered: true, inLoop: true, currentMa: 5 },
    { name: 'Chorus', powered: true, inLoop: true, currentMa: 40 },
    { name: 'Phaser', powered: true, inLoop: true, currentMa: 20 },
    { name: 'Tremolo', powered: true, inLoop: true, currentMa: 25 },
    { name: 'Delay', kind: 'large_digital', powered: true, inLoop: true, currentMa: 300 },
    { name: 'Reverb', kind: 'large_digital', powered: true, inLoop: true, currentMa: 180 },
    { name: 'Looper', powered: true, inLoop: true, currentMa: 90, digital: true },
  ];
  const config: RigConfiguration = {
    surfaceId: 's',
    caseId: 'c',
    routing: { mode: 'switcher', switcher: { currentMa: 350 } },
    pedals,
    functions: [],
    level: 'master',
    powerSupply: { outputs: isolated8 },
  };

  it('puts the 300 mA delay on a 500 mA output and the switcher (its draw entered) on an output of its own', () => {
    const budget = powerBudgetOf(signalChainOf(config), isolated8);
    const delay = budget.assignments.find((a) => a.device === 'Delay')!;
    expect(isolated8[delay.output!].currentMa).toBeGreaterThanOrEqual(300);
    const switcher = budget.assignments.find((a) => a.deviceId === 'switcher')!;
    expect(switcher.currentMa).toBe(350);
    expect(switcher.drawFromMemory).toBe(false);
    expect(budget.outputs[switcher.output!].devices).toEqual(['Loop switcher']);
    for (const name of ['Delay', 'Reverb', 'Looper']) {
      const a = budget.assignments.find((x) => x.device === name)!;
      expect(budget.outputs[a.output!].devices).toEqual([name]);
    }
    expect(budget.status).toBe('ok');
    expect(budget.outputs.every((o) => o.loadMa <= o.ratingMa)).toBe(true);
  });

  it('says what would fix a supply that is one output short', () => {
    const short = isolated8.slice(0, 4);
    const budget = powerBudgetOf(signalChainOf({ ...config, powerSupply: { outputs: short } }), short);
    expect(budget.status).toBe('problem');
    expect(budget.fixes.join(' ')).toMatch(/more outputs|One more/);
    expect(budget.fixes[0]).toMatch(/at least \d+ mA at 9 V DC/);
  });

  it('names one more isolated output of at least 300 mA when only the delay has nowhere to go', () => {
    const outputs: PowerOutputInput[] = [
      { voltage: 9, currentMa: 250, isolated: true },
      { voltage: 9, currentMa: 250, isolated: true },
    ];
    const budget = powerBudgetOf(
      signalChainOf(
        serial(
          [
            { name: 'Delay', kind: 'large_digital', powered: true, inLoop: false, currentMa: 300 },
            { name: 'Fuzz', powered: true, inLoop: false, currentMa: 5 },
          ],
          outputs,
        ),
      ),
      outputs,
    );
    expect(budget.fixes).toEqual(['One more isolated output of at least 300 mA at 9 V DC, for Delay.']);
    expect(budget.unassigned[0]).toMatchObject({ device: 'Delay', reason: 'no 9 V DC output is rated for its 300 mA' });
  });

  it('refuses, in words, a pinned choice that overloads an output, and says how to fix it', () => {
    const pinned = pedals.map((p) => (p.name === 'Delay' ? { ...p, powerOutput: 2 } : p));
    const budget = powerBudgetOf(signalChainOf({ ...config, pedals: pinned }), isolated8);
    expect(budget.status).toBe('problem');
    expect(budget.outputs[2].flags).toContain('Overloaded: 300 mA drawn from a 250 mA output.');
    expect(budget.fixes).toContain('C: move Delay to another output, or let the plan choose.');
    expect(budget.assignments.find((a) => a.device === 'Delay')).toMatchObject({ output: 2, pinned: true });
  });

  it('keeps the daisy chain within the price book limit', () => {
    const outputs: PowerOutputInput[] = [
      { voltage: 9, currentMa: 500, isolated: true },
      { voltage: 9, currentMa: 500, isolated: true },
    ];
    const five = ['a', 'b', 'c', 'd', 'e'].map((n) => ({ name: `drive ${n}`, powered: true, inLoop: false, currentMa: 10 }));
    const budget = powerBudgetOf(signalChainOf(serial(five, outputs)), outputs, { ...DEFAULT_POWER_RULES, maxDaisyChain: 3 });
    expect(budget.outputs.map((o) => o.devices.length).sort()).toEqual([2, 3]);
    const tight = powerBudgetOf(signalChainOf(serial(five, outputs)), outputs, { ...DEFAULT_POWER_RULES, maxDaisyChain: 2 });
    expect(tight.unassigned).toHaveLength(1);
    expect(tight.unassigned[0].reason).toContain('daisy-chain limit of 2');
  });

  it('gives a centre-positive pedal an isolated output of its own with a reversing lead, 18 V and AC pedals matching outputs', () => {
    const outputs: PowerOutputInput[] = [
      { voltage: 9, currentMa: 500, isolated: false },
      { voltage: 9, currentMa: 100, isolated: true },
      { voltage: 18, currentMa: 250, isolated: true },
      { voltage: 9, currentMa: 300, isolated: true, supply: 'ac' },
    ];
    const budget = powerBudgetOf(
      signalChainOf(
        serial(
          [
            { name: 'Odd fuzz', powered: true, inLoop: false, currentMa: 5, polarity: 'center_positive' },
            { name: 'Drive', powered: true, inLoop: false, currentMa: 10 },
            { name: 'Preamp', powered: true, inLoop: false, currentMa: 40, voltage: 18 },
            { name: 'Old phaser', powered: true, inLoop: false, currentMa: 60, supply: 'ac' },
          ],
          outputs,
        ),
      ),
      outputs,
    );
    expect(budget.assignments.map((a) => a.output)).toEqual([1, 0, 2, 3]);
    expect(budget.assignments[0].reversingLead).toBe(true);
    expect(budget.warnings.some((w) => w.includes('polarity-reversing'))).toBe(true);
  });
});
