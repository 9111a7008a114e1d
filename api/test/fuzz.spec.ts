import fc from 'fast-check';
import { apiErrorBodySchema } from '@loomwright/shared';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { jargonIn } from '@loomwright/shared';
import { builderId, DEMO_PASSWORD, signIn } from './support/bench-fixtures';
import { createTestApp, type TestApp } from './support/test-app';
import { countedBoard } from '../../shared/src/estimate/reference-rigs.fixture';

/**
 * Every operation of the served OpenAPI document, called with generated requests as an anonymous
 * caller, a player and the owner: no answer may be a 5xx. Requests are generated from each
 * operation's own parameters and body schema (the zod schemas, through z.toJSONSchema), mixed
 * with the values that once broke the API: a lone surrogate, 1e-308, null, "NaN", deep nesting.
 *
 * Every 4xx answer's words are kept and checked at the end for developer jargon (a camelCase
 * field name, a path such as "pedals[3]", "must not be empty"): a person reads them (WCAG 2.2
 * SC 3.3.1 and 3.3.3; the jargon list is common practice, see shared/src/words/jargon.ts).
 *
 * Bounded and deterministic: FUZZ_RUNS requests per operation and caller (default 6), from the
 * seed FUZZ_SEED (default below), printed at the start so a failure can be replayed.
 */
const SEED = Number(process.env.FUZZ_SEED ?? 20261202);
const RUNS = Number(process.env.FUZZ_RUNS ?? 6);

type Schema = {
  type?: string;
  enum?: unknown[];
  properties?: Record<string, Schema>;
  required?: string[];
  items?: Schema;
  minimum?: number;
  maximum?: number;
  minLength?: number;
  maxLength?: number;
  nullable?: boolean;
  format?: string;
  pattern?: string;
  anyOf?: Schema[];
  oneOf?: Schema[];
  allOf?: Schema[];
  additionalProperties?: boolean | Schema;
};
interface Parameter {
  name: string;
  in: 'path' | 'query' | 'header' | 'cookie';
  required?: boolean;
  schema?: Schema;
}
interface Operation {
  method: string;
  path: string;
  parameters: Parameter[];
  body?: { contentType: string; schema: Schema };
}
/** The codes the document lists for one operation, per 4xx status. */
type DocumentedCodes = Map<string, Map<number, Set<string>>>;

interface Sample {
  path: Record<string, string>;
  query: Record<string, string>;
  body: unknown;
}

/** Values that once answered 500 somewhere, or commonly do in APIs (common practice, no published source). */
const hostileValues: unknown[] = [
  null,
  '',
  '\ud800',
  'a\udfffb',
  'NaN',
  'Infinity',
  '-0',
  '1e-308',
  1e-308,
  1e308,
  -1,
  0,
  2.345,
  Number.MAX_SAFE_INTEGER + 2,
  true,
  [],
  {},
  'x'.repeat(5000),
  '\u0000',
  "' or 1=1 --",
  '../../etc/passwd',
  '2026-02-30',
  '00000000-0000-0000-0000-000000000000',
  JSON.parse('['.repeat(40) + ']'.repeat(40)),
];
const hostileText = [
  '',
  'NaN',
  '1e-308',
  '-1',
  '0',
  '99999999999999999999',
  'x'.repeat(3000),
  '\u0000',
  '%',
  'true',
  '2026-02-30',
  "'",
  'null',
];

