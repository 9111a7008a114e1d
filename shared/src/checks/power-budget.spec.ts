import { describe, expect, it } from 'vitest';
import type { PedalInput } from '../estimate/types';
import { ohmsOf, powerBudgetOf, wattsOf } from './power-budget';
import { signalChainOf } from './signal-chain';
import { seriesOfPedals } from '../estimate/reference-rigs.fixture';

// Electric power P = V × I and Ohm's law R = V / I, as any physics handbook states them (e.g.
// Halliday, Resnick & Walker, "Fundamentals of Physics", the chapter on current and resistance;
// chapter from memory). Worked examples below are by hand.
describe('P = V × I and R = V / I', () => {
  it.each([
    [9, 100, 0.9],
    [9, 500, 4.5],
    [12, 300, 3.6],
    [18, 250, 4.5],
    [9, 1, 0.009],
  ])('%d V at %d mA is %d W', (v, ma, w) => {
    expect(wattsOf(v, ma)).toBe(w);
  });

  it.each([
    [9, 100, 90],
    [9, 500, 18],
    [18, 250, 72],
    [12, 300, 40],
  ])('%d V driving %d mA is a %d Ω load', (v, ma, ohms) => {
    expect(ohmsOf(v, ma)).toBe(ohms);
  });
});

const rig = seriesOfPedals;
const p = (name: string, currentMa: number | undefined, extra: Partial<PedalInput> = {}): PedalInput => ({
  name,
  powered: true,
  inLoop: false,
  currentMa,
  ...extra,
});

describe('power budget', () => {
  it('gives each pedal an output of its own and reports headroom in mA and W per output and in total', () => {
    const config = rig([p('fuzz', 10), p('digital delay', 250), p('tuner', 60)], {
      outputs: [
        { voltage: 9, currentMa: 100, isolated: true },
        { voltage: 9, currentMa: 100, isolated: true },
        { voltage: 9, currentMa: 500, isolated: true },
      ],
    });
    const budget = powerBudgetOf(signalChainOf(config), config.powerSupply!.outputs);
    expect(budget.status).toBe('ok');
    // Largest draw first, to the smallest output that holds it: the delay takes the 500 mA one.
    const delayOut = budget.outputs.find((o) => o.devices.includes('digital delay'))!;
    expect(delayOut).toMatchObject({
      ratingMa: 500,
      loadMa: 250,
      headroomMa: 250,
      ratingW: 4.5,
      loadW: 2.25,
      headroomW: 2.25,
      minimumLoadOhms: 18,
      loadOhms: 36,
    });
    // Totals: 700 mA rated, 320 mA drawn at 9 V: 6.3 W and 2.88 W; headroom 380 mA, 3.42 W.
    expect(budget).toMatchObject({
      totalRatingMa: 700,
      totalDrawMa: 320,
      totalHeadroomMa: 380,
      totalRatingW: 6.3,
      totalDrawW: 2.88,
      totalHeadroomW: 3.42,
    });
  });

  it('flags an overloaded output the player chose: 9 V at 100 mA cannot feed 150 mA (its load would be 60 Ω, below the 90 Ω it is rated for)', () => {
    const config = rig([p('chorus', 80, { powerOutput: 0 }), p('phaser', 70, { powerOutput: 0 })], {
      outputs: [{ voltage: 9, currentMa: 100, isolated: false }],
    });
    const budget = powerBudgetOf(signalChainOf(config), config.powerSupply!.outputs);
    expect(budget.status).toBe('problem');
    expect(budget.outputs[0]).toMatchObject({ loadMa: 150, headroomMa: -50, headroomW: -0.45, minimumLoadOhms: 90, loadOhms: 60 });
    expect(budget.outputs[0].flags.some((f) => f.startsWith('Overloaded'))).toBe(true);
    expect(budget.warnings.some((w) => w.includes('Overloaded'))).toBe(true);
  });

  it('flags a voltage mismatch where the player placed a pedal, and finds no output for an unmatched voltage', () => {
    const config = rig([p('18 V overdrive', 20, { voltage: 18, powerOutput: 0 }), p('12 V preamp', 100, { voltage: 12 })], {
      outputs: [{ voltage: 9, currentMa: 300, isolated: true }],
    });
    const budget = powerBudgetOf(signalChainOf(config), config.powerSupply!.outputs);
    expect(budget.status).toBe('problem');
    expect(budget.outputs[0].flags.some((f) => f.startsWith('Voltage mismatch'))).toBe(true);
    expect(budget.unassigned).toEqual([{ device: '12 V preamp', deviceId: 'p2', reason: 'no 12 V DC output on the supply' }]);
    expect(budget.fixes[0]).toBe('One more output of at least 100 mA at 12 V DC, for 12 V preamp.');
  });

  it('does not put an AC pedal on a DC output, and warns about centre-positive polarity', () => {
    const config = rig([p('vintage AC phaser', 100, { supply: 'ac' }), p('odd fuzz', 5, { polarity: 'center_positive' })], {
      outputs: [
        { voltage: 9, currentMa: 500, isolated: true },
        { voltage: 9, currentMa: 500, isolated: true },
      ],
    });
    const budget = powerBudgetOf(signalChainOf(config), config.powerSupply!.outputs);
    expect(budget.unassigned.map((u) => u.device)).toEqual(['vintage AC phaser']);
    expect(budget.warnings.some((w) => w.includes('centre-positive'))).toBe(true);
  });

  it('warns where a draw is unknown and budgets it at the typical figure (from memory)', () => {
    const config = rig([p('mystery box', undefined, { kind: 'large_digital' })], {
      outputs: [{ voltage: 9, currentMa: 300, isolated: true }],
    });
    const budget = powerBudgetOf(signalChainOf(config), config.powerSupply!.outputs);
    // Typical large digital pedal: up to 500 mA at 9 V (PRODUCT.md's table, from memory).
    expect(budget.assignments[0]).toMatchObject({ currentMa: 500, drawFromMemory: true });
    expect(budget.status).toBe('problem');
    expect(budget.warnings[0]).toContain('Current draw unknown for mystery box');
  });

  it('without a supply listed, reports the draw and says the budget is unknown', () => {
    const config = rig([p('fuzz', 10), p('reverb', 200)]);
    const budget = powerBudgetOf(signalChainOf(config), undefined);
    expect(budget).toMatchObject({ status: 'unknown', supplyListed: false, totalDrawMa: 210, totalDrawW: 1.89, totalRatingMa: null });
  });
});
