import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { Controller, Get, Query } from '@nestjs/common';
import { ApiBadRequestResponse, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import { leadTimeQuerySchema, type BenchLeadTime, type LeadTimeQuery } from '@loomwright/shared';
import { Public } from '../auth/public.decorator';
import { BenchService } from './bench.service';
import { ApiZodQuery, ApiZodResponse } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';

/** The shop's queue as a player sees it before paying: a date, never who or what else is booked. */
@ApiTags('bench')
@Controller('bench/lead-time')
export class LeadTimeController {
  constructor(private readonly bench: BenchService) {}

  @Public()
  @ApiOperation({ summary: 'The earliest start for a builder level' })
  @ApiZodResponse(responseSchemas.benchLeadTimeSchema)
  @Get()
  @ApiOkResponse({
    description: 'The earliest bench date any builder of that level could start the build, its expected completion and the ship-by day.',
  })
  @ApiBadRequestResponse({ description: 'The hours or the level are missing or malformed, said in words.' })
  @ApiZodQuery(leadTimeQuerySchema)
  leadTime(@Query(new ZodValidationPipe(leadTimeQuerySchema)) query: LeadTimeQuery): Promise<BenchLeadTime> {
    return this.bench.leadTime(query.hours, query.level);
  }
}
