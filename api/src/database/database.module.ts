import { Global, Inject, Module, OnApplicationShutdown, OnModuleInit, Logger } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { AppConfig } from '../config/configuration';
import { createDatabase } from './create-database';
import { Database } from './database';
import { migrateToLatest } from './migrate';
import { SeedService } from './seed.service';

@Global()
@Module({
  providers: [
    {
      provide: Database,
      inject: [ConfigService],
      useFactory: (config: ConfigService<AppConfig, true>) => {
        const { url, poolMax } = config.get('database', { infer: true });
        return createDatabase(url, poolMax);
      },
    },
    SeedService,
  ],
  exports: [Database],
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
