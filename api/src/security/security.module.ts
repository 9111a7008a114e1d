import { Module } from '@nestjs/common';
import { APP_GUARD } from '@nestjs/core';
import { CsrfGuard } from './csrf.guard';

/**
 * Request-level defences. Imported by AppModule before AuthModule: global guards run in the
 * order their modules are registered, and a forged request must be refused before anything
 * looks at who sent it.
 */
@Module({
  providers: [{ provide: APP_GUARD, useClass: CsrfGuard }],
})
export class SecurityModule {}
