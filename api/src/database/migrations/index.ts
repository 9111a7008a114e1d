import type { Migration } from 'kysely';
import * as foundation from './20261201_0001_foundation';
import * as domain from './20261201_0002_domain';
import * as mailDelivery from './20261201_0400_mail_delivery';

/**
 * Every migration, by its sortable name. Listed statically so the same list runs from the
 * compiled build and under vitest; append new ones at the end, never rename old ones.
 */
export const migrations: Record<string, Migration> = {
  '20261201_0001_foundation': foundation,
  '20261201_0002_domain': domain,
  '20261201_0400_mail_delivery': mailDelivery,
};
