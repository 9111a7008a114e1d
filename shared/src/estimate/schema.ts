import { z } from 'zod';
import { builderLevels } from '../domain';
import { label, rigWords as w, rules } from '../words';
import type { PedalKind, RigConfiguration } from './types';

/** A board past this many pedals is not a pedalboard any shop quotes blind (common practice). */
export const MAX_PEDALS = 60;
export const MAX_FUNCTIONS = 20;
export const MAX_SUPPLY_OUTPUTS = 32;

export const pedalKinds = [
  'mini',
  'compact',
  'large',
  'large_digital',
  'tuner',
  'treadle',
  'buffer',
  'switcher',
  'other',
] as const satisfies readonly PedalKind[];

const text = (label: string, max: number) =>
  z
    .string({ error: rules.text(label) })
    .trim()
    .min(1, { error: rules.required(label) })
    .max(max, { error: rules.tooLong(label, max) });

const numberIn = (label: string, min: number, max: number, unit = '', whole = false) => {
  const words = rules.numberFromTo(label, min, max, unit, whole);
  const base = z.number({ error: words });
  return (whole ? base.int({ error: words }) : base).min(min, { error: words }).max(max, { error: words });
};

/** Outputs are numbered from 1 for people (the API counts from 0). */
const outputNumber = (label: string) => {
  const words = `${label} must be one of the supply’s outputs, numbered 1 to ${MAX_SUPPLY_OUTPUTS}`;
  return z
    .number({ error: words })
    .int({ error: words })
    .min(0, { error: words })
    .max(MAX_SUPPLY_OUTPUTS - 1, { error: words });
};

const flag = (label: string) => z.boolean({ error: rules.yesNo(label) });

export const pedalInputSchema = z.object(
  {
    name: text(w.pedalName, 80),
    kind: z.enum(pedalKinds, { error: w.pedalKind(pedalKinds) }).optional(),
    powered: flag(w.powered),
    inLoop: flag(w.inLoop),
    currentMa: numberIn(w.currentDraw, 0, 5000, 'mA').optional(),
    voltage: numberIn(w.voltage, 1, 48, 'V').optional(),
    polarity: z.enum(['center_negative', 'center_positive'], { error: w.polarity }).optional(),
    supply: z.enum(['dc', 'ac'], { error: w.supply }).optional(),
    widthMm: numberIn(w.width, 10, 1500, 'mm').optional(),
    depthMm: numberIn(w.depth, 10, 1500, 'mm').optional(),
    digital: flag(w.digital).optional(),
    powerOutput: outputNumber(w.powerOutput).optional(),
  },
  { error: w.pedalNotAnObject },
);

const polaritySchema = z.enum(['center_negative', 'center_positive'], { error: w.polarity });

/** The player's own loop switcher, when it is not listed among the pedals (Routing step). */
export const switcherInputSchema = z.object(
  {
    name: text(w.switcherName, 80).optional(),
    currentMa: numberIn(w.switcherCurrentDraw, 0, 5000, 'mA').optional(),
    voltage: numberIn(w.switcherVoltage, 1, 48, 'V').optional(),
    polarity: polaritySchema.optional(),
    supply: z.enum(['dc', 'ac'], { error: w.switcherSupply }).optional(),
    widthMm: numberIn(w.switcherWidth, 10, 1500, 'mm').optional(),
    depthMm: numberIn(w.switcherDepth, 10, 1500, 'mm').optional(),
    powerOutput: outputNumber(w.switcherPowerOutput).optional(),
  },
  { error: w.switcherNotAnObject },
);

export const powerOutputSchema = z.object(
  {
    label: text(w.outputLabel, 40).optional(),
    voltage: numberIn(w.outputVoltage, 1, 48, 'V'),
    currentMa: numberIn(w.outputCurrent, 1, 10000, 'mA'),
    isolated: flag(w.isolated),
    supply: z.enum(['dc', 'ac'], { error: w.outputSupply }).optional(),
    polarity: z.enum(['center_negative', 'center_positive'], { error: w.outputPolarity }).optional(),
  },
  { error: w.outputNotAnObject },
);

/**
 * A rig configuration as the storefront sends it and POST /api/estimates takes it. Messages name
 * the field in words; `describeIssues` adds the path. Whether the ids exist in the price book is
 * checked by the engine, which has the book.
 */
