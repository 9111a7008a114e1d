import { Module } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { APP_GUARD } from '@nestjs/core';
import { JwtModule } from '@nestjs/jwt';
import { PassportModule } from '@nestjs/passport';
import { ThrottlerModule } from '@nestjs/throttler';
import type { AppConfig } from '../config/configuration';
import { MailModule } from '../mail/mail.module';
import { UsersModule } from '../users/users.module';
import { authThrottlerOptions } from './auth-throttle';
import { AuthTokensRepository } from './auth-tokens.repository';
import { AuthTokensService } from './auth-tokens.service';
import { AuthController } from './auth.controller';
import { AuthService } from './auth.service';
import { JwtAuthGuard } from './jwt-auth.guard';
import { JwtStrategy } from './jwt.strategy';
import { RolesGuard } from './roles.guard';
import { SessionRenewal } from './session-renewal';
import { SessionsController } from './sessions.controller';
import { SessionsRepository } from './sessions.repository';
import { SessionsService } from './sessions.service';

@Module({
  imports: [
    UsersModule,
    MailModule,
    PassportModule,
    // ThrottlerModule is global once registered: any module may put @UseGuards(ThrottlerGuard) on a route.
    ThrottlerModule.forRootAsync(authThrottlerOptions),
    JwtModule.registerAsync({
      inject: [ConfigService],
      useFactory: (config: ConfigService<AppConfig, true>) => ({ secret: config.get('auth', { infer: true }).jwtSecret }),
    }),
  ],
  controllers: [AuthController, SessionsController],
  providers: [
    AuthService,
    AuthTokensService,
    AuthTokensRepository,
    SessionsService,
    SessionsRepository,
    JwtStrategy,
    SessionRenewal,
    // Order matters: first who you are, then what your role may do.
    { provide: APP_GUARD, useClass: JwtAuthGuard },
    { provide: APP_GUARD, useClass: RolesGuard },
  ],
  exports: [AuthService, AuthTokensService, SessionsService],
})
export class AuthModule {}
