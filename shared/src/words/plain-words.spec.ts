import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import * as shared from '../index';
import { describeIssues } from '../estimate/schema';
import { publishPriceBookSchema } from '../price-book/schema';
import { jargonIn } from './jargon';

/**
 * Every message the shared schemas can say, walked by feeding each schema's fields the values
 * people and programs get wrong (missing, empty, too long, the wrong type, an unknown field, a
 * list too long), then checked for developer words. The standard: WCAG 2.2 SC 3.3.1 and 3.3.3
 * (an error is described in text and suggests a fix); the jargon list is common practice, no
 * published source (see jargon.ts).
 */

type Json = {
  type?: string | string[];
  properties?: Record<string, Json>;
  items?: Json;
  anyOf?: Json[];
  oneOf?: Json[];
  allOf?: Json[];
  additionalProperties?: unknown;
  enum?: unknown[];
};

const hostile: unknown[] = [
  undefined,
  null,
  '',
  '   ',
  'x'.repeat(5000),
  'NaN',
  '2026-02-30',
  -1,
  0,
  2.345,
  1e9,
  true,
  [],
  {},
  'not-an-id',
];

/** Inputs for one JSON-schema node: every hostile value, and for objects and lists, their insides. */
function variants(node: Json | undefined, depth = 0): unknown[] {
  if (!node || depth > 4) return hostile;
  const options = node.anyOf ?? node.oneOf ?? node.allOf;
  if (options) return options.flatMap((o) => variants(o, depth + 1));
  const type = Array.isArray(node.type) ? node.type[0] : node.type;
  if (type === 'object' && node.properties) {
    const keys = Object.keys(node.properties);
    const out: unknown[] = [{}, { unexpectedField: 1 }, ...hostile];
    for (const value of hostile) out.push(Object.fromEntries(keys.map((k) => [k, value])));
    for (const key of keys) for (const inner of variants(node.properties[key], depth + 1)) out.push({ [key]: inner });
    return out;
  }
  if (type === 'object' && node.additionalProperties && typeof node.additionalProperties === 'object') {
    return [...hostile, { '1': 25, '9': 7 }, { '1': 'x' }];
  }
  if (type === 'array') {
    const inner = variants(node.items, depth + 1);
    return [
      ...hostile,
      inner.slice(0, 40),
      Array.from({ length: 300 }, () => inner[inner.length - 1]),
      ...inner.slice(0, 60).map((v) => [v]),
    ];
  }
  if (node.enum) return [...hostile, 'wizard'];
  return hostile;
}

const schemas = Object.entries({ ...shared, publishPriceBookSchema }).filter(
  (entry): entry is [string, z.ZodType] => entry[1] instanceof z.ZodType,
);

function messagesOf(schema: z.ZodType): Set<string> {
  const json = z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' }) as Json;
  const out = new Set<string>();
  for (const input of variants(json)) {
    const result = schema.safeParse(input);
    if (!result.success) for (const message of describeIssues(result.error)) out.add(message);
  }
  return out;
}

describe('the jargon check itself', () => {
  it.each([
    'name must not be empty',
    'email must be an e-mail address, like name@example.com',
    'file: this is not a recognisable image; upload a JPEG, PNG or WebP photo.',
    'workedOn must be a calendar day written YYYY-MM-DD',
    'Current draw unknown for Pedal 1: planned at a typical figure (from memory)',
    'pedals[3].currentMa: Current draw must be a number from 0 to 5000 mA',
    'via must be one of phone, in_person, email',
    'weeklyHours.1 must be a number of hours from 0 to 24',
    'builderId must be a builder id (a UUID)',
    'Invalid input: expected string, received undefined',
  ])('flags %j', (message) => expect(jargonIn(message)).not.toEqual([]));

  it.each([
    'Day worked must be a real calendar day, like 2026-12-14',
    '"hourlyRat" is not a field this request takes; remove it',
    'Pedal 4: Current draw must be a number from 0 to 5000 mA',
    'Enter an e-mail address, like name@example.com',
    'Time zone must be a place name from the time zone list, like America/Chicago',
  ])('lets %j through', (message) => expect(jargonIn(message)).toEqual([]));
});

describe('every shared schema speaks plain words', () => {
  it('finds the schemas (auth, bookings, bench, builds, shop, team, mail, quotes, rig, price book)', () => {
    expect(schemas.length).toBeGreaterThan(35);
  });

  it.each(schemas)('%s: no message carries developer words', (_name, schema) => {
    const messages = [...messagesOf(schema)];
    expect(messages.length).toBeGreaterThan(0);
    // One example per distinct wording ("Pedal 3: …" and "Pedal 4: …" are one).
    const jargon = new Map<string, string>();
    for (const m of messages)
      if (jargonIn(m).length) jargon.set(m.replace(/^[A-Z][a-z ]+ \d+(, [A-Z][a-z ]+ \d+)*: /, ''), `${m}  ← ${jargonIn(m).join(', ')}`);
    expect([...jargon.values()]).toEqual([]);
  });
});
