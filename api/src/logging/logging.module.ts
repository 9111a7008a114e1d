import type { IncomingMessage, ServerResponse } from 'node:http';
import { Global, Module } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { LoggerModule } from 'nestjs-pino';
import { stdSerializers, type DestinationStream, type LevelWithSilent, type Logger } from 'pino';
import { storage, Store } from 'nestjs-pino/storage';
import { pinoHttp, type HttpLogger } from 'pino-http';
import type { AppConfig } from '../config/configuration';
import { blankSecretFields, requestSerializer, responseSerializer } from './log-redaction';
import { requestIdFor } from './request-id';

/** The one pino-http middleware (and its pino logger) of this process; configureApp mounts it first. */
export const HTTP_LOGGER = Symbol('HTTP_LOGGER');

/** Probes and scrapes arrive every few seconds; their lines would drown the rest. */
const quietPaths = /^\/api\/(health(\/(live|ready))?|metrics)(\?|$)/;

/** The request line's raw request and answer: their serializers pick its fields, so the secret walk skips them. */
const serializedKeys = new Set(['req', 'res']);

/** `destination`: stdout unless given (the tests read the lines from a stream of their own). */
export function createHttpLogger(level: string, destination?: DestinationStream): HttpLogger {
  return pinoHttp<IncomingMessage, ServerResponse, never>({
    level,
    genReqId: requestIdFor,
    customAttributeKeys: { reqId: 'requestId' },
    // Lines logged inside a request carry only its id; the request itself is on the one
    // "request completed" line.
    quietReqLogger: true,
    // The serializers read the raw request and answer and pick the line's few fields
    // (log-redaction.ts); pino-http's wrapping would first copy each into pino's standard shape.
    wrapSerializers: false,
    serializers: { req: requestSerializer, res: responseSerializer, err: stdSerializers.err },
    formatters: { log: (object: Record<string, unknown>) => blankSecretFields(object, serializedKeys) },
    autoLogging: { ignore: (req: IncomingMessage) => quietPaths.test(req.url ?? '') },
    customLogLevel: (_req, res, error): LevelWithSilent => (error || res.statusCode >= 500 ? 'error' : 'info'),
    ...(destination ? { stream: destination } : {}),
  });
}

/**
 * The Express middleware configureApp mounts first: pino-http (request id, the one line per
 * request), then nestjs-pino's request store, so Nest's Logger and PinoLogger write through
 * this request's logger (with its requestId) anywhere in the code that answers it.
 */
export function httpLogging(httpLogger: HttpLogger) {
  return [
    httpLogger,
    (req: IncomingMessage & { log?: Logger }, _res: ServerResponse, next: () => void) =>
      storage.run(new Store(req.log ?? httpLogger.logger), next),
  ];
}

@Global()
@Module({
  providers: [
    {
      provide: HTTP_LOGGER,
      inject: [ConfigService],
      useFactory: (config: ConfigService<AppConfig, true>) => createHttpLogger(config.get('logging', { infer: true }).level),
    },
  ],
  exports: [HTTP_LOGGER],
})
class HttpLoggerModule {}

/**
 * JSON logs on stdout (one object a line) through pino-http and nestjs-pino. pino-http runs as the
 * first Express middleware (configureApp), so every answer — the API's, the apps' files, a 404 —
 * has a request id: kept from a sane incoming X-Request-Id, else a fresh UUID, echoed in the
 * X-Request-Id answer header and kept on `req.id`, where error bodies read it. nestjs-pino then
 * binds that request's logger, so every line Nest code logs while answering carries `requestId`.
 * Secrets never reach a line: see log-redaction.ts.
 */
@Module({
  imports: [
    HttpLoggerModule,
    LoggerModule.forRootAsync({
      imports: [HttpLoggerModule],
      inject: [HTTP_LOGGER],
      useFactory: (httpLogger: HttpLogger) => ({
        // pino-http and the binding of req.log run as plain Express middleware (httpLogging below),
        // ahead of every route and the apps' files; Nest's own middleware here would add a route
        // per HTTP method to the router, so it is given none.
        useExisting: true as const,
        pinoHttp: { logger: httpLogger.logger },
        forRoutes: [],
      }),
    }),
  ],
})
export class LoggingModule {}
