import { Module } from '@nestjs/common';
import { BookingsModule } from '../bookings/bookings.module';
import { ShopModule } from '../shop/shop.module';
import { PriceBookModule } from '../price-book/price-book.module';
import { BuildSheetsController } from './build-sheets.controller';
import { BuildSheetsRepository } from './build-sheets.repository';
import { BuildSheetsService } from './build-sheets.service';

@Module({
  imports: [PriceBookModule, BookingsModule, ShopModule],
  controllers: [BuildSheetsController],
  providers: [BuildSheetsService, BuildSheetsRepository],
  exports: [BuildSheetsService],
})
export class BuildSheetsModule {}
