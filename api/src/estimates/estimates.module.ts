import { Module } from '@nestjs/common';
import { PriceBookModule } from '../price-book/price-book.module';
import { EstimatesController } from './estimates.controller';
import { EstimatesService } from './estimates.service';

@Module({ imports: [PriceBookModule], controllers: [EstimatesController], providers: [EstimatesService], exports: [EstimatesService] })
export class EstimatesModule {}
