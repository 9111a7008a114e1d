import { Module } from '@nestjs/common';
import { EstimatesModule } from '../estimates/estimates.module';
import { PriceBookModule } from '../price-book/price-book.module';
import { ShopModule } from '../shop/shop.module';
import { QuotesController } from './quotes.controller';
import { QuotesService } from './quotes.service';

@Module({ imports: [EstimatesModule, PriceBookModule, ShopModule], controllers: [QuotesController], providers: [QuotesService], exports: [QuotesService] })
export class QuotesModule {}
