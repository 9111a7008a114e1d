import { Injectable, NotFoundException } from '@nestjs/common';
import {
  bookingStateLabels,
  estimateRig,
  postalAddressLine,
  shopFormat,
  type AuthUser,
  type EstimateResult,
  type RigChecks,
} from '@loomwright/shared';
import { BookingsService } from '../bookings/bookings.service';
import { bookingAsSeenBy } from '../bookings/customer-contact.middleware';
import { paperSizeFor } from '../common/paper-size';
import { PriceBookService } from '../price-book/price-book.service';
import { renderBuildSheet } from './build-sheet-document';
import { ShopRepository } from '../shop/shop.repository';
import { BuildSheetsRepository } from './build-sheets.repository';

@Injectable()
export class BuildSheetsService {
  constructor(
    private readonly sheets: BuildSheetsRepository,
    private readonly priceBook: PriceBookService,
    private readonly bookings: BookingsService,
    private readonly shop: ShopRepository,
  ) {}

  /**
   * The sheet is printed from the quote as priced: its configuration and its price book version,
   * so a later price change never alters what the bench builds from.
   */
  async render(bookingId: string, viewer: AuthUser): Promise<{ reference: string; pdf: Buffer }> {
    const booking = await this.sheets.findBooking(bookingId);
    if (!booking) throw new NotFoundException(`No booking ${bookingId}`);
    const quote = await this.bookings.latestQuote(bookingId);
    if (!quote) throw new NotFoundException(`Booking ${booking.reference} has no quote yet`);
    const published = await this.priceBook.version(quote.price_book_version);
    // The foreign key keeps the version; its absence means the database was edited by hand.
    if (!published) throw new NotFoundException(`Price book version ${quote.price_book_version} of this quote is missing`);
    const book = published.book;
    const configuration = quote.configuration;
    // Quotes written before the checks existed, or before they numbered the signal chain, get
    // their checks re-derived from their own version; the prices stay as quoted.
    let estimate: EstimateResult = quote.estimate;
    if (!estimate.checks || estimate.checks.signalChain.devices.some((d) => !d.number)) {
      estimate = { ...estimate, checks: estimateRig(configuration, book, { version: quote.price_book_version }).checks };
    }
    const checks = estimate.checks as RigChecks;
    // The money on paper is the booking's own money facts (one function for the apps, mails and
    // this sheet), and the customer's address follows the same rule as on screen.
    const detail = bookingAsSeenBy(viewer, await this.bookings.getDetail(bookingId));
    const shop = await this.shop.findSettings();
    const format = shopFormat({ locale: shop?.locale, currency: detail.money.currency, timeZone: shop?.timezone });
    const pdf = await renderBuildSheet({
      shopName: shop?.name ?? 'Loomwright',
      shopAddress: shop?.address_line1
        ? postalAddressLine(
            {
              line1: shop.address_line1,
              line2: shop.address_line2,
              city: shop.address_city,
              region: shop.address_region,
              postalCode: shop.address_postal_code,
            },
            shop.country_code.trim(),
          )
        : null,
      reference: booking.reference,
      stateLabel: bookingStateLabels[booking.state],
      customer: detail.customer.email ? `${booking.customer_name} <${detail.customer.email}>` : booking.customer_name,
      money: {
        facts: detail.money,
        quote: detail.firmQuote ?? detail.quote,
        extras: detail.extras.map((e) => ({ description: e.description, amount: e.amount, status: e.status })),
        format,
      },
      builder: booking.builder_name ? `${booking.builder_name} (${booking.builder_level})` : null,
      benchDate: booking.bench_date,
      expectedCompletion: booking.expected_completion,
      configuration,
      customerNotes: booking.customer_notes,
      estimate,
      checks,
      functions: configuration.functions.map((code) => book.functions.find((f) => f.code === code)).filter((f) => f !== undefined),
      surfaceName: book.surfaces.find((s) => s.id === configuration.surfaceId)?.name ?? configuration.surfaceId,
      caseName: book.cases.find((c) => c.id === configuration.caseId)?.name ?? configuration.caseId,
      printedAt: new Date(),
      format,
      paper: paperSizeFor(shop?.country_code),
    });
    return { reference: booking.reference, pdf };
  }
}
