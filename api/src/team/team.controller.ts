import { BadRequestException, Body, Controller, Get, Param, ParseUUIDPipe, Patch } from '@nestjs/common';
import { ApiCookieAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { TeamMember } from '@loomwright/shared';
import { Roles } from '../auth/roles.decorator';
import { UpdateTeamMemberDto } from './dto/update-team-member.dto';
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
  update(
    @Param('builderId', new ParseUUIDPipe({ exceptionFactory: () => new BadRequestException('The builder id in the address must be a UUID.') }))
    builderId: string,
    @Body() dto: UpdateTeamMemberDto,
  ): Promise<TeamMember> {
    return this.team.update(builderId, dto);
  }
}
