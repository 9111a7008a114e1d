import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { Controller, Get, Query } from '@nestjs/common';
import { ApiCookieAuth, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import { todayQuerySchema, type AuthUser, type TodayQuery, type TodayResponse } from '@loomwright/shared';
import { CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { ApiZodQuery, ApiZodResponse } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { TodayService } from './today.service';
import { ApiErrorCodes } from '../common/api-document';

@ApiTags('today')
@ApiCookieAuth('lw_session')
@Controller('today')
export class TodayController {
  constructor(private readonly todayService: TodayService) {}

  @ApiOperation({ summary: 'The staff’s page for today' })
  @ApiErrorCodes('forbidden')
  @Get()
  @Roles('builder', 'owner')
  @ApiZodQuery(todayQuerySchema)
  @ApiZodResponse(responseSchemas.todayResponseSchema)
  @ApiOkResponse({
    description: 'Builds on the bench today and this week, and built ones not yet gone: what each waits for and the next thing to do.',
  })
  today(@CurrentUser() user: AuthUser, @Query(new ZodValidationPipe(todayQuerySchema)) query: TodayQuery): Promise<TodayResponse> {
    return this.todayService.today(user, query);
  }
}
