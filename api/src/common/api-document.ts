/* eslint-disable @typescript-eslint/no-explicit-any -- walks the OpenAPI document as JSON; its operation and schema objects are open-ended by the specification */
import { INestApplication, RequestMethod, SetMetadata } from '@nestjs/common';
import { GUARDS_METADATA, METHOD_METADATA, PATH_METADATA } from '@nestjs/common/constants';
import { ModulesContainer } from '@nestjs/core';
import { DECORATORS, DocumentBuilder, SwaggerModule, type OpenAPIObject } from '@nestjs/swagger';
import { ThrottlerGuard } from '@nestjs/throttler';
import { apiErrorBodySchema, defaultErrorCode, ERROR_CODE_STATUS, ERROR_CODES, type ErrorCode } from '@loomwright/shared';
import { z, type ZodType } from 'zod';
import { IS_PUBLIC_KEY } from '../auth/public.decorator';
import { ROLES_KEY } from '../auth/roles.decorator';
import { SESSION_COOKIE } from '../auth/session-cookie';
import { ALLOW_CROSS_SITE } from '../security/allow-cross-site.decorator';
import { openApiResponseSchema, openApiSchema, RESPONSE_SCHEMA_KEY } from './zod-openapi';

const ERROR_CODES_KEY = 'loomwright:errorCodes';

/**
 * The error codes a route gives beyond those its guards, pipes and body parser give (which the
 * document adds by itself from the same metadata the guards read): `not_found`, `conflict`,
 * `bench_time_taken`… Listed per status in the OpenAPI document under the shared error body.
 */
export const ApiErrorCodes = (...codes: ErrorCode[]) => SetMetadata(ERROR_CODES_KEY, codes);

/** What the document needs to know about one route, read from the metadata the guards and pipes read. */
interface RouteFacts {
  isPublic: boolean;
  roles: boolean;
  crossSiteChecked: boolean;
  throttled: boolean;
  codes: ErrorCode[];
  /** The answer's zod schema (`@ApiZodResponse`), or the media types of a file answer (`@ApiProduces`). */
  answer?: ZodType;
  produces?: string[];
}

const methodNames: Partial<Record<RequestMethod, string>> = {
  [RequestMethod.GET]: 'get',
  [RequestMethod.POST]: 'post',
  [RequestMethod.PUT]: 'put',
  [RequestMethod.PATCH]: 'patch',
  [RequestMethod.DELETE]: 'delete',
};

const joinPath = (...parts: string[]) =>
  '/' +
  parts
    .map((p) => p.replace(/^\/+|\/+$/g, ''))
    .filter(Boolean)
    .join('/')
    .replace(/:(\w+)/g, '{$1}');

/** "get /api/bookings/{id}" → facts, for every handler of every controller in the app. */
function routeFacts(app: INestApplication, prefix: string): Map<string, RouteFacts> {
  const facts = new Map<string, RouteFacts>();
  const first = <T>(key: string, handler: object, controller: object): T | undefined =>
    Reflect.getMetadata(key, handler) ?? Reflect.getMetadata(key, controller);
  for (const module of app.get(ModulesContainer).values()) {
    for (const wrapper of module.controllers.values()) {
      const controller = wrapper.metatype as (new (...args: never[]) => unknown) | null;
      if (!controller) continue;
      const controllerPaths = ([] as string[]).concat(Reflect.getMetadata(PATH_METADATA, controller) ?? '');
      const proto = controller.prototype as Record<string, unknown>;
      for (const name of Object.getOwnPropertyNames(proto)) {
        const handler = proto[name];
        if (typeof handler !== 'function' || name === 'constructor') continue;
        const method = methodNames[Reflect.getMetadata(METHOD_METADATA, handler) as RequestMethod];
        const handlerPaths = Reflect.getMetadata(PATH_METADATA, handler) as string | string[] | undefined;
        if (!method || handlerPaths === undefined) continue;
        const guards = [
          ...(Reflect.getMetadata(GUARDS_METADATA, controller) ?? []),
          ...(Reflect.getMetadata(GUARDS_METADATA, handler) ?? []),
        ];
        const route: RouteFacts = {
          isPublic: !!first<boolean>(IS_PUBLIC_KEY, handler, controller),
          roles: !!first<string[]>(ROLES_KEY, handler, controller)?.length,
          crossSiteChecked: !first<boolean>(ALLOW_CROSS_SITE, handler, controller),
          throttled: guards.includes(ThrottlerGuard),
          codes: [...(Reflect.getMetadata(ERROR_CODES_KEY, controller) ?? []), ...(Reflect.getMetadata(ERROR_CODES_KEY, handler) ?? [])],
          answer: Reflect.getMetadata(RESPONSE_SCHEMA_KEY, handler),
          produces: Reflect.getMetadata(DECORATORS.API_PRODUCES, handler),
        };
        for (const c of controllerPaths)
          for (const h of ([] as string[]).concat(handlerPaths)) facts.set(`${method} ${joinPath(prefix, c, h)}`, route);
      }
    }
  }
  return facts;
}

