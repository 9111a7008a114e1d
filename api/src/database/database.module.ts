import { Global, Inject, Module, OnApplicationShutdown, OnModuleInit, Logger } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { AppConfig } from '../config/configuration';
import { Pool } from 'pg';
import { createPool, databaseOnPool } from './create-database';
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
    { provide: Database, inject: [Pool], useFactory: (pool: Pool) => databaseOnPool(pool) },
    SeedService,
  ],
  exports: [Database, Pool],
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
