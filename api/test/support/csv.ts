import { parse } from 'csv-parse/sync';
import Decimal from 'decimal.js';
import { expect } from 'vitest';
import type { Agent } from './bench-fixtures';

export type CsvRow = Record<string, string>;

/**
 * A CSV answer read back whole as bytes and parsed with csv-parse (RFC 4180), a parser from the
 * npm registry independent of the exporter; a row of another length than the header fails the parse.
 */
export async function fetchCsv(agent: Agent, path: string): Promise<{ rows: CsvRow[]; raw: Buffer; headers: Record<string, string> }> {
  const res = await agent
    .get(path)
    .buffer(true)
    .parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => done(null, Buffer.concat(chunks)));
    });
  expect(res.status, String(res.body)).toBe(200);
  const raw = res.body as Buffer;
  return { rows: parse(raw, { bom: true, columns: true }) as CsvRow[], raw, headers: res.headers as Record<string, string> };
}

/** The sum of decimal strings, to the cent (decimal.js, no binary floating point). */
export const sumOf = (values: string[]) => values.reduce((s, v) => s.plus(v), new Decimal(0)).toFixed(2);
