import { z } from 'zod';
import { builderLevels } from '../domain';
import type { PedalKind, RigConfiguration } from './types';

/** A board past this many pedals is not a pedalboard any shop quotes blind (common practice). */
export const MAX_PEDALS = 60;
export const MAX_FUNCTIONS = 20;
export const MAX_SUPPLY_OUTPUTS = 32;

export const pedalKinds = [
  'mini', 'compact', 'large', 'large_digital', 'tuner', 'treadle', 'buffer', 'switcher', 'other',
] as const satisfies readonly PedalKind[];

const text = (label: string, max: number) =>
  z
    .string({ error: `${label} must be text` })
    .trim()
    .min(1, { error: `${label} is required` })
    .max(max, { error: `${label} must be at most ${max} characters` });

const numberIn = (label: string, min: number, max: number, unit = '', whole = false) => {
  const words = `${label} must be ${whole ? 'a whole number' : 'a number'} from ${min} to ${max}${unit ? ` ${unit}` : ''}`;
  const base = z.number({ error: words });
  return (whole ? base.int({ error: words }) : base).min(min, { error: words }).max(max, { error: words });
};

const flag = (label: string) => z.boolean({ error: `${label} must be true or false` });

export const pedalInputSchema = z.object(
  {
    name: text('Pedal name', 80),
    kind: z.enum(pedalKinds, { error: `Pedal kind must be one of ${pedalKinds.join(', ')}` }).optional(),
    powered: flag('Powered'),
    inLoop: flag('In a switcher loop'),
    currentMa: numberIn('Current draw', 0, 5000, 'mA').optional(),
    voltage: numberIn('Voltage', 1, 48, 'V').optional(),
    polarity: z.enum(['center_negative', 'center_positive'], { error: 'Polarity must be center_negative or center_positive' }).optional(),
    supply: z.enum(['dc', 'ac'], { error: 'Supply must be dc or ac' }).optional(),
    widthMm: numberIn('Width', 10, 1500, 'mm').optional(),
    depthMm: numberIn('Depth', 10, 1500, 'mm').optional(),
    digital: flag('Digital').optional(),
    powerOutput: numberIn('Power output', 0, MAX_SUPPLY_OUTPUTS - 1, '', true).optional(),
  },
  { error: 'Each pedal must be an object with a name' },
);

const polaritySchema = z.enum(['center_negative', 'center_positive'], { error: 'Polarity must be center_negative or center_positive' });

/** The player's own loop switcher, when it is not listed among the pedals (Routing step). */
export const switcherInputSchema = z.object(
  {
    name: text('Switcher name', 80).optional(),
    currentMa: numberIn('Switcher current draw', 0, 5000, 'mA').optional(),
    voltage: numberIn('Switcher voltage', 1, 48, 'V').optional(),
    polarity: polaritySchema.optional(),
    supply: z.enum(['dc', 'ac'], { error: 'Switcher supply must be dc or ac' }).optional(),
    widthMm: numberIn('Switcher width', 10, 1500, 'mm').optional(),
    depthMm: numberIn('Switcher depth', 10, 1500, 'mm').optional(),
    powerOutput: numberIn('Switcher power output', 0, MAX_SUPPLY_OUTPUTS - 1, '', true).optional(),
  },
  { error: 'The switcher must be an object such as { "currentMa": 300 }' },
);

export const powerOutputSchema = z.object(
  {
    label: text('Output label', 40).optional(),
    voltage: numberIn('Output voltage', 1, 48, 'V'),
    currentMa: numberIn('Output current rating', 1, 10000, 'mA'),
    isolated: flag('Isolated'),
    supply: z.enum(['dc', 'ac'], { error: 'Output supply must be dc or ac' }).optional(),
    polarity: z.enum(['center_negative', 'center_positive'], { error: 'Output polarity must be center_negative or center_positive' }).optional(),
  },
  { error: 'Each supply output must be an object with voltage, currentMa and isolated' },
);

/**
 * A rig configuration as the storefront sends it and POST /api/estimates takes it. Messages name
 * the field in words; `describeIssues` adds the path. Whether the ids exist in the price book is
 * checked by the engine, which has the book.
 */
