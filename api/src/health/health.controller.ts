import { ApiZodResponse } from '../common/zod-openapi';
import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { Controller, Get, HttpStatus, Res } from '@nestjs/common';
import { ApiOkResponse, ApiOperation, ApiServiceUnavailableResponse, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type { HealthLiveness, HealthReadiness, HealthStatus } from '@loomwright/shared';
import { Public } from '../auth/public.decorator';
import { HealthService } from './health.service';

/**
 * Three probes. /api/health (kept as it was: the database answers). /api/health/live: the process
 * runs and answers; an orchestrator restarts it only when this fails, never because the database
 * is away. /api/health/ready: send it work; fails while the database or the photo store is
 * unreachable, or while the process is shutting down, so a load balancer takes it out of rotation.
 */
@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(private readonly health: HealthService) {}

  @Public()
  @ApiOperation({ summary: 'Is the API up with its database' })
  @ApiZodResponse(responseSchemas.healthStatusSchema)
  @Get()
  @ApiOkResponse({ description: 'The API is up and a real database query succeeded.' })
  @ApiServiceUnavailableResponse({ description: 'The database did not answer.' })
  async check(@Res({ passthrough: true }) res: Response): Promise<HealthStatus> {
    const dbUp = await this.health.databaseIsUp();
    if (!dbUp) res.status(HttpStatus.SERVICE_UNAVAILABLE);
    return { status: dbUp ? 'ok' : 'degraded', db: dbUp ? 'up' : 'down' };
  }

  @Public()
  @ApiOperation({ summary: 'Liveness of this process' })
  @ApiZodResponse(responseSchemas.healthLivenessSchema)
  @Get('live')
  @ApiOkResponse({ description: 'Liveness: the process is running and answering. Depends on nothing outside it.' })
  live(): HealthLiveness {
    return { status: 'ok', uptimeSeconds: Math.round(process.uptime()) };
  }

  @Public()
  @ApiOperation({ summary: 'Readiness for traffic' })
  @ApiZodResponse(responseSchemas.healthReadinessSchema)
  @Get('ready')
  @ApiOkResponse({ description: 'Readiness: the database and the photo store answer; send this process work.' })
  @ApiServiceUnavailableResponse({ description: 'The database or the photo store is unreachable, or the process is shutting down.' })
  async ready(@Res({ passthrough: true }) res: Response): Promise<HealthReadiness> {
    const [dbUp, storageUp] = await Promise.all([this.health.databaseIsUp(), this.health.storageIsUp()]);
    const shuttingDown = this.health.shuttingDown;
    const ready = dbUp && storageUp && !shuttingDown;
    if (!ready) res.status(HttpStatus.SERVICE_UNAVAILABLE);
    const reasons = [
      ...(dbUp ? [] : ['the database does not answer']),
      ...(storageUp ? [] : ['the photo store does not answer']),
      ...(shuttingDown ? ['this process is shutting down'] : []),
    ];
    return {
      status: ready ? 'ready' : 'not ready',
      db: dbUp ? 'up' : 'down',
      storage: storageUp ? 'up' : 'down',
      ...(reasons.length && { reasons }),
    };
  }
}
