import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { Controller, Get, Query } from '@nestjs/common';
import { ApiCookieAuth, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  dateRangeQuerySchema,
  type DateRangeQuery,
  type HoursReport,
  type OutstandingReport,
  type RevenueReport,
  type UtilisationReport,
} from '@loomwright/shared';
import { Roles } from '../auth/roles.decorator';
import { ApiZodQuery, ApiZodResponse } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { ReportsService } from './reports.service';
import { ApiErrorCodes } from '../common/api-document';

const range = new ZodValidationPipe(dateRangeQuerySchema);

@ApiTags('reports')
@ApiCookieAuth('lw_session')
@Roles('owner')
@Controller('reports')
export class ReportsController {
  constructor(private readonly reports: ReportsService) {}

  @ApiOperation({ summary: 'Revenue per month' })
  @Get('revenue')
  @ApiZodQuery(dateRangeQuerySchema)
  @ApiZodResponse(responseSchemas.revenueReportSchema)
  @ApiOkResponse({ description: 'Deposits, balances and refunds per calendar month of the shop (payments.csv summed by month).' })
  revenue(@Query(range) query: DateRangeQuery): Promise<RevenueReport> {
    return this.reports.revenue(query);
  }

  @ApiOperation({ summary: 'Money owed now' })
  @Get('outstanding')
  @ApiZodResponse(responseSchemas.outstandingReportSchema)
  @ApiOkResponse({ description: 'Money owed now: deposits of open requests, balances of builds; and money held beyond what is owed.' })
  outstanding(): Promise<OutstandingReport> {
    return this.reports.outstanding();
  }

  @ApiOperation({ summary: 'Quoted against spent hours' })
  @Get('hours')
  @ApiZodQuery(dateRangeQuerySchema)
  @ApiZodResponse(responseSchemas.hoursReportSchema)
  @ApiOkResponse({ description: 'Quoted against spent hours per build and per builder, for builds with hours worked in the range.' })
  hours(@Query(range) query: DateRangeQuery): Promise<HoursReport> {
    return this.reports.hours(query);
  }

  @ApiOperation({ summary: 'Bench utilisation per builder and week' })
  @ApiErrorCodes('bad_request')
  @Get('utilisation')
  @ApiZodQuery(dateRangeQuerySchema)
  @ApiZodResponse(responseSchemas.utilisationReportSchema)
  @ApiOkResponse({ description: 'Bench capacity, booked and recorded hours per builder per ISO week.' })
  utilisation(@Query(range) query: DateRangeQuery): Promise<UtilisationReport> {
    return this.reports.utilisation(query);
  }
}
