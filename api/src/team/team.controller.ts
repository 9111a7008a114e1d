import { BadRequestException, Body, Controller, Get, Param, ParseUUIDPipe, Patch } from '@nestjs/common';
import { ApiCookieAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { updateTeamMemberSchema, type TeamMember, type UpdateTeamMemberInput } from '@loomwright/shared';
import { Roles } from '../auth/roles.decorator';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { ApiZodBody } from '../common/zod-openapi';
import { TeamService } from './team.service';

@ApiTags('team')
@ApiCookieAuth('lw_session')
@Controller('team')
export class TeamController {
  constructor(private readonly team: TeamService) {}

  @Get()
  @Roles('builder', 'owner')
  @ApiOkResponse({ description: 'The builders: level, hourly rate, bench hours per weekday, active.' })
  list(): Promise<TeamMember[]> {
    return this.team.list();
  }

  @Patch(':builderId')
  @Roles('owner')
  @ApiZodBody(updateTeamMemberSchema)
  update(
    @Param('builderId', new ParseUUIDPipe({ exceptionFactory: () => new BadRequestException('The builder id in the address must be a UUID.') }))
    builderId: string,
    @Body(new ZodValidationPipe(updateTeamMemberSchema)) body: UpdateTeamMemberInput,
  ): Promise<TeamMember> {
    return this.team.update(builderId, body);
  }
}
