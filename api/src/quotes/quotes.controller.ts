import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { Body, Controller, Get, Header, HttpCode, Param, Post, Req, Res, StreamableFile, UnauthorizedException } from '@nestjs/common';
import { ApiAcceptedResponse, ApiOkResponse, ApiOperation, ApiProduces, ApiTags, ApiTooManyRequestsResponse } from '@nestjs/swagger';
import {
  emailQuoteSchema,
  quotePdfRequestSchema,
  type AuthUser,
  type EmailQuoteInput,
  type QuotePdfRequest,
  type QuoteEmailSent,
  type RigConfiguration,
} from '@loomwright/shared';
import type { Request, Response } from 'express';
import { CurrentUser } from '../auth/current-user.decorator';
import { Public } from '../auth/public.decorator';
import { bookingIdPipe } from '../bookings/booking-id.pipe';
import { ApiZodBody, ApiZodResponse } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { PDF_CONTENT_SECURITY_POLICY } from '../security/security-headers';
import { QuotesService } from './quotes.service';
import { ApiErrorCodes } from '../common/api-document';

@ApiTags('quotes')
@Controller('quotes')
export class QuotesController {
  constructor(private readonly quotes: QuotesService) {}

  /** Any configuration, saved or not, as a printable quote; open to anyone, like the estimate. */
  @Public()
  @ApiOperation({ summary: 'A quote for a configuration as PDF' })
  @Post('pdf')
  @HttpCode(200)
  @ApiZodBody(quotePdfRequestSchema)
  @ApiProduces('application/pdf')
  @ApiOkResponse({ description: 'application/pdf: line items, totals, layout, power plan, cable list and cautions.' })
  async pdf(@Body(new ZodValidationPipe(quotePdfRequestSchema)) body: QuotePdfRequest, @Res() res: Response) {
    const { pdf } = await this.quotes.pdf(body.configuration as RigConfiguration);
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', 'attachment; filename="loomwright-quote.pdf"');
    res.setHeader('Cache-Control', 'no-store');
    res.end(pdf);
  }

  /** The quote of any configuration, e-mailed to the signed-in person's own address with the PDF attached. */
  @ApiOperation({ summary: 'E-mail a quote for a configuration to yourself' })
  @Post('email')
  @HttpCode(202)
  @ApiZodBody(emailQuoteSchema)
  @ApiZodResponse(responseSchemas.quoteEmailSentSchema)
  @ApiAcceptedResponse({ description: '{ sentTo, remaining }: the message is queued for your address.' })
  @ApiTooManyRequestsResponse({ description: 'More quotes than the hourly limit were asked for.' })
  email(@CurrentUser() user: AuthUser, @Body(new ZodValidationPipe(emailQuoteSchema)) body: EmailQuoteInput): Promise<QuoteEmailSent> {
    return this.quotes.email(user, body.configuration as RigConfiguration, body.title);
  }
}

@ApiTags('quotes')
@Controller('bookings')
export class BookingQuoteController {
  constructor(private readonly quotes: QuotesService) {}

  /**
   * A booking's quote as priced, for its player (signed in) and the shop. Opened from the
   * request-received e-mail: a browser without a session is sent to sign in first, then to the
   * build's page, where the same PDF is one click away.
   */
  @Public()
  @ApiOperation({ summary: 'A booking’s quote as PDF' })
  @ApiErrorCodes('not_signed_in')
  @Get(':id/quote.pdf')
  @ApiProduces('application/pdf')
  @Header('Content-Security-Policy', PDF_CONTENT_SECURITY_POLICY)
  @ApiOkResponse({ description: 'The PDF of the booking’s quote (firm once accepted).' })
  async bookingQuote(
    @CurrentUser() user: AuthUser | undefined,
    @Param('id', bookingIdPipe) id: string,
    @Req() req: Request,
    @Res({ passthrough: true }) res: Response,
  ) {
    if (!user) {
      if (req.accepts(['json', 'html']) === 'html') {
        res.redirect(302, `/sign-in?next=${encodeURIComponent(`/builds/${id}`)}`);
        return;
      }
      throw new UnauthorizedException('Please sign in to open this quote.');
    }
    const { reference, pdf } = await this.quotes.bookingPdf(user, id);
    res.setHeader('Cache-Control', 'private, no-store');
    return new StreamableFile(pdf, {
      type: 'application/pdf',
      disposition: `inline; filename="quote-${reference}.pdf"`,
      length: pdf.length,
    });
  }
}
