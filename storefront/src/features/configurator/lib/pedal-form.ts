import { z } from 'zod';
import { MAX_PEDALS, MAX_SUPPLY_OUTPUTS, pedalInputSchema, powerOutputSchema, rigWords } from '@loomwright/shared';
import type { PedalInput, PowerOutputInput, RigConfiguration } from '@loomwright/shared';

/**
 * The Pedals step's form, built from the same zod pieces the API validates with, so the player
 * sees the API's own words next to the field.
 */
const countWords = rigWords.pedalCountRange(MAX_PEDALS);

export const pedalFormSchema = z
  .object({
    mode: z.enum(['count', 'list']),
    // Blank until the player says how many: nothing is priced that they did not enter.
    pedalCount: z
      .number({ error: countWords })
      .int({ error: countWords })
      .min(1, { error: countWords })
      .max(MAX_PEDALS, { error: countWords })
      .optional(),
    pedals: z.array(pedalInputSchema).max(MAX_PEDALS, { error: rigWords.tooManyPedals(MAX_PEDALS) }),
    outputs: z.array(powerOutputSchema).max(MAX_SUPPLY_OUTPUTS, { error: rigWords.tooManyOutputs(MAX_SUPPLY_OUTPUTS) }),
  })
  .superRefine((form, ctx) => {
    if (form.mode === 'count' && form.pedalCount === undefined) {
      ctx.addIssue({ code: 'custom', path: ['pedalCount'], message: 'Say how many pedals go on the board, or list them one by one' });
    }
    if (form.mode === 'list' && form.pedals.length === 0) {
      ctx.addIssue({ code: 'custom', path: ['pedals'], message: rigWords.listOrCount });
    }
    form.pedals.forEach((pedal, i) => {
      if ((pedal.widthMm === undefined) !== (pedal.depthMm === undefined)) {
        ctx.addIssue({
          code: 'custom',
          path: ['pedals', i, pedal.widthMm === undefined ? 'widthMm' : 'depthMm'],
          message: rigWords.bothOrNeither,
        });
      }
    });
  });

export type PedalForm = z.infer<typeof pedalFormSchema>;

export function formFromConfiguration(c: RigConfiguration): PedalForm {
  return {
    mode: c.pedals ? 'list' : 'count',
    pedalCount: c.pedalCount ?? (c.pedals?.length || undefined),
    pedals: c.pedals ?? [],
    outputs: c.powerSupply?.outputs ?? [],
  };
}

/** "Output 2 · 9 V DC, 500 mA, isolated": how an output is named in pickers. */
export function outputName(o: Partial<PowerOutputInput>, index: number): string {
  const figures = [
    o.voltage !== undefined ? `${o.voltage} V ${(o.supply ?? 'dc').toUpperCase()}` : null,
    o.currentMa !== undefined ? `${o.currentMa} mA` : null,
    o.isolated ? 'isolated' : null,
  ]
    .filter(Boolean)
    .join(', ');
  return `${o.label || `Output ${index + 1}`}${figures ? ` · ${figures}` : ''}`;
}

/** A pin to an output the supply no longer has is dropped: the plan chooses again. */
const keepPin = <T extends { powerOutput?: number }>(item: T, outputs: number): T => {
  if (item.powerOutput === undefined || item.powerOutput < outputs) return item;
  const { powerOutput: _dropped, ...rest } = item;
  return rest as T;
};

/** Writes a valid form back into the configuration (dropping empty optional figures). */
export function applyForm(c: RigConfiguration, form: PedalForm): RigConfiguration {
  const next: RigConfiguration = { ...c };
  const outputs = form.outputs.length;
  if (c.routing.switcher) next.routing = { ...c.routing, switcher: keepPin(c.routing.switcher, outputs) };
  if (form.mode === 'list') {
    next.pedals = form.pedals.map((p) => keepPin(cleanPedal(p), outputs));
    delete next.pedalCount;
  } else {
    next.pedalCount = form.pedalCount;
    delete next.pedals;
  }
  if (form.outputs.length) next.powerSupply = { outputs: form.outputs.map((o) => clean(o) as PowerOutputInput) };
  else delete next.powerSupply;
  return next;
}

const clean = <T extends object>(value: T): T =>
  Object.fromEntries(Object.entries(value).filter(([, v]) => v !== undefined && v !== '' && !Number.isNaN(v))) as T;

const cleanPedal = (p: PedalInput): PedalInput => clean(p);

/** Empty text in a number field means "I don't know", not zero. */
export const optionalNumber = (value: unknown) => (value === '' || value === null || value === undefined ? undefined : Number(value));
