import { readdirSync, readFileSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import ts from 'typescript';
import { QUERIES_OUTSIDE_REPOSITORIES, TABLE_OWNERS, mayRead, type TableName } from '../../src/database/table-owners';

/** Kysely's methods that name a table they read, and those that name a table they write. */
const READ_METHODS = new Set([
  'selectFrom',
  'innerJoin',
  'leftJoin',
  'rightJoin',
  'fullJoin',
  'crossJoin',
  'innerJoinLateral',
  'leftJoinLateral',
]);
const WRITE_METHODS = new Set(['insertInto', 'updateTable', 'deleteFrom', 'replaceInto', 'mergeInto']);
const QUERY_METHODS = new Set([...READ_METHODS, ...WRITE_METHODS, 'selectNoFrom']);

/**
 * In raw SQL: `insert into t`, `update t`, `delete from t` write; `join t`, `using t` and every table
 * of a `from` list read, comma joins too (`from bookings b, payments p`). A `from` list runs to the
 * next clause word or bracket.
 */
const SQL_WRITE = /\b(?:insert\s+into|update|delete\s+from)\s+"?([a-z_][a-z0-9_]*)"?/gi;
const SQL_READ = /\b(?:join|using)\s+"?([a-z_][a-z0-9_]*)"?/gi;
const SQL_FROM_LIST =
  /\bfrom\s+((?:"?[a-z_][a-z0-9_]*"?(?:\s+(?:as\s+)?(?!(?:where|join|inner|left|right|full|cross|natural|on|using|group|order|limit|offset|having|union|for|returning|set|window)\b)[a-z_][a-z0-9_]*)?\s*,\s*)*"?[a-z_][a-z0-9_]*"?)/gi;

/** The tables a raw SQL text reads and writes, in the order they stand. */
function sqlTables(text: string): Array<{ name: string; kind: 'read' | 'write' }> {
  const found: Array<{ at: number; name: string; kind: 'read' | 'write' }> = [];
  for (const m of text.matchAll(SQL_WRITE)) found.push({ at: m.index, name: m[1], kind: 'write' });
  for (const m of text.matchAll(SQL_READ)) found.push({ at: m.index, name: m[1], kind: 'read' });
  for (const m of text.matchAll(SQL_FROM_LIST)) {
    for (const item of m[1].split(',')) found.push({ at: m.index, name: item.trim().split(/\s+/)[0].replace(/"/g, ''), kind: 'read' });
  }
  return found.sort((a, b) => a.at - b.at).map(({ name, kind }) => ({ name: name.toLowerCase(), kind }));
}

export interface TableAccess {
  /** Path below api/src, with forward slashes. */
  file: string;
  line: number;
  module: string;
  table: TableName;
  kind: 'read' | 'write';
  how: string;
}

export interface ScanResult {
  accesses: TableAccess[];
  /** Query code found outside a `*.repository.ts` file (and outside the listed exceptions). */
  outsideRepositories: Array<{ file: string; line: number; how: string }>;
}

const isTable = (name: string): name is TableName => Object.prototype.hasOwnProperty.call(TABLE_OWNERS, name);

/** `'bookings as b'` → `bookings`; anything else (a subquery, a callback) names no table here. */
function tableNames(arg: ts.Expression | undefined): string[] {
  if (!arg) return [];
  if (ts.isStringLiteralLike(arg)) return [arg.text.trim().split(/\s+/)[0]];
  if (ts.isArrayLiteralExpression(arg)) return arg.elements.flatMap((e) => tableNames(e));
  return [];
}

function templateText(t: ts.TemplateLiteral): string {
  if (ts.isNoSubstitutionTemplateLiteral(t)) return t.text;
  return [t.head.text, ...t.templateSpans.map((s) => s.literal.text)].join(' ? ');
}

/** Scans one file's text; `file` is its path below api/src (its first folder is its module). */
export function scanSource(file: string, text: string): ScanResult {
  const module = file.split('/')[0];
  const source = ts.createSourceFile(file, text, ts.ScriptTarget.Latest, true);
  const accesses: TableAccess[] = [];
  const outside: ScanResult['outsideRepositories'] = [];
  const queryFile = file.endsWith('.repository.ts') || Object.prototype.hasOwnProperty.call(QUERIES_OUTSIDE_REPOSITORIES, file);
  const lineOf = (n: ts.Node) => source.getLineAndCharacterOfPosition(n.getStart(source)).line + 1;

  const visit = (node: ts.Node) => {
    // `trx.selectFrom(…)`, `eb.selectFrom(…)` in a subquery, and a destructured expression builder's
    // `({ selectFrom }) => selectFrom(…)`: all name the table in their first argument.
    const callee = ts.isCallExpression(node) ? node.expression : undefined;
    const method = callee && (ts.isPropertyAccessExpression(callee) ? callee.name.text : ts.isIdentifier(callee) ? callee.text : undefined);
    if (ts.isCallExpression(node) && method) {
      if (QUERY_METHODS.has(method)) {
        if (!queryFile) outside.push({ file, line: lineOf(node), how: method });
        const kind = WRITE_METHODS.has(method) ? 'write' : 'read';
        for (const name of tableNames(node.arguments[0])) {
          if (isTable(name)) accesses.push({ file, line: lineOf(node), module, table: name, kind, how: method });
        }
      }
    }
    if (ts.isTaggedTemplateExpression(node) && node.tag.getText(source) === 'sql') {
      const text = templateText(node.template);
      const named = new Set<string>();
      for (const { name, kind } of sqlTables(text)) {
        if (!isTable(name)) continue;
        named.add(name);
        accesses.push({ file, line: lineOf(node), module, table: name, kind, how: 'sql' });
      }
      const executed = ts.isPropertyAccessExpression(node.parent) && node.parent.name.text === 'execute';
      if (!queryFile && (named.size > 0 || executed)) outside.push({ file, line: lineOf(node), how: 'sql' });
    }
    ts.forEachChild(node, visit);
  };
  visit(source);
  return { accesses, outsideRepositories: outside };
}

/** Every TypeScript file of api/src except tests, migrations and the demo seed. */
export function scanTree(srcRoot: string): ScanResult {
  const files: string[] = [];
  const walk = (dir: string) => {
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      const path = join(dir, entry.name);
      if (entry.isDirectory()) walk(path);
      else if (entry.name.endsWith('.ts') && !entry.name.endsWith('.spec.ts') && !entry.name.endsWith('.d.ts')) files.push(path);
    }
  };
  walk(srcRoot);
  const result: ScanResult = { accesses: [], outsideRepositories: [] };
  for (const path of files) {
    const file = relative(srcRoot, path).split(sep).join('/');
    if (file.startsWith('database/migrations/') || file.startsWith('database/seed')) continue;
    const one = scanSource(file, readFileSync(path, 'utf8'));
    result.accesses.push(...one.accesses);
    result.outsideRepositories.push(...one.outsideRepositories);
  }
  return result;
}

/** What breaks the map: a write by anyone but the owner, a read by a module not listed, a query outside a repository. */
export function violations(result: ScanResult): string[] {
  const out: string[] = [];
  for (const a of result.accesses) {
    const t = TABLE_OWNERS[a.table];
    if (a.kind === 'write' && a.module !== t.owner) {
      out.push(`${a.file}:${a.line} writes ${a.table} (${a.how}); only its owner, ${t.owner}, writes it: call the ${t.owner} repository`);
    } else if (a.kind === 'read' && !mayRead(a.module, a.table)) {
      out.push(
        `${a.file}:${a.line} reads ${a.table} (${a.how}); ${a.module} may not: go through the ${t.owner} repository or list it as a reader`,
      );
    }
  }
  for (const q of result.outsideRepositories) {
    out.push(`${q.file}:${q.line} queries the database (${q.how}) outside a repository`);
  }
  return out;
}
