import { Injectable } from '@nestjs/common';
import { postalAddressLine, type ShopProfile } from '@loomwright/shared';
import { shopProfileFields, shopSetUp } from './shop-profile';
import { ShopRepository } from './shop.repository';

@Injectable()
export class ShopService {
  constructor(private readonly shops: ShopRepository) {}

  async profile(): Promise<ShopProfile> {
    const profile = shopProfileFields(shopSetUp(await this.shops.findSettings()));
    return { ...profile, postalAddress: profile.postalAddress && postalAddressLine(profile.postalAddress, profile.countryCode) };
  }
}
