import { Injectable, NotFoundException } from '@nestjs/common';
import { postalAddressLine, type ShopProfile } from '@loomwright/shared';
import { ShopRepository } from './shop.repository';

@Injectable()
export class ShopService {
  constructor(private readonly shops: ShopRepository) {}

  async profile(): Promise<ShopProfile> {
    const row = await this.shops.findSettings();
    if (!row) throw new NotFoundException('The shop has not been set up yet; run the seed or add its settings.');
    return {
      name: row.name,
      tagline: row.tagline,
      currency: row.currency.trim(),
      countryCode: row.country_code.trim(),
      timezone: row.timezone,
      locale: row.locale,
      contactEmail: row.contact_email,
      postalAddress: row.address_line1
        ? postalAddressLine(
            {
              line1: row.address_line1,
              line2: row.address_line2,
              city: row.address_city,
              region: row.address_region,
              postalCode: row.address_postal_code,
            },
            row.country_code.trim(),
          )
        : null,
    };
  }
}
