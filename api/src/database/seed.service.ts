import { Injectable, Logger, OnApplicationBootstrap } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { AppConfig } from '../config/configuration';
import { Database } from './database';
import { seedDemoShop } from './seed';

@Injectable()
export class SeedService implements OnApplicationBootstrap {
  private readonly logger = new Logger('Seed');

  constructor(
    private readonly db: Database,
    private readonly config: ConfigService<AppConfig, true>,
  ) {}

  async onApplicationBootstrap() {
    if (!this.config.get('app', { infer: true }).seedDemo) return;
    await seedDemoShop(this.db);
    this.logger.log('Demo shop data is in place');
  }
}
