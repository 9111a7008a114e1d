import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { demoPriceBook } from '../price-book/demo-price-book';
import { priceBookSchema } from '../price-book/schema';
import { EstimateInputError } from './errors';
import { estimateRig } from './estimate-rig';
import { parseRigConfiguration, pedalKinds } from './schema';

const base = { surfaceId: 'slate-61', caseId: 'shell-hard', routing: { mode: 'switcher' }, functions: [], level: 'journeyman' };

describe('rigConfigurationSchema', () => {
  it('names the field of every problem in words, and the pedal by its place in the list', () => {
    const result = parseRigConfiguration({
      ...base,
      pedals: [
        { name: 'fuzz', powered: true, inLoop: true, currentMa: -1 },
        { name: '', powered: 'yes', inLoop: false, widthMm: 70 },
      ],
      level: 'grandmaster',
    });
    expect(result.success).toBe(false);
    if (result.success) return;
    expect(result.messages).toEqual(
      expect.arrayContaining([
        'Pedal 1: Current draw must be a number from 0 to 5000 mA',
        'Pedal 2: Pedal name is required',
        'Pedal 2: Powered must be yes or no (true or false)',
        'Choose a builder level: apprentice, journeyman or master',
      ]),
    );
  });

  it('refuses a loop pedal on a serial board and a quick count on a switcher board', () => {
    const serial = parseRigConfiguration({
      ...base,
      routing: { mode: 'serial' },
      pedals: [{ name: 'chorus', powered: true, inLoop: true }],
    });
    expect(serial.success === false && serial.messages).toEqual([
      'Pedal 1: chorus is in a loop, but a board in series has no switcher loops',
    ]);
    const counted = parseRigConfiguration({ ...base, pedalCount: 8 });
    expect(counted.success === false && counted.messages[0]).toBe(
      'A switcher board needs the pedal list, to know which pedals go in loops',
    );
  });

  it('accepts the demo book as a whole price book', () => {
    expect(priceBookSchema.safeParse(demoPriceBook).success).toBe(true);
  });

  // Whatever arrives, validation plus pricing either answers or fails with a message naming a
  // field: nothing else may escape (the API would turn it into a 500).
  it('never lets anything but a field error escape, for arbitrary input', () => {
    const nearlyValid = fc.record({
      surfaceId: fc.oneof(fc.constantFrom(...demoPriceBook.surfaces.map((s) => s.id)), fc.string()),
      caseId: fc.oneof(fc.constantFrom(...demoPriceBook.cases.map((c) => c.id)), fc.anything()),
      routing: fc.record({ mode: fc.constantFrom('serial', 'switcher', 'loop', 3) }),
      pedals: fc.option(
        fc.array(
          fc.record({
            name: fc.string(),
            kind: fc.option(fc.constantFrom(...pedalKinds), { nil: undefined }),
            powered: fc.oneof(fc.boolean(), fc.anything()),
            inLoop: fc.boolean(),
            currentMa: fc.option(fc.oneof(fc.integer({ min: -10, max: 6000 }), fc.double()), { nil: undefined }),
            voltage: fc.option(fc.constantFrom(9, 12, 18, 0, -9, 100), { nil: undefined }),
            powerOutput: fc.option(fc.integer({ min: -1, max: 4 }), { nil: undefined }),
          }),
          { maxLength: 70 },
        ),
        { nil: undefined },
      ),
      pedalCount: fc.option(fc.oneof(fc.integer({ min: -5, max: 80 }), fc.double()), { nil: undefined }),
      functions: fc.array(fc.oneof(fc.constantFrom(...demoPriceBook.functions.map((f) => f.code)), fc.string()), { maxLength: 4 }),
      level: fc.constantFrom('apprentice', 'journeyman', 'master', 'boss'),
      powerSupply: fc.option(
        fc.record({
          outputs: fc.array(
            fc.record({ voltage: fc.constantFrom(9, 12, 18), currentMa: fc.integer({ min: 0, max: 800 }), isolated: fc.boolean() }),
            { maxLength: 4 },
          ),
        }),
        { nil: undefined },
      ),
    });
    fc.assert(
      fc.property(fc.oneof(fc.anything(), nearlyValid), (input) => {
        const parsed = parseRigConfiguration(input);
        if (!parsed.success) {
          expect(parsed.messages.length).toBeGreaterThan(0);
          return;
        }
        try {
          const r = estimateRig(parsed.data, demoPriceBook, { version: 1 });
          expect(Number(r.totalLow)).toBeLessThanOrEqual(Number(r.totalHigh));
        } catch (error) {
          expect(error).toBeInstanceOf(EstimateInputError);
        }
      }),
      { numRuns: 2000 },
    );
  });
});
