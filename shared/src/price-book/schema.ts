import Decimal from 'decimal.js';
import { z } from 'zod';
import { builderLevels, levelRank } from '../domain';
import { isKnownCurrency } from '../estimate/money';
import type { PriceBook } from './types';

const decimalText = (label: string, max: number, places = 4) =>
  z
    .string({ error: `${label} must be a decimal string such as "12.50"` })
    .regex(new RegExp(`^\\d{1,9}(\\.\\d{1,${places}})?$`), {
      error: `${label} must be a decimal string such as "12.50" (not negative)`,
      abort: true,
    })
    .refine((v) => new Decimal(v).lte(max), { error: `${label} must be at most ${max}` });

const words = (label: string, max: number, min = 1) =>
  z
    .string({ error: `${label} must be text` })
    .trim()
    .min(min, { error: `${label} is required` })
    .max(max, { error: `${label} must be at most ${max} characters` });

const id = (label: string) =>
  z.string({ error: `${label} must be text` }).regex(/^[a-z0-9][a-z0-9_-]{0,63}$/, {
    error: `${label} must be lower-case letters, digits, - or _ (at most 64)`,
  });

const wholeIn = (label: string, min: number, max: number) =>
  z
    .number({ error: `${label} must be a whole number from ${min} to ${max}` })
    .int({ error: `${label} must be a whole number from ${min} to ${max}` })
    .min(min, { error: `${label} must be a whole number from ${min} to ${max}` })
    .max(max, { error: `${label} must be a whole number from ${min} to ${max}` });

const unique = <T>(items: T[], key: (t: T) => string) => new Set(items.map(key)).size === items.length;

