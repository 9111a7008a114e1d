import { Body, Controller, Get, HttpCode, Post, Res } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { AuthUser } from '@loomwright/shared';
import type { Response } from 'express';
import type { AppConfig } from '../config/configuration';
import { AuthService } from './auth.service';
import { CurrentUser } from './current-user.decorator';
import { SignInDto } from './dto/sign-in.dto';
import { SignUpDto } from './dto/sign-up.dto';
import { Public } from './public.decorator';
import { SESSION_COOKIE, sessionCookieOptions } from './session-cookie';

@ApiTags('auth')
@Controller('auth')
export class AuthController {
  constructor(
    private readonly auth: AuthService,
    private readonly config: ConfigService<AppConfig, true>,
  ) {}

  private startSession(res: Response, user: AuthUser) {
    const nodeEnv = this.config.get('app', { infer: true }).nodeEnv;
    res.cookie(SESSION_COOKIE, this.auth.issueToken(user), sessionCookieOptions(nodeEnv, this.auth.sessionMs));
  }

  @Public()
  @Post('sign-up')
  @ApiOkResponse({ description: 'The new player account; the session cookie is set.' })
  async signUp(@Body() body: SignUpDto, @Res({ passthrough: true }) res: Response) {
    const user = await this.auth.signUp(body);
    this.startSession(res, user);
    return { user };
  }

  @Public()
  @Post('sign-in')
  @HttpCode(200)
  async signIn(@Body() body: SignInDto, @Res({ passthrough: true }) res: Response) {
    const user = await this.auth.signIn(body.email, body.password);
    this.startSession(res, user);
    return { user };
  }

  @Public()
  @Post('sign-out')
  @HttpCode(200)
  signOut(@Res({ passthrough: true }) res: Response) {
    res.clearCookie(SESSION_COOKIE, { path: '/' });
    return { signedOut: true };
  }

  @Get('me')
  async me(@CurrentUser() user: AuthUser) {
    return { user: await this.auth.currentUser(user.id) };
  }
}
