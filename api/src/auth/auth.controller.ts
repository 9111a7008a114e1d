import { Body, Controller, Get, HttpCode, Post, Req, Res, UseGuards } from '@nestjs/common';
import { ApiAcceptedResponse, ApiOkResponse, ApiTags, ApiTooManyRequestsResponse } from '@nestjs/swagger';
import { ThrottlerGuard } from '@nestjs/throttler';
import { authMessages, type AuthUser } from '@loomwright/shared';
import type { Request, Response } from 'express';
import { AuthService } from './auth.service';
import { CurrentUser } from './current-user.decorator';
import { ConfirmPasswordResetDto } from './dto/confirm-password-reset.dto';
import { RequestPasswordResetDto } from './dto/request-password-reset.dto';
import { SignInDto } from './dto/sign-in.dto';
import { SignUpDto } from './dto/sign-up.dto';
import { Public } from './public.decorator';
import { SkipSessionRenewal } from './session-renewal.interceptor';
import type { SessionUser } from './sessions.service';

@ApiTags('auth')
@ApiTooManyRequestsResponse({ description: authMessages.throttled })
@Controller('auth')
export class AuthController {
  constructor(private readonly auth: AuthService) {}

  @Public()
  @UseGuards(ThrottlerGuard)
  @SkipSessionRenewal()
  @Post('sign-up')
  @ApiOkResponse({ description: 'The new player account; the session cookie is set.' })
  async signUp(@Body() body: SignUpDto, @Req() req: Request, @Res({ passthrough: true }) res: Response) {
    const user = await this.auth.signUp(body);
    await this.auth.startSession(res, user, req);
    return { user };
  }

  @Public()
  @UseGuards(ThrottlerGuard)
  @SkipSessionRenewal()
  @Post('sign-in')
  @HttpCode(200)
  async signIn(@Body() body: SignInDto, @Req() req: Request, @Res({ passthrough: true }) res: Response) {
    const user = await this.auth.signIn(body.email, body.password);
    await this.auth.startSession(res, user, req);
    return { user };
  }

  @Public()
  @SkipSessionRenewal()
  @Post('sign-out')
  @HttpCode(200)
  @ApiOkResponse({ description: 'The cookie is cleared and the session ended on the server: a copy of its token no longer works.' })
  async signOut(@CurrentUser() user: SessionUser | undefined, @Res({ passthrough: true }) res: Response) {
    await this.auth.endSession(res, user);
    return { signedOut: true };
  }

  @Get('me')
  async me(@CurrentUser() user: AuthUser) {
    return { user: await this.auth.currentUser(user.id) };
  }

  @Public()
  @UseGuards(ThrottlerGuard)
  @Post('password-reset')
  @HttpCode(202)
  @ApiAcceptedResponse({ description: 'The same answer whether or not the e-mail has an account.' })
  async requestPasswordReset(@Body() body: RequestPasswordResetDto) {
    await this.auth.requestPasswordReset(body.email);
    return { message: authMessages.resetRequested };
  }

  @Public()
  @UseGuards(ThrottlerGuard)
  @SkipSessionRenewal()
  @Post('password-reset/confirm')
  @HttpCode(200)
  @ApiOkResponse({ description: 'The password is changed and the session cookie is set.' })
  async confirmPasswordReset(@Body() body: ConfirmPasswordResetDto, @Req() req: Request, @Res({ passthrough: true }) res: Response) {
    const user = await this.auth.confirmPasswordReset(body.token, body.password);
    await this.auth.startSession(res, user, req);
    return { user };
  }
}
