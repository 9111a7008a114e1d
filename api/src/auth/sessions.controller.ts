import { ApiZodResponse } from '../common/zod-openapi';
import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { requestWords } from '@loomwright/shared';
import { Controller, Delete, Get, Param } from '@nestjs/common';
import { uuidParam } from '../common/uuid-param.pipe';
import { ApiCookieAuth, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import type { AuthUser, PersonSessions, SessionsEnded } from '@loomwright/shared';
import { CurrentUser } from './current-user.decorator';
import { Roles } from './roles.decorator';
import { SessionsService } from './sessions.service';

const userIdPipe = uuidParam(requestWords.notAnId('an account'));

/** The owner's view of where a person is signed in, and the way to sign them out of every device. */
@ApiTags('auth')
@ApiCookieAuth('lw_session')
@Roles('owner')
@Controller('users/:userId/sessions')
export class SessionsController {
  constructor(private readonly sessions: SessionsService) {}

  @ApiOperation({ summary: 'List the devices a person is signed in on' })
  @ApiZodResponse(responseSchemas.personSessionsSchema)
  @Get()
  @ApiOkResponse({ description: 'The devices the person is signed in on now (sessions not ended and not expired).' })
  list(@Param('userId', userIdPipe) userId: string): Promise<PersonSessions> {
    return this.sessions.listFor(userId);
  }

  @ApiOperation({ summary: 'Sign a person out of every device' })
  @ApiZodResponse(responseSchemas.sessionsEndedSchema)
  @Delete()
  @ApiOkResponse({ description: 'Every session of the person is ended: each of their devices must sign in again.' })
  signOutEverywhere(@Param('userId', userIdPipe) userId: string, @CurrentUser() owner: AuthUser): Promise<SessionsEnded> {
    return this.sessions.signOutEverywhere(userId, owner);
  }
}
