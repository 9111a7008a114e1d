import 'reflect-metadata';
import { ConfigService } from '@nestjs/config';
import { NestFactory } from '@nestjs/core';
import { Logger } from 'nestjs-pino';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { AppModule } from './app.module';
import { configureApp } from './app.setup';
import type { AppConfig } from './config/configuration';

async function bootstrap() {
  // Bodies are parsed by configureApp (raw bytes kept for webhook signatures).
  // Nest's own lines (start-up, workers, errors) go through the same JSON logger as the requests.
  const app = await NestFactory.create<NestExpressApplication>(AppModule, { bodyParser: false, bufferLogs: true });
  app.useLogger(app.get(Logger));
  configureApp(app);
  const { port } = app.get(ConfigService<AppConfig, true>).get('app', { infer: true });
  await app.listen(port, '0.0.0.0');
  app.get(Logger).log(`API listening on http://localhost:${port}/api`, 'Loomwright');
}

bootstrap().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