function valueFor(schema: Schema | undefined, depth = 0): fc.Arbitrary<unknown> {
  const hostile = fc.constantFrom(...hostileValues);
  if (!schema || depth > 6) return hostile;
  const options = schema.anyOf ?? schema.oneOf;
  if (options?.length) return fc.oneof(...options.map((s) => valueFor(s, depth + 1)), hostile);
  if (schema.allOf?.length) return valueFor(schema.allOf[0], depth + 1);
  let typed: fc.Arbitrary<unknown>;
  if (schema.enum) typed = fc.constantFrom(...schema.enum);
  else
    switch (schema.type) {
      case 'string':
        typed = schema.pattern
          ? fc.oneof(safeStringMatching(schema.pattern), fc.string({ maxLength: 40 }))
          : schema.format === 'uuid'
            ? fc.uuid()
            : fc.oneof(fc.string({ maxLength: Math.min(schema.maxLength ?? 60, 60) }), fc.string({ unit: 'grapheme', maxLength: 20 }));
        break;
      case 'integer':
        typed = fc.integer({ min: Math.max(schema.minimum ?? -1000, -1e6), max: Math.min(schema.maximum ?? 1000, 1e6) });
        break;
      case 'number':
        typed = fc.double({ min: schema.minimum ?? -1e6, max: schema.maximum ?? 1e6, noNaN: true });
        break;
      case 'boolean':
        typed = fc.boolean();
        break;
      case 'array':
        typed = fc.array(valueFor(schema.items, depth + 1), { maxLength: 4 });
        break;
      case 'object':
        typed = objectFor(schema, depth);
        break;
      default:
        typed = fc.anything({ maxDepth: 2 });
    }
  return schema.nullable
    ? fc.oneof({ arbitrary: typed, weight: 4 }, fc.constant(null), { arbitrary: hostile, weight: 1 })
    : fc.oneof({ arbitrary: typed, weight: 4 }, { arbitrary: hostile, weight: 1 });
}

function safeStringMatching(pattern: string): fc.Arbitrary<string> {
  try {
    return fc.stringMatching(new RegExp(pattern)).filter((s) => s.length < 200);
  } catch {
    return fc.string({ maxLength: 40 });
  }
}

function objectFor(schema: Schema, depth: number): fc.Arbitrary<unknown> {
  const properties = schema.properties ?? {};
  const required = new Set(schema.required ?? []);
  const shape = Object.fromEntries(Object.entries(properties).map(([name, s]) => [name, valueFor(s, depth + 1)]));
  return fc.record(shape, { requiredKeys: Object.keys(properties).filter((name) => required.has(name)) }).chain((record) =>
    // Now and then a field the schema does not name, to check unknown fields are refused in words.
    fc.oneof({ arbitrary: fc.constant(record), weight: 5 }, fc.constant({ ...record, unexpectedField: 1 })),
  );
}

function textFor(schema: Schema | undefined, ids: string[]): fc.Arbitrary<string> {
  const typed = schema?.enum
    ? fc.constantFrom(...schema.enum.map(String))
    : schema?.type === 'integer' || schema?.type === 'number'
      ? fc.integer({ min: -5, max: 200 }).map(String)
      : schema?.pattern
        ? safeStringMatching(schema.pattern)
        : fc.string({ maxLength: 30 });
  return fc.oneof({ arbitrary: typed, weight: 3 }, fc.constantFrom(...ids), fc.uuid(), fc.constantFrom(...hostileText));
}

function sampleFor(op: Operation, ids: string[]): fc.Arbitrary<Sample> {
  const pathParams = op.parameters.filter((p) => p.in === 'path');
  const queryParams = op.parameters.filter((p) => p.in === 'query');
  const path = fc.record(
    Object.fromEntries(
      pathParams.map((p) => [
        p.name,
        fc.oneof({ arbitrary: fc.constantFrom(...ids), weight: 4 }, fc.uuid(), fc.constantFrom(...hostileText.filter(Boolean))),
      ]),
    ),
  ) as fc.Arbitrary<Record<string, string>>;
  const query = fc.record(Object.fromEntries(queryParams.map((p) => [p.name, textFor(p.schema, ids)])), {
    requiredKeys: queryParams.filter((p) => p.required).map((p) => p.name),
  }) as fc.Arbitrary<Record<string, string>>;
  const body = op.body
    ? fc.oneof(
        { arbitrary: valueFor(op.body.schema), weight: 6 },
        fc.constantFrom<unknown>(null, 'text', 7, [], JSON.parse('['.repeat(3000) + ']'.repeat(3000))),
      )
    : fc.constant(undefined);
  return fc.record({ path, query, body });
}

