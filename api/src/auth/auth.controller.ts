import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { Body, Controller, Get, HttpCode, Post, Req, Res, UseGuards } from '@nestjs/common';
import { ApiAcceptedResponse, ApiCreatedResponse, ApiOkResponse, ApiOperation, ApiTags, ApiTooManyRequestsResponse } from '@nestjs/swagger';
import { ThrottlerGuard } from '@nestjs/throttler';
import {
  authMessages,
  passwordChangeSchema,
  passwordResetConfirmSchema,
  passwordResetRequestSchema,
  signInSchema,
  signUpSchema,
  type AuthUser,
  type PasswordChangeInput,
  type PasswordResetConfirmInput,
  type PasswordResetRequestInput,
  type SignInInput,
  type SignOutResponse,
  type SignUpInput,
} from '@loomwright/shared';
import type { Request, Response } from 'express';
import { ApiZodBody, ApiZodResponse } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { AuthService } from './auth.service';
import { CurrentUser } from './current-user.decorator';
import { Public } from './public.decorator';
import { SkipSessionRenewal } from './session-renewal';
import type { SessionUser } from './sessions.service';
import { ApiErrorCodes } from '../common/api-document';

@ApiTags('auth')
@ApiTooManyRequestsResponse({ description: authMessages.throttled })
@Controller('auth')
export class AuthController {
  constructor(private readonly auth: AuthService) {}

  @Public()
  @UseGuards(ThrottlerGuard)
  @SkipSessionRenewal()
  @ApiOperation({ summary: 'Create a player account and sign in' })
  @ApiZodResponse(responseSchemas.authSessionResponseSchema)
  @ApiErrorCodes('email_taken')
  @Post('sign-up')
  @ApiCreatedResponse({ description: 'The new player account; the session cookie is set.' })
  @ApiZodBody(signUpSchema)
  async signUp(
    @Body(new ZodValidationPipe(signUpSchema)) body: SignUpInput,
    @Req() req: Request,
    @Res({ passthrough: true }) res: Response,
  ) {
    const user = await this.auth.signUp(body);
    await this.auth.startSession(res, user, req);
    return { user };
  }

  @Public()
  @UseGuards(ThrottlerGuard)
  @SkipSessionRenewal()
  @ApiOperation({ summary: 'Sign in with e-mail and password' })
  @ApiZodResponse(responseSchemas.authSessionResponseSchema)
  @ApiErrorCodes('invalid_credentials')
  @Post('sign-in')
  @HttpCode(200)
  @ApiZodBody(signInSchema)
  async signIn(
    @Body(new ZodValidationPipe(signInSchema)) body: SignInInput,
    @Req() req: Request,
    @Res({ passthrough: true }) res: Response,
  ) {
    const user = await this.auth.signIn(body.email, body.password);
    await this.auth.startSession(res, user, req);
    return { user };
  }

  @Public()
  @SkipSessionRenewal()
  @ApiOperation({ summary: 'Sign out of this device' })
  @ApiZodResponse(responseSchemas.signOutResponseSchema)
  @Post('sign-out')
  @HttpCode(200)
  @ApiOkResponse({ description: 'The cookie is cleared and the session ended on the server: a copy of its token no longer works.' })
  async signOut(@CurrentUser() user: SessionUser | undefined, @Res({ passthrough: true }) res: Response): Promise<SignOutResponse> {
    await this.auth.endSession(res, user);
    return { signedOut: true };
  }

  @ApiOperation({ summary: 'The signed-in person' })
  @ApiZodResponse(responseSchemas.authSessionResponseSchema)
  @Get('me')
  async me(@CurrentUser() user: AuthUser) {
    return { user: await this.auth.currentUser(user.id) };
  }

  /**
   * As `me`, but open: a visitor gets 200 `{ user: null }` instead of a 401, so the apps can ask on
   * every page without a failed request in the browser's console. A database outage is still 503.
   */
  @Public()
  @ApiOperation({ summary: 'The signed-in person, or nobody' })
  @ApiZodResponse(responseSchemas.currentSessionResponseSchema)
  @Get('session')
  @ApiOkResponse({ description: 'The signed-in person, or `{ "user": null }` when nobody is signed in.' })
  async session(@CurrentUser() user: AuthUser | undefined) {
    return { user: user ? ((await this.auth.findUser(user.id)) ?? null) : null };
  }

  @Public()
  @UseGuards(ThrottlerGuard)
  @ApiOperation({ summary: 'E-mail a password reset link' })
  @ApiZodResponse(responseSchemas.passwordResetRequestedSchema)
  @Post('password-reset')
  @HttpCode(202)
  @ApiAcceptedResponse({ description: 'The same answer whether or not the e-mail has an account.' })
  @ApiZodBody(passwordResetRequestSchema)
  async requestPasswordReset(@Body(new ZodValidationPipe(passwordResetRequestSchema)) body: PasswordResetRequestInput) {
    await this.auth.requestPasswordReset(body.email);
    return { message: authMessages.resetRequested };
  }

  @Public()
  @UseGuards(ThrottlerGuard)
  @SkipSessionRenewal()
  @ApiOperation({ summary: 'Set a new password with a reset link' })
  @ApiZodResponse(responseSchemas.authSessionResponseSchema)
  @ApiErrorCodes('link_invalid')
  @Post('password-reset/confirm')
  @HttpCode(200)
  @ApiOkResponse({ description: 'The password is changed and the session cookie is set.' })
  @ApiZodBody(passwordResetConfirmSchema)
  async confirmPasswordReset(
    @Body(new ZodValidationPipe(passwordResetConfirmSchema)) body: PasswordResetConfirmInput,
    @Req() req: Request,
    @Res({ passthrough: true }) res: Response,
  ) {
    const user = await this.auth.confirmPasswordReset(body.token, body.password);
    await this.auth.startSession(res, user, req);
    return { user };
  }

  @UseGuards(ThrottlerGuard)
  @SkipSessionRenewal()
  @ApiOperation({ summary: 'Change the signed-in person’s password' })
  @ApiZodResponse(responseSchemas.authSessionResponseSchema)
  @ApiErrorCodes('current_password_wrong')
  @Post('password')
  @HttpCode(200)
  @ApiOkResponse({
    description:
      'The password is changed; every session of the account is ended, a new session cookie is set for this device, and the account’s e-mail address is told.',
  })
  @ApiZodBody(passwordChangeSchema)
  async changePassword(
    @CurrentUser() user: SessionUser,
    @Body(new ZodValidationPipe(passwordChangeSchema)) body: PasswordChangeInput,
    @Req() req: Request,
    @Res({ passthrough: true }) res: Response,
  ) {
    const changed = await this.auth.changePassword(user.id, body.currentPassword, body.password);
    await this.auth.startSession(res, changed, req);
    return { user: changed };
  }
}
