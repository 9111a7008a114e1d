import { Controller, Get, HttpStatus, Res } from '@nestjs/common';
import { ApiOkResponse, ApiServiceUnavailableResponse, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { Public } from '../auth/public.decorator';
import { HealthService } from './health.service';

@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(private readonly health: HealthService) {}

  @Public()
  @Get()
  @ApiOkResponse({ description: 'The API is up and a real database query succeeded.' })
  @ApiServiceUnavailableResponse({ description: 'The database did not answer.' })
  async check(@Res({ passthrough: true }) res: Response) {
    const dbUp = await this.health.databaseIsUp();
    if (!dbUp) res.status(HttpStatus.SERVICE_UNAVAILABLE);
    return { status: dbUp ? 'ok' : 'degraded', db: dbUp ? 'up' : 'down' };
  }
}
