import { z } from 'zod';
import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { Body, Controller, Delete, Get, HttpCode, Param, Patch, Post } from '@nestjs/common';
import { uuidParam } from '../common/uuid-param.pipe';
import { ApiCookieAuth, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  absenceSchema,
  updateTeamMemberSchema,
  type AbsenceInput,
  type AddAbsenceResponse,
  type AuthUser,
  type BuilderAbsenceView,
  type TeamMember,
  type UpdateTeamMemberInput,
  requestWords,
} from '@loomwright/shared';
import { CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { ApiZodBody, ApiZodResponse } from '../common/zod-openapi';
import { TeamService } from './team.service';
import { ApiErrorCodes } from '../common/api-document';

const builderIdPipe = uuidParam(requestWords.notAnId('a builder'));

@ApiTags('team')
@ApiCookieAuth('lw_session')
@Controller('team')
export class TeamController {
  constructor(private readonly team: TeamService) {}

  @ApiOperation({ summary: 'List the builders' })
  @ApiZodResponse(z.array(responseSchemas.teamMemberSchema))
  @Get()
  @Roles('builder', 'owner')
  @ApiOkResponse({
    description:
      'The builders: level, bench hours per weekday, status (invited until they join, active, inactive). Hourly rates: every one for the owner, only their own for a builder (null for colleagues).',
  })
  list(@CurrentUser() user: AuthUser): Promise<TeamMember[]> {
    return this.team.list(user);
  }

  @ApiOperation({ summary: 'List builders’ absences' })
  @ApiZodResponse(z.array(responseSchemas.builderAbsenceViewSchema))
  @Get('absences')
  @Roles('builder', 'owner')
  @ApiOkResponse({ description: 'Days builders are away (ill, holiday, a course).' })
  absences(): Promise<BuilderAbsenceView[]> {
    return this.team.absences();
  }

  @ApiOperation({ summary: 'Record a builder’s absence' })
  @ApiZodResponse(responseSchemas.addAbsenceResponseSchema)
  @ApiErrorCodes('bad_request')
  @Post(':builderId/absences')
  @Roles('owner')
  @ApiOkResponse({
    description: 'The absence, and the builds on that builder’s bench then (move them through POST /api/bookings/:id/reschedule).',
  })
  addAbsence(
    @Param('builderId', builderIdPipe) builderId: string,
    @Body(new ZodValidationPipe(absenceSchema)) body: AbsenceInput,
  ): Promise<AddAbsenceResponse> {
    return this.team.addAbsence(builderId, body);
  }

  @ApiOperation({ summary: 'Remove an absence' })
  @Delete('absences/:absenceId')
  @HttpCode(204)
  @Roles('owner')
  deleteAbsence(@Param('absenceId', uuidParam(requestWords.notAnId('an absence'))) id: string): Promise<void> {
    return this.team.deleteAbsence(id);
  }

  @ApiOperation({ summary: 'Change a builder’s level, rate, hours or status' })
  @ApiZodResponse(responseSchemas.teamMemberSchema)
  @Patch(':builderId')
  @Roles('owner')
  @ApiZodBody(updateTeamMemberSchema)
  update(
    @CurrentUser() user: AuthUser,
    @Param('builderId', uuidParam(requestWords.notAnId('a builder')))
    builderId: string,
    @Body(new ZodValidationPipe(updateTeamMemberSchema)) body: UpdateTeamMemberInput,
  ): Promise<TeamMember> {
    return this.team.update(user, builderId, body);
  }
}
