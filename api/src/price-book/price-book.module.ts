import { Module } from '@nestjs/common';
import { PriceBookCache } from './price-book-cache';
import { PriceBookController } from './price-book.controller';
import { PriceBookRepository } from './price-book.repository';
import { PriceBookService } from './price-book.service';

@Module({
  controllers: [PriceBookController],
  providers: [PriceBookService, PriceBookRepository, PriceBookCache],
  exports: [PriceBookService],
})
export class PriceBookModule {}