export const rigConfigurationSchema = z
  .object(
    {
      surfaceId: text('Surface (surfaceId)', 80),
      caseId: text('Case (caseId)', 80),
      routing: z.object(
        {
          mode: z.enum(['serial', 'switcher'], { error: 'Routing mode must be serial or switcher' }),
          switcher: switcherInputSchema.optional(),
        },
        { error: 'Routing must be an object such as { "mode": "serial" }' },
      ),
      pedals: z
        .array(pedalInputSchema, { error: 'Pedals must be a list' })
        .min(1, { error: 'List at least one pedal' })
        .max(MAX_PEDALS, { error: `A board takes at most ${MAX_PEDALS} pedals here; ask the shop about anything larger` })
        .optional(),
      pedalCount: numberIn('Pedal count', 1, MAX_PEDALS, '', true).optional(),
      functions: z
        .array(text('Function code', 40), { error: 'Functions must be a list of function codes' })
        .max(MAX_FUNCTIONS, { error: `At most ${MAX_FUNCTIONS} functions` })
        .default([]),
      level: z.enum(builderLevels, { error: `Builder level must be one of ${builderLevels.join(', ')}` }),
      powerSupply: z
        .object(
          {
            outputs: z
              .array(powerOutputSchema, { error: 'Supply outputs must be a list' })
              .max(MAX_SUPPLY_OUTPUTS, { error: `A supply lists at most ${MAX_SUPPLY_OUTPUTS} outputs` }),
          },
          { error: 'Power supply must be an object such as { "outputs": [...] }' },
        )
        .optional(),
    },
    { error: 'The configuration must be a JSON object' },
  )
  .superRefine((config, ctx) => {
    if (config.pedals === undefined && config.pedalCount === undefined) {
      ctx.addIssue({ code: 'custom', path: ['pedals'], message: 'List the pedals, or give a pedal count' });
    }
    if (config.pedals !== undefined && config.pedalCount !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['pedalCount'], message: 'Give either the pedal list or a pedal count, not both' });
    }
    if (config.pedalCount !== undefined && config.routing.mode === 'switcher') {
      ctx.addIssue({ code: 'custom', path: ['pedalCount'], message: 'A switcher board needs the pedal list, to know which pedals go in loops' });
    }
    const seen = new Set<string>();
    config.functions.forEach((code, i) => {
      if (seen.has(code)) ctx.addIssue({ code: 'custom', path: ['functions', i], message: `Function ${code} is listed twice` });
      seen.add(code);
    });
    const outputs = config.powerSupply?.outputs.length ?? 0;
    const ownSwitcher = config.routing.switcher;
    if (ownSwitcher && config.routing.mode === 'serial') {
      ctx.addIssue({ code: 'custom', path: ['routing', 'switcher'], message: 'A serial board has no switcher; choose switcher routing or leave the switcher out' });
    }
    if (ownSwitcher?.powerOutput !== undefined && ownSwitcher.powerOutput >= outputs) {
      ctx.addIssue({ code: 'custom', path: ['routing', 'switcher', 'powerOutput'], message: `Power output ${ownSwitcher.powerOutput} is not one of the supply's ${outputs} outputs (numbered from 0)` });
    }
    if (ownSwitcher && (ownSwitcher.widthMm === undefined) !== (ownSwitcher.depthMm === undefined)) {
      ctx.addIssue({ code: 'custom', path: ['routing', 'switcher', ownSwitcher.widthMm === undefined ? 'widthMm' : 'depthMm'], message: 'Give both width and depth, or neither' });
    }
    let switchers = 0;
    config.pedals?.forEach((pedal, i) => {
      if (pedal.inLoop && config.routing.mode === 'serial') {
        ctx.addIssue({ code: 'custom', path: ['pedals', i, 'inLoop'], message: `${pedal.name} is in a loop, but a serial board has no switcher loops` });
      }
      if (pedal.kind === 'switcher') {
        switchers += 1;
        if (config.routing.mode === 'serial') {
          ctx.addIssue({ code: 'custom', path: ['pedals', i, 'kind'], message: 'A loop switcher needs switcher routing' });
        } else if (pedal.inLoop) {
          ctx.addIssue({ code: 'custom', path: ['pedals', i, 'inLoop'], message: 'The switcher cannot sit in its own loop' });
        } else if (switchers > 1) {
          ctx.addIssue({ code: 'custom', path: ['pedals', i, 'kind'], message: 'One loop switcher per board' });
        }
      }
      if ((pedal.widthMm === undefined) !== (pedal.depthMm === undefined)) {
        ctx.addIssue({ code: 'custom', path: ['pedals', i, pedal.widthMm === undefined ? 'widthMm' : 'depthMm'], message: 'Give both width and depth, or neither' });
      }
      if (pedal.powerOutput !== undefined && pedal.powerOutput >= outputs) {
        ctx.addIssue({ code: 'custom', path: ['pedals', i, 'powerOutput'], message: `Power output ${pedal.powerOutput} is not one of the supply's ${outputs} outputs (numbered from 0)` });
      }
    });
  });

export type RigConfigurationInput = z.input<typeof rigConfigurationSchema>;

/** "pedals[3].currentMa" from ['pedals', 3, 'currentMa']. */
export function issuePath(path: ReadonlyArray<PropertyKey>): string {
  return path.reduce<string>((out, key) => (typeof key === 'number' ? `${out}[${key}]` : out ? `${out}.${String(key)}` : String(key)), '');
}

/** One line per problem, each naming its field: what the API answers with a 400. */
export function describeIssues(error: z.ZodError): string[] {
  return error.issues.map((issue) => {
    const path = issuePath(issue.path);
    // A message that already opens with its field ("hours must be more than 0") is not prefixed again.
    return path && !issue.message.startsWith(path) ? `${path}: ${issue.message}` : issue.message;
  });
}

export type ParseResult<T> = { success: true; data: T } | { success: false; messages: string[] };

export function parseRigConfiguration(input: unknown): ParseResult<RigConfiguration> {
  const result = rigConfigurationSchema.safeParse(input);
  if (!result.success) return { success: false, messages: describeIssues(result.error) };
  return { success: true, data: result.data as RigConfiguration };
}
