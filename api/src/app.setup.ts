import { INestApplication } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { SwaggerModule } from '@nestjs/swagger';
import compression from 'compression';
import cookieParser from 'cookie-parser';
import path from 'node:path';
import { cacheHashedAssets, storefrontDist } from './app.module';
import { applyBodyParsing } from './common/body-parsing';
import { ApiExceptionFilter } from './common/api-exception.filter';
import { customerContactMiddleware } from './bookings/customer-contact.middleware';
import { buildApiDocument } from './common/api-document';
import type { AppConfig } from './config/configuration';
import { HTTP_LOGGER, httpLogging } from './logging/logging.module';
import { MetricsService } from './metrics/metrics.service';
import { securityHeaders } from './security/security-headers';
import { storefrontNotFound } from './storefront/storefront-not-found';
import { precompressedAssets } from './storefront/storefront-pages';

/**
 * Everything main.ts and the API tests both need, so tests exercise the app as it runs.
 * The app must be created with `bodyParser: false` (see common/body-parsing.ts).
 */
export function configureApp(app: INestApplication): INestApplication {
  app.setGlobalPrefix('api');
  const { trustProxy, nodeEnv } = app.get(ConfigService<AppConfig, true>).get('app', { infer: true });
  // Before anything else, so every answer has its X-Request-Id and its one JSON log line.
  app.use(...httpLogging(app.get(HTTP_LOGGER)));
  // Request counts and latency by route pattern and status (GET /api/metrics).
  app.use(app.get(MetricsService).middleware());
  // Next, so every answer carries the headers: the apps, the API, its errors and the Swagger page.
  app.use(securityHeaders(nodeEnv === 'production'));
  // Behind a load balancer, req.ip must be the client (throttling counts per address): TRUST_PROXY.
  app.getHttpAdapter().getInstance().set('trust proxy', trustProxy);
  // Gzip for JSON and the apps' scripts (Nest's own "Compression" technique); a proxy in front
  // may do it instead.
  app.use(compression());
  // Unknown storefront addresses answer 404 (with the app's own "not found" page), not the SPA's 200.
  if (process.env.SERVE_APPS !== 'false') {
    app.use(storefrontNotFound(storefrontDist));
    app.use('/assets', precompressedAssets(path.join(storefrontDist, 'assets'), cacheHashedAssets));
  }
  applyBodyParsing(app);
  app.use(cookieParser());
  // A builder's answers show only their own customers' e-mail addresses, on every route.
  app.use(customerContactMiddleware);
  // No global ValidationPipe: every body and query names its shared zod schema through
  // ZodValidationPipe (common/zod-validation.pipe.ts), and unknown fields are refused there.
  // Every error answer, in one shape with a listed code (common/api-exception.filter.ts).
  app.useGlobalFilters(new ApiExceptionFilter());
  // SIGTERM and SIGINT drain and exit 0 (see HealthService for the order); process.exit also lets
  // pino flush its last lines.
  app.enableShutdownHooks(['SIGTERM', 'SIGINT'], { useProcessExit: true });
  const document = buildApiDocument(app);
  SwaggerModule.setup('api/docs', app, document);
  return app;
}
