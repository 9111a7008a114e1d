import { randomBytes } from 'node:crypto';
import type { INestApplication } from '@nestjs/common';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { Test } from '@nestjs/testing';
import { sql } from 'kysely';
import { Client } from 'pg';
import request from 'supertest';
import type { Database } from '../../src/database/database';

/**
 * API tests run against a real PostgreSQL: every test file gets a database of its own, migrated by
 * the same Migrator the app uses, so files can run in parallel without seeing each other's rows.
 */
export function adminUrl(): string {
  const url = process.env.TEST_DATABASE_ADMIN_URL;
  if (!url) throw new Error('TEST_DATABASE_ADMIN_URL is not set: run the API tests through `npm test`.');
  return url;
}

export function databaseUrl(name: string): string {
  const url = new URL(adminUrl());
  url.pathname = `/${name}`;
  return url.toString();
}

export async function createEmptyDatabase(prefix = 'lw_test'): Promise<{ name: string; url: string; drop: () => Promise<void> }> {
  const name = `${prefix}_${process.pid}_${randomBytes(4).toString('hex')}`;
  const admin = new Client({ connectionString: adminUrl() });
  await admin.connect();
  await admin.query(`create database "${name}"`);
  await admin.end();
  return {
    name,
    url: databaseUrl(name),
    drop: async () => {
      const client = new Client({ connectionString: adminUrl() });
      await client.connect();
      await client.query(`drop database if exists "${name}" with (force)`);
      await client.end();
    },
  };
}

export interface TestApp {
  app: INestApplication;
  db: Database;
  http: () => ReturnType<typeof request>;
  close: () => Promise<void>;
}

export interface TestAppOptions {
  /** Seed the invented demo shop (default true). */
  seed?: boolean;
  /** Extra environment for this app (ports of fakes, secrets). */
  env?: Record<string, string>;
  /** Connect through this URL instead of the fresh database's own (a proxy, say). */
  databaseUrlOverride?: (url: string) => string;
}

export async function createTestApp(options: TestAppOptions = {}): Promise<TestApp> {
  const database = await createEmptyDatabase();
  Object.assign(process.env, {
    NODE_ENV: 'test',
    DATABASE_URL: options.databaseUrlOverride ? options.databaseUrlOverride(database.url) : database.url,
    SERVE_APPS: 'false',
    SEED_DEMO: options.seed === false ? 'false' : 'true',
    RUN_WORKERS: 'false',
    JWT_SECRET: 'loomwright-test-secret-0123456789',
    // Tests sign in often from one address; throttling.spec.ts sets its own small limit.
    AUTH_THROTTLE_LIMIT: '1000',
    // Request lines would drown the test output; warnings and errors still show.
    LOG_LEVEL: 'warn',
    ...options.env,
  });
  // Imported after the environment is set: the module reads it while it is being declared.
  const { AppModule } = await import('../../src/app.module');
  const { configureApp } = await import('../../src/app.setup');
  const { Database } = await import('../../src/database/database');
  const moduleRef = await Test.createTestingModule({ imports: [AppModule] }).compile();
  const app = moduleRef.createNestApplication<NestExpressApplication>({ bodyParser: false, logger: ['error', 'warn'] });
  configureApp(app);
  await app.init();
  const db = app.get(Database);
  return {
    app,
    db,
    http: () => request(app.getHttpServer()),
    close: async () => {
      await app.close();
      await database.drop();
    },
  };
}

/**
 * Two apps on one database, as two replicas: the first makes and seeds it, the second only joins.
 * Resolves once both hear the database's change notifications (`DatabaseChanges`), or after 5 s.
 */
export async function createTwoReplicas(): Promise<{ first: TestApp; second: TestApp; databaseUrl: string }> {
  const first = await createTestApp();
  const databaseUrl = process.env.DATABASE_URL!;
  const second = await createTestApp({ seed: false, databaseUrlOverride: () => databaseUrl });
  const { DatabaseChanges } = await import('../../src/database/change-notifications');
  const listening = () => first.app.get(DatabaseChanges).isListening && second.app.get(DatabaseChanges).isListening;
  for (let i = 0; i < 50 && !listening(); i++) await new Promise((r) => setTimeout(r, 100));
  return { first, second, databaseUrl };
}

/** Empties the given tables between tests (the migrations table is never touched). */
export async function clearTables(db: Database, tables: string[]): Promise<void> {
  if (tables.length === 0) return;
  await sql`truncate ${sql.join(tables.map((t) => sql.table(t)))} restart identity cascade`.execute(db);
}
