import { Controller, Get, Query } from '@nestjs/common';
import { ApiBadRequestResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { leadTimeQuerySchema, type BenchLeadTime, type LeadTimeQuery } from '@loomwright/shared';
import { Public } from '../auth/public.decorator';
import { BenchService } from './bench.service';
import { ApiZodQuery } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';

/** The shop's queue as a player sees it before paying: a date, never who or what else is booked. */
@ApiTags('bench')
@Controller('bench/lead-time')
export class LeadTimeController {
  constructor(private readonly bench: BenchService) {}

  @Public()
  @Get()
  @ApiOkResponse({ description: 'The earliest bench date any builder of that level could start the build, its expected completion and the ship-by day.' })
  @ApiBadRequestResponse({ description: 'The hours or the level are missing or malformed, said in words.' })
  @ApiZodQuery(leadTimeQuerySchema)
  leadTime(@Query(new ZodValidationPipe(leadTimeQuerySchema)) query: LeadTimeQuery): Promise<BenchLeadTime> {
    return this.bench.leadTime(query.hours, query.level);
  }
}
