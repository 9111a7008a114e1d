import type { Kysely } from 'kysely';

// Frozen in time: never import application code here.
// This migration once rewrote the labor lines of stored quotes into the new wording. Quotes are
// immutable (the quotes_no_update trigger refuses any UPDATE), so on a shop database holding quotes
// it failed and stopped the upgrade. Stored lines now stay exactly as the player saw them; the money
// facts read an old line's basis from its words at read time (storedLaborBasis in shared/). The name
// stays so databases that already recorded it keep a complete migration list.
export async function up(_db: Kysely<unknown>): Promise<void> {
  // Nothing to change: quotes are snapshots.
}

export async function down(): Promise<void> {
  // Nothing to undo.
}
