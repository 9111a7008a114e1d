import { timingSafeEqual } from 'node:crypto';
import { Controller, ForbiddenException, Get, Req, Res, UnauthorizedException } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { ApiExcludeController } from '@nestjs/swagger';
import type { Request, Response } from 'express';
import { Public } from '../auth/public.decorator';
import { SkipSessionRenewal } from '../auth/session-renewal';
import type { AppConfig } from '../config/configuration';
import { MetricsService } from './metrics.service';

const loopback = new Set(['127.0.0.1', '::1', '::ffff:127.0.0.1']);

/**
 * GET /api/metrics in Prometheus's text format. With METRICS_TOKEN set, only a scraper sending
 * `Authorization: Bearer <METRICS_TOKEN>` gets it; without, only callers on this machine (the
 * socket's own address, not X-Forwarded-For, which a client can write).
 */
@ApiExcludeController()
@Controller('metrics')
export class MetricsController {
  constructor(
    private readonly metrics: MetricsService,
    private readonly config: ConfigService<AppConfig, true>,
  ) {}

  @Public()
  @SkipSessionRenewal()
  @Get()
  async scrape(@Req() req: Request, @Res() res: Response) {
    const token = this.config.get('metrics', { infer: true }).token;
    if (token) {
      const given = /^Bearer (.+)$/.exec(req.headers.authorization ?? '')?.[1] ?? '';
      const a = Buffer.from(given);
      const b = Buffer.from(token);
      if (a.length !== b.length || !timingSafeEqual(a, b)) {
        throw new UnauthorizedException("The metrics need the scraper's token: send Authorization: Bearer <METRICS_TOKEN>.");
      }
    } else if (!loopback.has(req.socket.remoteAddress ?? '')) {
      throw new ForbiddenException('The metrics answer only callers on this machine unless METRICS_TOKEN is set.');
    }
    res.setHeader('Content-Type', this.metrics.registry.contentType);
    res.setHeader('Cache-Control', 'no-store');
    res.send(await this.metrics.registry.metrics());
  }
}
