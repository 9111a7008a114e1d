import { NotFoundException } from '@nestjs/common';
import type { Selectable } from 'kysely';
import type { ShopProfile, ShopSettingsView } from '@loomwright/shared';
import type { ShopSettingsTable } from '../database/database';

type ShopSettingsRow = Selectable<ShopSettingsTable>;

/** The shop's settings row, or a 404 in words while the shop has none (before the seed or set-up). */
export function shopSetUp<T>(row: T | undefined): T {
  if (!row) throw new NotFoundException('The shop has not been set up yet; run the seed or add its settings.');
  return row;
}

/**
 * What every answer about the shop starts from (the public profile and the owner's settings page):
 * its name and voice, and its postal address as its parts (null until the shop gives one).
 */
export function shopProfileFields(row: ShopSettingsRow): Omit<ShopProfile, 'postalAddress'> & Pick<ShopSettingsView, 'postalAddress'> {
  return {
    name: row.name,
    tagline: row.tagline,
    currency: row.currency.trim(),
    countryCode: row.country_code.trim(),
    timezone: row.timezone,
    locale: row.locale,
    contactEmail: row.contact_email,
    postalAddress: row.address_line1
      ? {
          line1: row.address_line1,
          line2: row.address_line2,
          city: row.address_city,
          region: row.address_region,
          postalCode: row.address_postal_code,
        }
      : null,
  };
}
