import { BadRequestException, Injectable } from '@nestjs/common';
import { estimateRig, EstimateInputError, type EstimateResult, type RigConfiguration } from '@loomwright/shared';
import { Database, Executor } from '../database/database';
import { PriceBookService } from '../price-book/price-book.service';

@Injectable()
export class EstimatesService {
  constructor(
    private readonly db: Database,
    private readonly priceBook: PriceBookService,
  ) {}

  /**
   * Prices a validated configuration from the current price book version (read through `trx`
   * when given, so a booking and its quote see the same version). A configuration that names
   * something the book does not hold is a 400 naming the field.
   */
  async price(config: RigConfiguration, trx: Executor = this.db): Promise<EstimateResult> {
    const { version, book } = await this.priceBook.current(trx);
    try {
      return estimateRig(config, book, { version });
    } catch (error) {
      if (error instanceof EstimateInputError)
        throw new BadRequestException({
          code: 'validation_failed',
          message: [error.message],
          issues: [{ path: error.field, message: error.message }],
        });
      throw error;
    }
  }
}
