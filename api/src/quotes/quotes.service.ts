import { HttpException, HttpStatus, Injectable, NotFoundException } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import {
  configurationMessages,
  estimateRig,
  shopFormat,
  QUOTE_EMAILS_PER_HOUR,
  type AuthUser,
  type EstimateResult,
  type QuoteEmailSent,
  type RigConfiguration,
} from '@loomwright/shared';
import type { AppConfig } from '../config/configuration';
import { BookingsService } from '../bookings/bookings.service';
import { ConfigurationsService } from '../configurations/configurations.service';
import { Database } from '../database/database';
import { EstimatesService } from '../estimates/estimates.service';
import { MailService } from '../mail/mail.service';
import { PriceBookService } from '../price-book/price-book.service';
import { ShopService } from '../shop/shop.service';
import { renderQuote } from './quote-document';
import { paperSizeFor } from '../common/paper-size';
import { quoteMailLines } from '../mail/quote-mail-lines';
import { MailOutboxRepository } from '../mail/mail-outbox.repository';
import { QuotesRepository } from './quotes.repository';

const QUOTE_MAIL = 'configuration-quote' as const;

/** "Stage board" → "loomwright-quote-stage-board-2026-12-02.pdf". */
export function quoteFilename(title: string | undefined, day: Date): string {
  const slug = (title ?? '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60);
  return `loomwright-quote${slug ? `-${slug}` : ''}-${day.toISOString().slice(0, 10)}.pdf`;
}

@Injectable()
export class QuotesService {
  private readonly publicUrl: string;

  constructor(
    private readonly db: Database,
    private readonly estimates: EstimatesService,
    private readonly priceBook: PriceBookService,
    private readonly shop: ShopService,
    private readonly mail: MailService,
    private readonly bookings: BookingsService,
    private readonly configurations: ConfigurationsService,
    private readonly quotes: QuotesRepository,
    private readonly outbox: MailOutboxRepository,
    config: ConfigService<AppConfig, true>,
  ) {
    this.publicUrl = config.get('app', { infer: true }).publicUrl;
  }

  /** Prices the configuration from the current book (the same answer POST /api/estimates gives) and prints it. */
  async pdf(configuration: RigConfiguration, title = 'Quote'): Promise<{ pdf: Buffer; estimate: EstimateResult }> {
    const { book } = await this.priceBook.current();
    const estimate = await this.estimates.price(configuration);
    const pdf = await renderQuote({ ...(await this.shopPrint()), configuration, estimate, book, title, printedAt: new Date() });
    return { pdf, estimate };
  }

  /**
   * E-mails the quote of any configuration to the signed-in person's own address (never to an
   * address typed in: that would let anyone send mail in the shop's name), at most
   * QUOTE_EMAILS_PER_HOUR an hour, with the PDF attached and a short link that reopens it.
   */
  async email(user: AuthUser, configuration: RigConfiguration, title?: string): Promise<QuoteEmailSent> {
    const printedAt = new Date();
    const { pdf, estimate } = await this.pdf(configuration, title || 'Quote');
    const link = await this.configurations.link(configuration);
    return this.db.transaction().execute(async (trx) => {
      await this.quotes.lockQuoteMail(trx, user.id);
      const sent = await this.outbox.sentInLastHour(trx, user.id, QUOTE_MAIL);
      if (sent >= QUOTE_EMAILS_PER_HOUR) throw new HttpException(configurationMessages.quoteEmailLimit, HttpStatus.TOO_MANY_REQUESTS);
      await this.mail.enqueue(trx, {
        template: QUOTE_MAIL,
        to: user.email,
        userId: user.id,
        data: {
          name: user.name,
          ...(title && { title }),
          currency: estimate.currency,
          totalLow: estimate.totalLow,
          totalHigh: estimate.totalHigh,
          deposit: estimate.deposit,
          priceBookVersion: String(estimate.priceBookVersion),
          lines: quoteMailLines(estimate),
          pdfBase64: pdf.toString('base64'),
          pdfFilename: quoteFilename(title, printedAt),
          openUrl: `${this.publicUrl}${link.path}`,
        },
      });
      return { sentTo: user.email, remaining: QUOTE_EMAILS_PER_HOUR - sent - 1 };
    });
  }

  /**
   * A booking's quote as it was priced (its configuration, engine answer and price-book version),
   * for its player and the shop; a firm price once a builder accepted. Another player's booking is a 404.
   */
  async bookingPdf(user: AuthUser, bookingId: string): Promise<{ reference: string; pdf: Buffer }> {
    const { reference } = await this.bookings.findVisible(user, bookingId);
    const quote = await this.bookings.latestQuote(bookingId);
    if (!quote) throw new NotFoundException('This booking has no quote yet.');
    const published = await this.priceBook.version(quote.price_book_version);
    if (!published) throw new NotFoundException(`Price book version ${quote.price_book_version} of this quote is missing.`);
    let estimate: EstimateResult = quote.estimate;
    // A quote stored before the checks numbered the chain gets its checks from its own version; prices stay as quoted.
    if (!estimate.checks || estimate.checks.signalChain.devices.some((d) => !d.number)) {
      estimate = { ...estimate, checks: estimateRig(quote.configuration, published.book, { version: quote.price_book_version }).checks };
    }
    const pdf = await renderQuote({
      ...(await this.shopPrint()),
      configuration: quote.configuration,
      estimate,
      book: published.book,
      title: `Build ${reference}`,
      printedAt: new Date(quote.created_at),
      firm: quote.kind === 'firm' && quote.total && quote.hourly_rate ? { total: quote.total, hourlyRate: quote.hourly_rate } : undefined,
    });
    return { reference, pdf };
  }

  /** The shop's name, its voice (locale, currency, time zone) and its paper (Letter or A4 by country) for the PDF. */
  private async shopPrint() {
    const shop = await this.shop.profile().catch(() => undefined);
    return {
      shopName: shop?.name ?? 'Loomwright',
      format: shopFormat({ locale: shop?.locale, currency: shop?.currency, timeZone: shop?.timezone }),
      paper: paperSizeFor(shop?.countryCode),
    };
  }
}
