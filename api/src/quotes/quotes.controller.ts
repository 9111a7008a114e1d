import { Body, Controller, HttpCode, Post, Res } from '@nestjs/common';
import { ApiBody, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { quotePdfRequestSchema, type QuotePdfRequest, type RigConfiguration } from '@loomwright/shared';
import type { Response } from 'express';
import { z } from 'zod';
import { Public } from '../auth/public.decorator';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { QuotesService } from './quotes.service';

@ApiTags('quotes')
@Controller('quotes')
export class QuotesController {
  constructor(private readonly quotes: QuotesService) {}

  /** Any configuration, saved or not, as a printable quote; open to anyone, like the estimate. */
  @Public()
  @Post('pdf')
  @HttpCode(200)
  @ApiBody({ schema: z.toJSONSchema(quotePdfRequestSchema, { io: 'input', unrepresentable: 'any' }) as object })
  @ApiOkResponse({ description: 'application/pdf: line items, totals, layout, power plan, cable list and cautions.' })
  async pdf(@Body(new ZodValidationPipe(quotePdfRequestSchema)) body: QuotePdfRequest, @Res() res: Response) {
    const { pdf } = await this.quotes.pdf(body.configuration as RigConfiguration);
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', 'attachment; filename="loomwright-quote.pdf"');
    res.setHeader('Cache-Control', 'no-store');
    res.end(pdf);
  }
}
