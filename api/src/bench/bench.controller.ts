import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { Controller, Get, Query } from '@nestjs/common';
import { ApiCookieAuth, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  benchPreviewQuerySchema,
  benchQuerySchema,
  benchSuggestQuerySchema,
  type AuthUser,
  type BenchPreview,
  type BenchPreviewQuery,
  type BenchQuery,
  type BenchSuggestQuery,
  type BenchSuggestResponse,
  type BenchView,
} from '@loomwright/shared';
import { CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { BenchService } from './bench.service';
import { ApiZodQuery, ApiZodResponse } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { ApiErrorCodes } from '../common/api-document';

@ApiTags('bench')
@ApiCookieAuth('lw_session')
@Roles('builder', 'owner')
@Controller('bench')
export class BenchController {
  constructor(private readonly bench: BenchService) {}

  @ApiOperation({ summary: 'Booked hours against capacity per builder and day' })
  @ApiZodResponse(responseSchemas.benchViewSchema)
  @ApiErrorCodes('bad_request', 'not_found')
  @Get()
  @ApiOkResponse({ description: 'Per builder per day: capacity, booked hours and the builds on that day (the signed-in builder first).' })
  @ApiZodQuery(benchQuerySchema)
  view(@CurrentUser() user: AuthUser, @Query(new ZodValidationPipe(benchQuerySchema)) query: BenchQuery): Promise<BenchView> {
    return this.bench.view(user, query);
  }

  @ApiOperation({ summary: 'The earliest bench date that holds a build' })
  @ApiZodResponse(responseSchemas.benchSuggestResponseSchema)
  @ApiErrorCodes('conflict', 'not_found')
  @Get('suggest')
  @ApiOkResponse({ description: 'The earliest bench date per eligible builder that holds the build, with the expected completion.' })
  @ApiZodQuery(benchSuggestQuerySchema)
  suggest(
    @CurrentUser() user: AuthUser,
    @Query(new ZodValidationPipe(benchSuggestQuerySchema)) query: BenchSuggestQuery,
  ): Promise<BenchSuggestResponse> {
    return this.bench.suggest(user, query.bookingId, query.builderId);
  }

  @ApiOperation({ summary: 'Preview a bench date for a build' })
  @ApiZodResponse(responseSchemas.benchPreviewSchema)
  @ApiErrorCodes('conflict', 'not_found')
  @Get('preview')
  @ApiZodQuery(benchPreviewQuerySchema)
  @ApiOkResponse({
    description:
      'Before choosing a bench date: per builder the load on the days it would take, the ship-by day, the price and why a date is refused.',
  })
  preview(
    @CurrentUser() user: AuthUser,
    @Query(new ZodValidationPipe(benchPreviewQuerySchema)) query: BenchPreviewQuery,
  ): Promise<BenchPreview> {
    return this.bench.preview(user, query);
  }
}