/** "get /api/bookings/{id}" → status → the codes its error answer's schema names (`code.enum`). */
function documentedCodesOf(document: {
  paths: Record<string, Record<string, { responses?: Record<string, { content?: Record<string, { schema?: Schema }> }> }>>;
}): DocumentedCodes {
  const out: DocumentedCodes = new Map();
  for (const [path, item] of Object.entries(document.paths))
    for (const [method, op] of Object.entries(item)) {
      const byStatus = new Map<number, Set<string>>();
      for (const [status, answer] of Object.entries(op.responses ?? {})) {
        const codes = answer.content?.['application/json']?.schema?.properties?.code?.enum;
        if (/^4\d\d$/.test(status) && codes) byStatus.set(Number(status), new Set(codes.map(String)));
      }
      out.set(`${method} ${path}`, byStatus);
    }
  return out;
}

/** Reads the operations of the served OpenAPI 3.0 document. */
function operationsOf(document: {
  paths: Record<string, Record<string, { parameters?: Parameter[]; requestBody?: { content: Record<string, { schema: Schema }> } }>>;
}): Operation[] {
  const out: Operation[] = [];
  for (const [path, item] of Object.entries(document.paths)) {
    for (const [method, op] of Object.entries(item)) {
      if (!['get', 'post', 'put', 'patch', 'delete'].includes(method)) continue;
      const content = op.requestBody?.content ?? {};
      const contentType = Object.keys(content)[0];
      out.push({
        method,
        path,
        parameters: op.parameters ?? [],
        body: contentType ? { contentType, schema: content[contentType].schema } : undefined,
      });
    }
  }
  return out;
}

function urlOf(op: Operation, sample: Sample): string {
  const path = op.path.replace(/\{(\w+)\}/g, (_, name: string) => encodeURIComponent(sample.path[name] ?? 'x').replace(/%2F/gi, '_'));
  // URLSearchParams writes a lone surrogate as U+FFFD, as a browser would; a raw one cannot travel in a URL.
  const query = new URLSearchParams(Object.entries(sample.query).filter(([, v]) => v !== undefined)).toString();
  return query ? `${path}?${query}` : path;
}

/** Each 4xx answer whose status or code the operation's documentation does not list, once per kind. */
const undocumented = new Map<string, string>();

/** Each distinct 4xx message and one request that drew it. */
const refusals = new Map<string, string>();
function keepRefusal(body: unknown, request: string): void {
  const raw = body && typeof body === 'object' && 'message' in body ? (body as { message: unknown }).message : undefined;
  for (const message of ([] as unknown[]).concat(raw ?? []))
    if (typeof message === 'string' && !refusals.has(message)) refusals.set(message, request);
}

const callers = [
  { name: 'anonymous', email: null },
  { name: 'player', email: 'player@mail.example' },
  { name: 'owner', email: 'owner@shop.example' },
] as const;

