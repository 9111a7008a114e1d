/* eslint-disable @typescript-eslint/no-explicit-any -- reads the served OpenAPI document as JSON; its objects are open-ended by the specification */
import { execFile } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { registeredRoutes } from './support/routes';
import { createTestApp, type TestApp } from './support/test-app';

/**
 * The API contract: the OpenAPI document the app SERVES (GET /api/docs-json), linted by Redocly's
 * CLI with its `recommended` rules (api/redocly.yaml), and compared with the routes Express holds,
 * so a route added without documentation fails here.
 *
 * HOW TO DOCUMENT A NEW ROUTE: `@ApiOperation({ summary })`, its success answer with
 * `@ApiZodResponse(status, schema, description)` (schema from `@loomwright/shared`; binary answers
 * with `@ApiFileResponse`), its body/query with `@ApiZodBody`/`@ApiZodQuery`, and the error codes
 * its service can raise beyond the mechanical ones with `@ApiErrorCodes('not_found', 'conflict')`.
 * Sign-in, roles, CSRF, throttling, ids and body errors are added by `buildApiDocument` itself.
 */
const execFileAsync = promisify(execFile);
const redocly = createRequire(__filename).resolve('@redocly/cli/bin/cli.js');

interface LintProblem {
  ruleId: string;
  severity: 'error' | 'warn';
  message: string;
  location: Array<{ pointer: string }>;
}

/**
 * Routes Express serves that are not the API itself: the documentation pages, and the Prometheus
 * scrape (text for the metrics scraper with its own bearer token, excluded with @ApiExcludeController).
 */
const undocumentedByDesign = (route: string) => /^GET \/api\/docs(\/|-json|-yaml|$)/.test(route) || route === 'GET /api/metrics';

describe('the API contract (OpenAPI document)', () => {
  let t: TestApp;
  let document: any;
  beforeAll(async () => {
    t = await createTestApp({ seed: false });
    document = (await t.http().get('/api/docs-json').expect(200)).body;
  });
  afterAll(async () => t?.close());

  it('passes `redocly lint` (recommended rules) with no errors and no warnings', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'lw-openapi-'));
    try {
      const file = join(dir, 'openapi.json');
      writeFileSync(file, JSON.stringify(document));
      const run = await execFileAsync(
        process.execPath,
        [redocly, 'lint', file, '--config', join(__dirname, '..', 'redocly.yaml'), '--format', 'json', '--max-problems', '1000'],
        { env: { ...process.env, REDOCLY_TELEMETRY: 'off', REDOCLY_SUPPRESS_UPDATE_NOTICE: 'true' }, maxBuffer: 20 * 1024 * 1024 },
      ).catch((failed: { stdout?: string }) => ({ stdout: failed.stdout ?? '' }));
      const { problems } = JSON.parse(run.stdout) as { problems: LintProblem[] };
      const lines = problems.map((p) => `${p.severity} ${p.ruleId}: ${p.message} at ${p.location[0]?.pointer}`);
      expect(lines).toEqual([]);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  }, 60_000);

  it('documents every route the app registers, and no route it does not', () => {
    const documented = Object.entries(document.paths as Record<string, Record<string, unknown>>)
      .flatMap(([path, item]) => Object.keys(item).map((method) => `${method.toUpperCase()} ${path.replace(/\{(\w+)\}/g, ':$1')}`))
      .sort();
    const registered = registeredRoutes(t).filter((r) => !undocumentedByDesign(r));
    expect(documented).toEqual(registered);
  });

  it('gives every operation a summary, a success answer with a media type and its 4xx answers in the shared error body', () => {
    const missing: string[] = [];
    for (const [path, item] of Object.entries(document.paths as Record<string, Record<string, any>>)) {
      for (const [method, op] of Object.entries(item)) {
        const where = `${method.toUpperCase()} ${path}`;
        if (!op.summary?.trim()) missing.push(`${where}: summary`);
        const success = Object.entries(op.responses as Record<string, any>).filter(([s]) => /^2/.test(s));
        if (success.length === 0) missing.push(`${where}: success answer`);
        for (const [status, answer] of success) if (status !== '204' && !answer.content) missing.push(`${where}: ${status} has no content`);
        const errors = Object.entries(op.responses as Record<string, any>).filter(([s]) => /^4/.test(s));
        const takesNothing = op.security?.length === 0 && !op.requestBody && !op.parameters?.length;
        if (errors.length === 0 && !takesNothing) missing.push(`${where}: 4xx answers`);
        for (const [status, answer] of errors) {
          const schema = answer.content?.['application/json']?.schema;
          if (!schema?.properties?.code?.enum?.length) missing.push(`${where}: ${status} without its codes`);
        }
      }
    }
    expect(missing).toEqual([]);
  });

  it('marks exactly the open routes as needing no session, and lists 401 on the others', () => {
    const op = (method: string, path: string) => document.paths[path][method];
    expect(document.components.securitySchemes.lw_session).toMatchObject({ type: 'apiKey', in: 'cookie', name: 'lw_session' });
    expect(document.security).toEqual([{ lw_session: [] }]);
    // ARCHITECTURE.md: the catalog and estimates are open to anyone; the bench is staff only.
    expect(op('get', '/api/catalog').security).toEqual([]);
    expect(op('get', '/api/catalog').responses['401']).toBeUndefined();
    expect(op('get', '/api/bench').security).toBeUndefined();
    expect(op('get', '/api/bench').responses['401'].content['application/json'].schema.properties.code.enum).toEqual([
      'not_signed_in',
      'session_ended',
    ]);
    expect(op('get', '/api/bench').responses['403'].content['application/json'].schema.properties.code.enum).toContain('role_not_allowed');
    expect(op('post', '/api/estimates').responses['400'].content['application/json'].schema.properties.code.enum).toEqual(
      expect.arrayContaining(['validation_failed', 'invalid_json']),
    );
  });
});