/** A whole price book as the owner publishes it. Every amount is a decimal string. */
export const priceBookSchema = z
  .object(
    {
      currency: z
        .string({ error: 'Currency must be a three-letter currency code, like USD' })
        .refine(isKnownCurrency, { error: 'Currency must be a three-letter currency code, like USD' }),
      surfaces: z
        .array(
          z.object({
            id: id('Surface id'),
            name: words('Surface name', 80),
            description: words('Surface description', 400, 0),
            widthMm: wholeIn('Surface usable width (mm)', 100, 3000),
            depthMm: wholeIn('Surface usable depth (mm)', 100, 2000),
            price: decimalText('Surface price', 100000),
            custom: z.boolean({ error: 'Surface “made to order” must be yes or no (true or false)' }),
            layout: z
              .object(
                {
                  rows: wholeIn('Surface rows (tiers)', 1, 6),
                  tiered: z.boolean({ error: 'Surface “tiered” must be yes or no (true or false)' }),
                  switcherRow: z.enum(['front', 'back'], { error: 'Surface switcher row must be front or back' }),
                },
                { error: 'Surface layout must give its rows, whether it is tiered and the switcher’s row' },
              )
              .optional(),
          }),
          { error: 'Surfaces must be a list' },
        )
        .min(1, { error: 'List at least one surface' })
        .max(100)
        .refine((s) => unique(s, (x) => x.id), { error: 'Surface ids must be unique' }),
      cases: z
        .array(
          z.object({
            id: id('Case id'),
            name: words('Case name', 80),
            kind: z.enum(['hard_case', 'road_case', 'soft_bag'], { error: 'Case kind must be a hard case, a road case or a soft bag' }),
            description: words('Case description', 400, 0),
            price: decimalText('Case price', 100000),
            notRecommended: z.boolean({ error: 'Case “not recommended” must be yes or no (true or false)' }),
            caution: words('Case caution', 400).nullable(),
            fitsSurfaceIds: z.array(id('Fitting surface id'), { error: 'The surfaces a case fits must be a list' }),
          }),
          { error: 'Cases must be a list' },
        )
        .min(1, { error: 'List at least one case' })
        .max(100)
        .refine((s) => unique(s, (x) => x.id), { error: 'Case ids must be unique' }),
      materials: z.object(
        {
          fastenersPerPedalSerial: decimalText('Fasteners per pedal (serial)', 1000),
          fastenersPerPedalSwitcher: decimalText('Fasteners per pedal (switcher)', 1000),
          hookAndLoopFeetPerPedal: decimalText('Hook-and-loop feet per pedal', 20),
          hookAndLoopPricePerFoot: decimalText('Hook-and-loop price per foot', 1000),
          cablePricePerFoot: decimalText('Cable price per foot', 1000),
          plugPrice: decimalText('Plug price', 1000),
          patchLengthFeet: decimalText('Patch length (feet)', 50),
          spareFeetPerPatch: decimalText('Spare feet per patch', 20),
          barrelPlugPrice: decimalText('DC barrel plug price', 1000),
        },
        { error: 'Materials must be an object of rates' },
      ),
      labor: z.object(
        {
          hoursPerDeviceSerial: decimalText('Labor hours per device (serial)', 20, 2),
          hoursPerDeviceSwitcher: decimalText('Labor hours per device (switcher loop)', 20, 2),
        },
        { error: 'Labor must be an object of hours' },
      ),
      functions: z
        .array(
          z.object({
            id: id('Function id'),
            code: id('Function code'),
            name: words('Function name', 80),
            description: words('Function description', 400, 0),
            laborHours: decimalText('Function labor hours', 40, 2),
            functionCount: wholeIn('Function count', 1, 5),
            extraPatchCables: wholeIn('Function extra patch cables', 0, 12),
            minimumLevel: z.enum(builderLevels, { error: `Function minimum level must be one of ${builderLevels.join(', ')}` }).optional(),
          }),
          { error: 'Functions must be a list' },
        )
        .max(50)
        .refine((s) => unique(s, (x) => x.id) && unique(s, (x) => x.code), { error: 'Function ids and codes must be unique' }),
      levels: z
        .array(
          z.object({
            id: id('Level id'),
            code: z.enum(builderLevels, { error: `Level code must be one of ${builderLevels.join(', ')}` }),
            name: words('Level name', 80),
            description: words('Level description', 400, 0),
            rateLow: decimalText('Level low rate', 10000),
            rateHigh: decimalText('Level high rate', 10000),
          }),
          { error: 'Levels must be a list' },
        )
        .refine((levels) => builderLevels.every((code) => levels.filter((l) => l.code === code).length === 1), {
          error: `Levels must list each of ${builderLevels.join(', ')} exactly once`,
        }),
      depositPolicy: z.object(
        {
          percent: decimalText('Deposit percent', 100, 2),
          minimum: decimalText('Deposit minimum', 100000),
          description: words('Deposit policy description', 600),
        },
        { error: 'Deposit policy must be an object' },
      ),
      power: z
        .object(
          {
            maxDaisyChain: wholeIn('Most pedals on one output (daisy chain)', 1, 10),
            highDrawMa: wholeIn('High-draw mark (mA)', 10, 2000),
          },
          { error: 'Power rules must give the most pedals on one output and the high-draw mark' },
        )
        .optional(),
    },
    { error: 'The price book must be a JSON object' },
  )
  .superRefine((book, ctx) => {
    const surfaceIds = new Set(book.surfaces.map((s) => s.id));
    book.cases.forEach((c, i) =>
      c.fitsSurfaceIds.forEach((sid, j) => {
        if (!surfaceIds.has(sid))
          ctx.addIssue({
            code: 'custom',
            path: ['cases', i, 'fitsSurfaceIds', j],
            message: `Case ${c.name} lists a surface the book does not have: "${sid}"`,
          });
      }),
    );
    book.levels.forEach((l, i) => {
      if (new Decimal(l.rateLow).gt(l.rateHigh))
        ctx.addIssue({ code: 'custom', path: ['levels', i, 'rateLow'], message: `${l.name}: the low rate is above the high rate` });
    });
    const byRank = [...book.levels].sort((a, b) => levelRank(a.code) - levelRank(b.code));
    for (let i = 1; i < byRank.length; i++) {
      if (new Decimal(byRank[i].rateLow).lt(byRank[i - 1].rateLow)) {
        ctx.addIssue({ code: 'custom', path: ['levels'], message: `${byRank[i].name} should not start below ${byRank[i - 1].name}` });
      }
    }
  });

export function parsePriceBook(input: unknown): { success: true; data: PriceBook } | { success: false; error: z.ZodError } {
  const result = priceBookSchema.safeParse(input);
  return result.success ? { success: true, data: result.data as PriceBook } : { success: false, error: result.error };
}

/** POST /api/price-book: the whole book and a note on what changed. */
export const publishPriceBookSchema = z.object(
  {
    book: priceBookSchema,
    notes: z.string({ error: 'Notes must be text' }).trim().max(500, { error: 'Notes must be at most 500 characters' }).default(''),
  },
  { error: 'The request must be a JSON object holding the price book and a note, like {"book": …, "notes": "…"}' },
);