describe(`fuzzing every operation of the OpenAPI document (seed ${SEED}, ${RUNS} runs per operation and caller)`, () => {
  let t: TestApp;
  let operations: Operation[];
  let ids: string[];
  let documented: DocumentedCodes;

  beforeAll(async () => {
    console.log(`fuzz: seed ${SEED}, ${RUNS} runs per operation and caller (FUZZ_SEED / FUZZ_RUNS to change)`);
    t = await createTestApp();
    const document = (await t.http().get('/api/docs-json').expect(200)).body;
    operations = operationsOf(document);
    documented = documentedCodesOf(document);
    // A booking made the way a player makes one, so its quote matches its own price-book version.
    const playerAgent = await signIn(t.app, 'player@mail.example');
    const booking = (
      await playerAgent
        .post('/api/bookings')
        .send({ configuration: countedBoard(8) })
        .expect(201)
    ).body as { id: string };
    const player = await t.db.selectFrom('users').select('id').where('email', '=', 'player@mail.example').executeTakeFirstOrThrow();
    // Real ids reach past the "not found" answers into the code that does the work.
    ids = [booking.id, player.id, await builderId(t.db, 'builder@shop.example')];
  }, 120_000);
  afterAll(async () => t.close());

  const signedInCookie = async (email: string) => {
    const res = await request(t.app.getHttpServer()).post('/api/auth/sign-in').send({ email, password: DEMO_PASSWORD }).expect(200);
    return ([] as string[])
      .concat(res.headers['set-cookie'] ?? [])
      .map((c) => c.split(';')[0])
      .join('; ');
  };

  it.each(callers)(
    'answers no request from $name with a 5xx',
    async ({ name, email }) => {
      expect(operations.length).toBeGreaterThan(40);
      const failures: string[] = [];
      let requests = 0;
      const started = Date.now();
      let cookie = email ? await signedInCookie(email) : undefined;
      for (const [index, op] of operations.entries()) {
        const property = fc.asyncProperty(sampleFor(op, ids), async (sample) => {
          requests += 1;
          const url = urlOf(op, sample);
          let call = (request(t.app.getHttpServer()) as unknown as Record<string, (u: string) => request.Test>)[op.method](url);
          if (cookie) call = call.set('Cookie', cookie);
          if (op.body?.contentType === 'multipart/form-data') {
            const fields = (sample.body && typeof sample.body === 'object' ? sample.body : {}) as Record<string, unknown>;
            for (const [key, value] of Object.entries(fields))
              if (key !== 'file' && typeof value === 'string') call = call.field(key, value);
            call = call.attach('file', Buffer.from('not really an image'), 'photo.jpg');
          } else if (sample.body !== undefined) {
            call = call.set('Content-Type', 'application/json').send(JSON.stringify(sample.body));
          }
          const res = await call;
          if (res.status >= 400 && res.status < 500) {
            keepRefusal(res.body, `${op.method.toUpperCase()} ${op.path} as ${name}`);
            const code = (res.body as { code?: unknown })?.code;
            if (!documented.get(`${op.method} ${op.path}`)?.get(res.status)?.has(String(code))) {
              const kind = `${op.method.toUpperCase()} ${op.path}: ${res.status} ${String(code)}`;
              if (!undocumented.has(kind)) undocumented.set(kind, `as ${name}: ${JSON.stringify(res.body).slice(0, 300)}`);
            }
          }
          if (res.status >= 500) {
            throw new Error(
              `${op.method.toUpperCase()} ${url} as ${name} answered ${res.status} ${JSON.stringify(res.body)}\n  body sent: ${JSON.stringify(sample.body)?.slice(0, 500)}`,
            );
          }
          // Every refusal is the one error body, with a code from the shared list.
          if (res.status >= 400 && !apiErrorBodySchema.safeParse(res.body).success) {
            throw new Error(
              `${op.method.toUpperCase()} ${url} as ${name} answered ${res.status} without the error body: ${JSON.stringify(res.body)}`,
            );
          }
        });
        try {
          // Seeds differ per operation (and caller) but are fixed, so a run repeats exactly.
          await fc.assert(property, {
            seed: SEED + index * 7919 + name.length,
            numRuns: RUNS,
            endOnFailure: true,
            includeErrorInReport: true,
          });
        } catch (error) {
          failures.push(`${op.method.toUpperCase()} ${op.path}: ${error instanceof Error ? error.message : String(error)}`);
        }
        // Signing in is slow on purpose (scrypt), so sign in again only after a route that may have
        // ended or replaced the session: sign-out, sign-out-everywhere, password and invitation links.
        if (email && /auth|sessions|invitations/.test(op.path)) cookie = await signedInCookie(email);
      }
      console.log(
        `fuzz as ${name}: ${operations.length} operations, ${requests} requests, ${failures.length} with a 5xx, ${((Date.now() - started) / 1000).toFixed(1)} s`,
      );
      for (const failure of failures) console.error(failure);
      expect(failures).toEqual([]);
    },
    600_000,
  );

  // The OpenAPI document is what the apps branch on: a code the route answers but does not list is
  // a code no client was told to expect (and a listed status without the code is as bad).
  it('answers each refusal with a status and code the operation documents', () => {
    expect(refusals.size).toBeGreaterThan(50);
    const lines = [...undocumented].map(([kind, example]) => `${kind} (${example})`);
    console.log(`fuzz: ${undocumented.size} refusals with a status or code the document does not list for the route`);
    expect(lines).toEqual([]);
  });

  it('refuses every bad request in plain words, without developer jargon', () => {
    expect(refusals.size).toBeGreaterThan(50);
    const jargon = [...refusals]
      .filter(([message]) => jargonIn(message).length > 0)
      .map(([message, where]) => `${where}: ${message}  ← ${jargonIn(message).join(', ')}`);
    console.log(`fuzz: ${refusals.size} distinct refusals read, ${jargon.length} with jargon`);
    expect(jargon).toEqual([]);
  });
});
