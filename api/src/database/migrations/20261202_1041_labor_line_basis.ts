import { Kysely, sql } from 'kysely';

// Frozen in time: never import application code here.
// Labor lines of stored estimates said "…, at 80.00–100.00 per hour" with no currency. From now on
// each labor line carries its `basis` (what the hours count) and the engine writes the rate with the
// currency; this gives stored lines the same shape once, so a firm quote can word them at its one
// rate. Lines already with a basis, or not in the old shape, are left as they are.
interface Line {
  kind?: string;
  explanation?: string;
  basis?: string;
}

const OLD_SHAPE = /^(.*), at (\d+(?:\.\d+)?)–(\d+(?:\.\d+)?) per hour$/s;

export async function up(db: Kysely<any>): Promise<void> {
  const rows = await db.selectFrom('quotes').select(['id', 'currency', 'estimate']).execute();
  for (const row of rows) {
    const estimate = row.estimate as { lines?: Line[] };
    if (!Array.isArray(estimate?.lines)) continue;
    const currency = String(row.currency).trim();
    let money: Intl.NumberFormat;
    try {
      money = new Intl.NumberFormat('en-US', { style: 'currency', currency });
    } catch {
      continue;
    }
    let changed = false;
    const lines = estimate.lines.map((line) => {
      if (line.kind !== 'labor' || line.basis !== undefined || typeof line.explanation !== 'string') return line;
      const match = OLD_SHAPE.exec(line.explanation);
      if (!match) return line;
      changed = true;
      const [, basis, low, high] = match;
      const range = (money as unknown as { formatRange(a: string, b: string): string }).formatRange(low!, high!);
      return { ...line, basis, explanation: `${basis}, at ${range} per hour` };
    });
    if (changed) {
      await db
        .updateTable('quotes')
        .set({ estimate: sql`${JSON.stringify({ ...estimate, lines })}::jsonb` })
        .where('id', '=', row.id)
        .execute();
    }
  }
}

export async function down(): Promise<void> {
  // The basis is an addition the old code ignores; nothing to undo.
}