/** The codes an operation can answer with, from what it takes and who may call it. */
function codesFor(method: string, path: string, operation: Record<string, any>, route: RouteFacts | undefined): Set<ErrorCode> {
  const codes = new Set<ErrorCode>(route?.codes ?? []);
  const changes = method !== 'get';
  if (route && !route.isPublic) ['not_signed_in', 'session_ended'].forEach((c) => codes.add(c as ErrorCode));
  if (route?.roles) codes.add('role_not_allowed');
  if (changes && route?.crossSiteChecked) codes.add('cross_site_request');
  // Every state-changing call must carry a documented Content-Type, body or none (CsrfGuard).
  if (changes) codes.add('unsupported_media_type');
  if (route?.throttled) codes.add('too_many_attempts');
  if (operation.requestBody) {
    const json = 'application/json' in (operation.requestBody.content ?? {});
    (
      [
        'validation_failed',
        'payload_too_large',
        ...(json ? ['invalid_json', 'body_not_object', 'body_unreadable', 'body_too_deep', 'invalid_unicode', 'value_not_storable'] : []),
      ] as ErrorCode[]
    ).forEach((c) => codes.add(c));
  }
  const parameters: Array<{ in: string }> = operation.parameters ?? [];
  if (parameters.some((p) => p.in === 'query')) codes.add('validation_failed');
  if (parameters.some((p) => p.in === 'path') || /\{\w+\}/.test(path))
    ['invalid_id', 'not_found'].forEach((c) => codes.add(c as ErrorCode));
  return codes;
}

const errorAnswer = (codes: ErrorCode[]) => ({
  'application/json': {
    schema: openApiSchema(
      apiErrorBodySchema.extend({
        code: z.enum(codes as [ErrorCode, ...ErrorCode[]]).describe('Stable: branch on this, never on the message.'),
      }),
    ),
  },
});

/**
 * Every 4xx answer an operation can give, under the shared error body with the codes it can carry
 * at that status (each code's meaning beside it). A description the route wrote itself is kept.
 */
function documentErrors(document: OpenAPIObject, facts: Map<string, RouteFacts>): void {
  for (const [path, item] of Object.entries(document.paths)) {
    for (const [method, operation] of Object.entries(item as Record<string, any>)) {
      if (!methodNames[RequestMethod[method.toUpperCase() as keyof typeof RequestMethod]]) continue;
      const byStatus = new Map<number, ErrorCode[]>();
      for (const code of codesFor(method, path, operation, facts.get(`${method} ${path}`))) {
        const status = ERROR_CODE_STATUS[code];
        if (status >= 500) continue;
        byStatus.set(status, [...(byStatus.get(status) ?? []), code]);
      }
      operation.responses ??= {};
      // A status the route documented itself (`@ApiTooManyRequestsResponse`…) carries its status's code.
      for (const status of Object.keys(operation.responses)
        .map(Number)
        .filter((s) => s >= 400 && s < 500)) {
        if (!byStatus.has(status)) byStatus.set(status, [defaultErrorCode(status)]);
      }
      for (const [status, codes] of [...byStatus].sort(([a], [b]) => a - b)) {
        const given = operation.responses[status] as { description?: string } | undefined;
        const meanings = codes.map((c) => `\`${c}\`: ${ERROR_CODES[c]}`).join('\n- ');
        operation.responses[status] = {
          description: `${given?.description ? `${given.description}\n\n` : ''}- ${meanings}`,
          content: errorAnswer(codes),
        };
      }
    }
  }
}

/** The success answer's content: the route's zod schema as JSON, or the file types it produces. */
function documentAnswers(document: OpenAPIObject, facts: Map<string, RouteFacts>): void {
  for (const [path, item] of Object.entries(document.paths)) {
    for (const [method, operation] of Object.entries(item as Record<string, any>)) {
      const route = facts.get(`${method} ${path}`);
      const success = Object.entries(operation.responses ?? {}).find(([s]) => /^2/.test(s) && s !== '204')?.[1] as
        { content?: object } | undefined;
      if (!route || !success) continue;
      if (route.answer) success.content = { 'application/json': { schema: openApiResponseSchema(route.answer) } };
      else if (route.produces?.length)
        success.content = Object.fromEntries(
          route.produces.map((type) => [type, { schema: { type: 'string', format: type.startsWith('text/') ? undefined : 'binary' } }]),
        );
    }
  }
}

/**
 * The API's OpenAPI 3.0 document, served at /api/docs (JSON at /api/docs-json): Nest's scan of the
 * controllers, plus the error answers each route can give and the session cookie as the default
 * security (public routes say `security: []`), so the document says what the guards do.
 */
export function buildApiDocument(app: INestApplication, prefix = 'api'): OpenAPIObject {
  const document = SwaggerModule.createDocument(
    app,
    new DocumentBuilder()
      .setTitle('Loomwright API')
      .setDescription(
        'Quotes, bookings, deposits and bench planning for a pedalboard shop. Every error answer carries a stable `code` from one list; branch on it, not on the message.',
      )
      .setVersion('0.1.0')
      .setLicense('Proprietary: the shop’s own', 'https://shop.example/terms')
      .addServer('/', 'This server: every path starts with /api')
      .addCookieAuth(
        SESSION_COOKIE,
        {
          type: 'apiKey',
          in: 'cookie',
          name: SESSION_COOKIE,
          description: 'The httpOnly session cookie set by sign-in, sign-up and the link routes.',
        },
        SESSION_COOKIE,
      )
      .addSecurityRequirements(SESSION_COOKIE)
      .build(),
  );
  const facts = routeFacts(app, prefix);
  for (const [path, item] of Object.entries(document.paths)) {
    for (const [method, operation] of Object.entries(item as Record<string, any>)) {
      const route = facts.get(`${method} ${path}`);
      if (route?.isPublic) operation.security = [];
      else if (route) delete operation.security;
    }
  }
  documentErrors(document, facts);
  documentAnswers(document, facts);
  return document;
}
