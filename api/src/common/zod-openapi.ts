import { applyDecorators, SetMetadata } from '@nestjs/common';
import { ApiBody, ApiQuery } from '@nestjs/swagger';
import { z, type ZodType } from 'zod';

type SchemaObject = Record<string, unknown> & { properties?: Record<string, Record<string, unknown>>; required?: string[] };

/**
 * The OpenAPI 3.0 description of a request schema, from the same zod schema the pipe validates
 * with (zod's own `toJSONSchema`, OpenAPI 3.0 target: `nullable` instead of `type: null`, no
 * `$schema`). Transforms and refinements cannot be written as JSON Schema; the input side is.
 */
export function openApiSchema(schema: ZodType): SchemaObject {
  return z.toJSONSchema(schema, { target: 'openapi-3.0', io: 'input', unrepresentable: 'any' }) as SchemaObject;
}

/** Documents a JSON body by its shared zod schema. */
export const ApiZodBody = (schema: ZodType, description?: string) =>
  ApiBody({ schema: openApiSchema(schema) as never, ...(description && { description }) });

/** Documents each query parameter by its shared zod schema. */
export function ApiZodQuery(schema: ZodType) {
  const json = openApiSchema(schema);
  const required = new Set(json.required ?? []);
  return applyDecorators(
    ...Object.entries(json.properties ?? {}).map(([name, property]) =>
      ApiQuery({
        name,
        required: required.has(name) && !('default' in property),
        schema: property as never,
        ...(typeof property.description === 'string' && { description: property.description }),
      }),
    ),
  );
}

export const RESPONSE_SCHEMA_KEY = 'loomwright:responseSchema';

/** The OpenAPI 3.0 description of an answer, from its shared zod schema (the output side). */
export function openApiResponseSchema(schema: ZodType): SchemaObject {
  return withEnumTypes(z.toJSONSchema(schema, { target: 'openapi-3.0', io: 'output', unrepresentable: 'any' })) as SchemaObject;
}

/**
 * OpenAPI 3.0 wants a `type` beside `nullable`; zod writes a nullable union of string literals as
 * `{ nullable, anyOf: [{ type, enum: [one] }, …] }` (ts-to-zod's unions of literals): that becomes
 * one `{ type, enum, nullable }`, and a bare `{ enum, nullable }` takes its type from its values.
 */
function withEnumTypes(node: unknown): unknown {
  if (Array.isArray(node)) return node.map(withEnumTypes);
  if (!node || typeof node !== 'object') return node;
  const out = Object.fromEntries(Object.entries(node).map(([k, v]) => [k, withEnumTypes(v)])) as Record<string, unknown>;
  const branches = out.anyOf as Array<Record<string, unknown>> | undefined;
  if (out.nullable === true && Array.isArray(branches) && branches.length > 0) {
    const type = branches[0].type;
    if (branches.every((b) => Array.isArray(b.enum) && b.type === type && Object.keys(b).every((k) => k === 'type' || k === 'enum'))) {
      delete out.anyOf;
      out.type = type;
      out.enum = [...branches.flatMap((b) => b.enum as unknown[]), null];
    }
  }
  if (Array.isArray(out.enum) && out.type === undefined) {
    const kinds = new Set(out.enum.filter((v) => v !== null).map((v) => typeof v));
    if (kinds.size === 1) out.type = [...kinds][0];
  }
  return out;
}

/** A route handler whose answer (or its promise) is what the schema describes. */
type AnswersWith<S extends ZodType> = (...args: never[]) => z.output<S> | Promise<z.output<S>>;

/**
 * Documents a route's JSON success answer by its shared zod schema (`responseSchemas` in
 * @loomwright/shared); the description stays on the route's own `@ApiOkResponse`/`@ApiCreatedResponse`.
 * Typed: a handler whose declared answer is not the schema's type does not compile, so the
 * document cannot promise a shape the route does not give.
 */
export const ApiZodResponse =
  <S extends ZodType>(schema: S) =>
  <H extends AnswersWith<S>>(target: object, key: string | symbol, descriptor: TypedPropertyDescriptor<H>): void => {
    SetMetadata(RESPONSE_SCHEMA_KEY, schema)(target, key, descriptor);
  };
