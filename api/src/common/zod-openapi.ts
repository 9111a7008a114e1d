import { applyDecorators } from '@nestjs/common';
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
