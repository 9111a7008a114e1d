import { Controller, Get, Query, Res } from '@nestjs/common';
import { ApiCookieAuth, ApiOkResponse, ApiOperation, ApiProduces, ApiTags } from '@nestjs/swagger';
import { dateRangeQuerySchema, type DateRangeQuery } from '@loomwright/shared';
import type { Response } from 'express';
import { Roles } from '../auth/roles.decorator';
import { ApiZodQuery } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { sendCsv } from './csv-response';
import { ExportsService } from './exports.service';

const range = new ZodValidationPipe(dateRangeQuerySchema);

@ApiTags('exports')
@ApiCookieAuth('lw_session')
@Roles('owner')
@Controller('exports')
export class ExportsController {
  constructor(private readonly exports: ExportsService) {}

  @ApiOperation({ summary: 'Export bookings as CSV' })
  @Get('bookings.csv')
  @ApiProduces('text/csv')
  @ApiZodQuery(dateRangeQuerySchema)
  @ApiOkResponse({
    description:
      'Bookings requested from … to (shop days), one row each: state, customer, builder, bench dates, estimate, firm total and the money facts, quoted and recorded hours.',
  })
  async bookings(@Query(range) query: DateRangeQuery, @Res() res: Response) {
    await sendCsv(res, await this.exports.open('bookings', query));
  }

  @ApiOperation({ summary: 'Export payments and refunds as CSV' })
  @Get('payments.csv')
  @ApiProduces('text/csv')
  @ApiZodQuery(dateRangeQuerySchema)
  @ApiOkResponse({
    description:
      'Money in and back from … to: each deposit and balance on the day it arrived, each refund (a negative amount) on the day it went back.',
  })
  async payments(@Query(range) query: DateRangeQuery, @Res() res: Response) {
    await sendCsv(res, await this.exports.open('payments', query));
  }

  @ApiOperation({ summary: 'Export hour entries as CSV' })
  @Get('hours.csv')
  @ApiProduces('text/csv')
  @ApiZodQuery(dateRangeQuerySchema)
  @ApiOkResponse({ description: 'Hour entries worked on a day from … to: build, builder, hours, note and who recorded them.' })
  async hours(@Query(range) query: DateRangeQuery, @Res() res: Response) {
    await sendCsv(res, await this.exports.open('hours', query));
  }
}
