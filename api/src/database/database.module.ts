import { Global, Inject, Module, OnApplicationShutdown, OnModuleInit, Logger } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { AppConfig } from '../config/configuration';
import { Pool } from 'pg';
import { createPool, databaseOnPool } from './create-database';
import { DatabaseChanges } from './change-notifications';
import { Database } from './database';
import { migrateToLatest } from './migrate';
import { SeedService } from './seed.service';

@Global()
@Module({
  providers: [
    {
      // pg's own Pool class is the token: code that speaks to pg directly (the throttling store) shares it.
      provide: Pool,
      inject: [ConfigService],
      useFactory: (config: ConfigService<AppConfig, true>) => {
        const { url, poolMax } = config.get('database', { infer: true });
        return createPool(url, poolMax);
      },
    },
    {
      provide: Database,
      inject: [Pool, DatabaseChanges],
      // The in-memory copies drop themselves as soon as this process commits a write they depend on.
      useFactory: (pool: Pool, changes: DatabaseChanges) => databaseOnPool(pool, (tables) => changes.committedHere(tables)),
    },
    SeedService,
    DatabaseChanges,
  ],
  exports: [Database, Pool, DatabaseChanges],
})
export class DatabaseModule implements OnModuleInit, OnApplicationShutdown {
  private readonly logger = new Logger('Database');

  constructor(@Inject(Database) private readonly db: Database) {}

  async onModuleInit() {
    const applied = await migrateToLatest(this.db);
    if (applied.length) this.logger.log(`Applied migrations: ${applied.join(', ')}`);
  }

  async onApplicationShutdown() {
    await this.db.destroy();
  }
}