export const rigConfigurationSchema = z
  .object(
    {
      surfaceId: text(w.surface, 80),
      caseId: text(w.case, 80),
      routing: z.object(
        {
          mode: z.enum(['serial', 'switcher'], { error: w.routingMode }),
          switcher: switcherInputSchema.optional(),
        },
        { error: w.routingNotAnObject },
      ),
      pedals: z
        .array(pedalInputSchema, { error: w.pedalsList })
        .min(1, { error: w.atLeastOnePedal })
        .max(MAX_PEDALS, { error: w.tooManyPedals(MAX_PEDALS) })
        .optional(),
      pedalCount: numberIn(w.pedalCount, 1, MAX_PEDALS, '', true).optional(),
      functions: z
        .array(text(w.extra, 40), { error: w.extrasList })
        .max(MAX_FUNCTIONS, { error: w.tooManyExtras(MAX_FUNCTIONS) })
        .default([]),
      level: z.enum(builderLevels, { error: w.builderLevel }),
      powerSupply: z
        .object(
          {
            outputs: z
              .array(powerOutputSchema, { error: w.outputsList })
              .max(MAX_SUPPLY_OUTPUTS, { error: w.tooManyOutputs(MAX_SUPPLY_OUTPUTS) }),
          },
          { error: w.powerSupplyNotAnObject },
        )
        .optional(),
    },
    { error: w.configurationNotAnObject },
  )
  .superRefine((config, ctx) => {
    if (config.pedals === undefined && config.pedalCount === undefined) {
      ctx.addIssue({ code: 'custom', path: ['pedals'], message: w.pedalsOrCount });
    }
    if (config.pedals !== undefined && config.pedalCount !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['pedalCount'], message: w.notBoth });
    }
    if (config.pedalCount !== undefined && config.routing.mode === 'switcher') {
      ctx.addIssue({ code: 'custom', path: ['pedalCount'], message: w.switcherNeedsList });
    }
    const seen = new Set<string>();
    config.functions.forEach((code, i) => {
      if (seen.has(code)) ctx.addIssue({ code: 'custom', path: ['functions', i], message: w.extraTwice(code) });
      seen.add(code);
    });
    const outputs = config.powerSupply?.outputs.length ?? 0;
    const ownSwitcher = config.routing.switcher;
    if (ownSwitcher && config.routing.mode === 'serial') {
      ctx.addIssue({ code: 'custom', path: ['routing', 'switcher'], message: w.serialHasNoSwitcher });
    }
    if (ownSwitcher?.powerOutput !== undefined && ownSwitcher.powerOutput >= outputs) {
      ctx.addIssue({
        code: 'custom',
        path: ['routing', 'switcher', 'powerOutput'],
        message: w.noSuchOutput(ownSwitcher.powerOutput, outputs),
      });
    }
    if (ownSwitcher && (ownSwitcher.widthMm === undefined) !== (ownSwitcher.depthMm === undefined)) {
      ctx.addIssue({
        code: 'custom',
        path: ['routing', 'switcher', ownSwitcher.widthMm === undefined ? 'widthMm' : 'depthMm'],
        message: w.bothOrNeither,
      });
    }
    let switchers = 0;
    config.pedals?.forEach((pedal, i) => {
      if (pedal.inLoop && config.routing.mode === 'serial') {
        ctx.addIssue({ code: 'custom', path: ['pedals', i, 'inLoop'], message: w.loopOnSerial(pedal.name) });
      }
      if (pedal.kind === 'switcher') {
        switchers += 1;
        if (config.routing.mode === 'serial') {
          ctx.addIssue({ code: 'custom', path: ['pedals', i, 'kind'], message: w.switcherNeedsRouting });
        } else if (pedal.inLoop) {
          ctx.addIssue({ code: 'custom', path: ['pedals', i, 'inLoop'], message: w.switcherInOwnLoop });
        } else if (switchers > 1) {
          ctx.addIssue({ code: 'custom', path: ['pedals', i, 'kind'], message: w.oneSwitcher });
        }
      }
      if ((pedal.widthMm === undefined) !== (pedal.depthMm === undefined)) {
        ctx.addIssue({
          code: 'custom',
          path: ['pedals', i, pedal.widthMm === undefined ? 'widthMm' : 'depthMm'],
          message: w.bothOrNeither,
        });
      }
      if (pedal.powerOutput !== undefined && pedal.powerOutput >= outputs) {
        ctx.addIssue({ code: 'custom', path: ['pedals', i, 'powerOutput'], message: w.noSuchOutput(pedal.powerOutput, outputs) });
      }
    });
  });

export type RigConfigurationInput = z.input<typeof rigConfigurationSchema>;

/** "pedals[3].currentMa" from ['pedals', 3, 'currentMa']. */
export function issuePath(path: ReadonlyArray<PropertyKey>): string {
  return path.reduce<string>((out, key) => (typeof key === 'number' ? `${out}[${key}]` : out ? `${out}.${String(key)}` : String(key)), '');
}

/** Where in a list a problem sits, in words: "Pedal 4", "Supply output 2", "Item 1". */
export function issuePlace(path: ReadonlyArray<PropertyKey>): string {
  const places: string[] = [];
  path.forEach((key, i) => {
    if (typeof key !== 'number') return;
    const list = path[i - 1];
    places.push(
      list === 'pedals'
        ? w.wherePedal(key)
        : list === 'outputs'
          ? w.whereOutput(key)
          : list === 'functions'
            ? w.whereExtra(key)
            : `${typeof list === 'string' ? label(list).replace(/s$/, '') : 'Entry'} ${key + 1}`,
    );
  });
  return places.join(', ');
}

/**
 * One line per problem, in words a person reads: each message already names its field by its
 * label; a problem inside a list says where ("Pedal 4: Current draw must be …"). The field's
 * path for programs stays on the issue (`issuePath`), never in the words.
 */
export function describeIssues(error: z.ZodError): string[] {
  return error.issues.map((issue) => {
    const place = issuePlace(issue.path);
    return place && !issue.message.startsWith(place) ? `${place}: ${issue.message}` : issue.message;
  });
}

export type ParseResult<T> = { success: true; data: T } | { success: false; messages: string[] };

export function parseRigConfiguration(input: unknown): ParseResult<RigConfiguration> {
  const result = rigConfigurationSchema.safeParse(input);
  if (!result.success) return { success: false, messages: describeIssues(result.error) };
  return { success: true, data: result.data as RigConfiguration };
}
