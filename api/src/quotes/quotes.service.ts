import { Injectable } from '@nestjs/common';
import type { RigConfiguration } from '@loomwright/shared';
import { EstimatesService } from '../estimates/estimates.service';
import { PriceBookService } from '../price-book/price-book.service';
import { ShopService } from '../shop/shop.service';
import { renderQuote } from './quote-document';

@Injectable()
export class QuotesService {
  constructor(
    private readonly estimates: EstimatesService,
    private readonly priceBook: PriceBookService,
    private readonly shop: ShopService,
  ) {}

  /** Prices the configuration from the current book (the same answer POST /api/estimates gives) and prints it. */
  async pdf(configuration: RigConfiguration, title = 'Quote'): Promise<{ pdf: Buffer; totalLow: string; totalHigh: string }> {
    const { book } = await this.priceBook.current();
    const estimate = await this.estimates.price(configuration);
    const shopName = await this.shop.profile().then((p) => p.name, () => 'Loomwright');
    const pdf = await renderQuote({ shopName, configuration, estimate, book, title, printedAt: new Date() });
    return { pdf, totalLow: estimate.totalLow, totalHigh: estimate.totalHigh };
  }
}
