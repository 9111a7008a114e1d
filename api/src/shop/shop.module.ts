import { Module } from '@nestjs/common';
import { ShopController } from './shop.controller';
import { ShopRepository } from './shop.repository';
import { ShopService } from './shop.service';

@Module({ controllers: [ShopController], providers: [ShopService, ShopRepository], exports: [ShopService, ShopRepository] })
export class ShopModule {}
