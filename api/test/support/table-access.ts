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

/** In raw SQL: `insert into t`, `update t`, `delete from t` write; `from t`, `join t` read. */
const SQL_WRITE = /\b(?:insert\s+into|update|delete\s+from)\s+"?([a-z_][a-z0-9_]*)"?/gi;
const SQL_READ = /\b(?:from|join)\s+"?([a-z_][a-z0-9_]*)"?/gi;

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
    if (ts.isCallExpression(node) && ts.isPropertyAccessExpression(node.expression)) {
      const method = node.expression.name.text;
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
      for (const [re, kind] of [
        [SQL_WRITE, 'write'],
        [SQL_READ, 'read'],
      ] as const) {
        for (const m of text.matchAll(re)) {
          const name = m[1].toLowerCase();
          if (!isTable(name)) continue;
          named.add(name);
          accesses.push({ file, line: lineOf(node), module, table: name, kind, how: 'sql' });
        }
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
