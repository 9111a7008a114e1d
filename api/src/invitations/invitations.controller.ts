import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { Body, Controller, HttpCode, Param, Post, Req, Res, UseGuards } from '@nestjs/common';
import { uuidParam } from '../common/uuid-param.pipe';
import { ApiCreatedResponse, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import { ThrottlerGuard } from '@nestjs/throttler';
import {
  acceptInvitationSchema,
  inviteStaffSchema,
  type AcceptInvitationInput,
  type AuthSessionResponse,
  type AuthUser,
  type InvitationCreated,
  type InvitationResent,
  type InviteStaffInput,
  requestWords,
} from '@loomwright/shared';
import type { Request, Response } from 'express';
import { AuthService } from '../auth/auth.service';
import { CurrentUser } from '../auth/current-user.decorator';
import { Public } from '../auth/public.decorator';
import { Roles } from '../auth/roles.decorator';
import { SkipSessionRenewal } from '../auth/session-renewal';
import { ApiZodBody, ApiZodResponse } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { InvitationsService } from './invitations.service';
import { ApiErrorCodes } from '../common/api-document';

@ApiTags('team')
@Controller('invitations')
export class InvitationsController {
  constructor(
    private readonly invitations: InvitationsService,
    private readonly auth: AuthService,
  ) {}

  @Roles('owner')
  @ApiOperation({ summary: 'Invite a builder' })
  @ApiErrorCodes('email_taken')
  @Post()
  @ApiCreatedResponse({ description: 'The invited builder, their bench profile id and when the link expires.' })
  @ApiZodBody(inviteStaffSchema)
  @ApiZodResponse(responseSchemas.invitationCreatedSchema)
  invite(
    @Body(new ZodValidationPipe(inviteStaffSchema)) body: InviteStaffInput,
    @CurrentUser() owner: AuthUser,
  ): Promise<InvitationCreated> {
    return this.invitations.invite(body, owner);
  }

  @Roles('owner')
  @ApiOperation({ summary: 'Send a builder’s invitation again' })
  @ApiZodResponse(responseSchemas.invitationResentSchema)
  @ApiErrorCodes('conflict')
  @Post(':builderId/resend')
  @HttpCode(201)
  @ApiCreatedResponse({
    description:
      'A fresh invitation link is mailed to a builder who has not joined yet; the link sent before stops working. 409 in words once they have joined.',
  })
  resend(
    @Param('builderId', uuidParam(requestWords.notAnId('a builder'))) builderId: string,
    @CurrentUser() owner: AuthUser,
  ): Promise<InvitationResent> {
    return this.invitations.resend(builderId, owner);
  }

  @Public()
  @UseGuards(ThrottlerGuard)
  @SkipSessionRenewal()
  @ApiOperation({ summary: 'Accept an invitation and set a password' })
  @ApiErrorCodes('link_invalid')
  @Post('accept')
  @HttpCode(200)
  @ApiOkResponse({ description: 'The password is set and the session cookie is set.' })
  @ApiZodBody(acceptInvitationSchema)
  @ApiZodResponse(responseSchemas.authSessionResponseSchema)
  async accept(
    @Body(new ZodValidationPipe(acceptInvitationSchema)) body: AcceptInvitationInput,
    @Req() req: Request,
    @Res({ passthrough: true }) res: Response,
  ): Promise<AuthSessionResponse> {
    const user = await this.invitations.accept(body.token, body.password);
    await this.auth.startSession(res, user, req);
    return { user };
  }
}
