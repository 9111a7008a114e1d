import { sql } from 'kysely';
import type { RigConfiguration } from '@loomwright/shared';
import { Database, type Executor } from '../database/database';
import { Injectable } from '@nestjs/common';

const columns = ['id', 'name', 'configuration', 'created_at', 'updated_at'] as const;

/** Every query on saved configurations and short links. Ownership is part of each query. */
@Injectable()
export class ConfigurationsRepository {
  constructor(private readonly db: Database) {}

  listFor(ownerId: string, trx: Executor = this.db) {
    return trx
      .selectFrom('saved_configurations')
      .select(columns)
      .where('owner_id', '=', ownerId)
      .orderBy('updated_at', 'desc')
      .orderBy('name')
      .execute();
  }

  findFor(ownerId: string, id: string, trx: Executor = this.db) {
    return trx.selectFrom('saved_configurations').select(columns).where('owner_id', '=', ownerId).where('id', '=', id).executeTakeFirst();
  }

  countFor(ownerId: string, trx: Executor = this.db) {
    return trx
      .selectFrom('saved_configurations')
      .select((eb) => eb.fn.countAll<string>().as('n'))
      .where('owner_id', '=', ownerId)
      .executeTakeFirstOrThrow()
      .then((r) => Number(r.n));
  }

  namesFor(ownerId: string, trx: Executor = this.db) {
    return trx
      .selectFrom('saved_configurations')
      .select('name')
      .where('owner_id', '=', ownerId)
      .execute()
      .then((rows) => rows.map((r) => r.name));
  }

  insert(trx: Executor, ownerId: string, name: string, configuration: RigConfiguration) {
    return trx
      .insertInto('saved_configurations')
      .values({ owner_id: ownerId, name, configuration: JSON.stringify(configuration) })
      .returning(columns)
      .executeTakeFirstOrThrow();
  }

  update(trx: Executor, ownerId: string, id: string, change: { name?: string; configuration?: RigConfiguration }) {
    return trx
      .updateTable('saved_configurations')
      .set({
        ...(change.name !== undefined && { name: change.name }),
        ...(change.configuration !== undefined && { configuration: JSON.stringify(change.configuration) }),
        updated_at: sql`now()`,
      })
      .where('owner_id', '=', ownerId)
      .where('id', '=', id)
      .returning(columns)
      .executeTakeFirst();
  }

  delete(trx: Executor, ownerId: string, id: string) {
    return trx
      .deleteFrom('saved_configurations')
      .where('owner_id', '=', ownerId)
      .where('id', '=', id)
      .executeTakeFirst()
      .then((r) => Number(r.numDeletedRows));
  }

  /** Serialises one player's writes, so the count limit and the name check see each other. */
  lockOwner(trx: Executor, ownerId: string) {
    return sql`select pg_advisory_xact_lock(hashtext(${`saved-configurations:${ownerId}`}))`.execute(trx);
  }

  /**
   * The code for a configuration: the one it already has (same digest), or `code` when new. One
   * statement, so two players sharing the same rig at the same moment get the same code.
   */
  upsertLink(code: string, digest: string, configuration: RigConfiguration, trx: Executor = this.db) {
    return trx
      .insertInto('configuration_links')
      .values({ code, digest, configuration: JSON.stringify(configuration) })
      .onConflict((oc) => oc.column('digest').doUpdateSet({ digest: (eb) => eb.ref('excluded.digest') }))
      .returning('code')
      .executeTakeFirstOrThrow()
      .then((r) => r.code);
  }

  openLink(code: string, trx: Executor = this.db) {
    return trx
      .updateTable('configuration_links')
      .set({ last_opened_at: sql`now()` })
      .where('code', '=', code)
      .returning('configuration')
      .executeTakeFirst()
      .then((r) => r?.configuration);
  }
}
