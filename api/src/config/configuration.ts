import { isIP } from 'node:net';
import { z } from 'zod';
import { DEVELOPMENT_DEFAULTS, productionProblems } from './production-safety';

/**
 * Environment, validated once at boot. Each concern reads its own group through
 * ConfigService.get('<group>', { infer: true }); a bad value stops the start with a readable message.
 */
const port = (fallback: number) => z.coerce.number().int().min(1).max(65535).default(fallback);

const environmentSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  PORT: port(3000),
  PUBLIC_URL: z.string().url().default('http://localhost:3000'),
  DATABASE_URL: z.string().default('postgres://postgres@127.0.0.1:54329/loomwright'),
  DATABASE_POOL_MAX: z.coerce.number().int().min(1).max(100).default(10),
  JWT_SECRET: z.string().min(16).default(DEVELOPMENT_DEFAULTS.JWT_SECRET),
  SESSION_MINUTES: z.coerce
    .number()
    .int()
    .min(1)
    .max(24 * 60)
    .default(30),
  AUTH_THROTTLE_LIMIT: z.coerce.number().int().min(1).max(10_000).default(10),
  AUTH_THROTTLE_SECONDS: z.coerce
    .number()
    .int()
    .min(1)
    .max(24 * 3600)
    .default(60),
  PASSWORD_RESET_MINUTES: z.coerce
    .number()
    .int()
    .min(5)
    .max(24 * 60)
    .default(60),
  STAFF_INVITE_DAYS: z.coerce.number().int().min(1).max(30).default(7),
  STRIPE_SECRET_KEY: z.string().default(DEVELOPMENT_DEFAULTS.STRIPE_SECRET_KEY),
  STRIPE_WEBHOOK_SECRET: z.string().default(DEVELOPMENT_DEFAULTS.STRIPE_WEBHOOK_SECRET),
  // Unset in production: the SDK then reaches the provider itself. Elsewhere: the local fake.
  STRIPE_API_HOST: z.string().optional(),
  STRIPE_API_PORT: z.coerce.number().int().min(1).max(65535).optional(),
  STRIPE_API_PROTOCOL: z.enum(['http', 'https']).optional(),
  /** Ways of paying offered at checkout (the provider's payment_method_types); each must be enabled in its dashboard. */
  PAYMENT_METHOD_TYPES: z
    .string()
    .default('card,us_bank_account')
    .transform((v) =>
      v
        .split(',')
        .map((t) => t.trim())
        .filter(Boolean),
    )
    .pipe(z.array(z.string().regex(/^[a-z_]+$/, 'each payment method type is a lower-case name such as card')).min(1)),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: port(2525),
  SMTP_SECURE: z.enum(['true', 'false']).default('false'),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().default('Copperline Rig Works <bench@shop.example>'),
  MAIL_RETRY_DELAY_SECONDS: z.coerce.number().int().min(1).max(3600).default(30),
  MAIL_MAX_ATTEMPTS: z.coerce.number().int().min(1).max(20).default(8),
  // Delivery jobs one worker takes per fetch, and messages it hands to the mail server at once.
  MAIL_BATCH_SIZE: z.coerce.number().int().min(1).max(200).default(25),
  MAIL_CONCURRENCY: z.coerce.number().int().min(1).max(50).default(8),
  UPLOADS_DIR: z.string().default('.data/uploads'),
  // Where photos live: 's3' (any S3-compatible bucket; several API replicas share it) or 'disk'
  // (UPLOADS_DIR, one machine only).
  PHOTO_STORAGE: z.enum(['disk', 's3']).default('disk'),
  S3_BUCKET: z
    .string()
    .regex(/^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/, 'an S3 bucket name: 3-63 lower-case letters, digits, dots and hyphens')
    .default('loomwright-photos'),
  S3_ENDPOINT: z.string().url().optional(),
  S3_REGION: z.string().min(1).default('us-east-1'),
  S3_ACCESS_KEY_ID: z.string().optional(),
  S3_SECRET_ACCESS_KEY: z.string().optional(),
  S3_FORCE_PATH_STYLE: z.enum(['true', 'false']).default('true'),
  SERVE_APPS: z.enum(['true', 'false']).default('true'),
  // The demo shop publishes its owner's password: off unless asked for (`npm start` asks).
  SEED_DEMO: z.enum(['true', 'false']).default('false'),
  // Origins besides PUBLIC_URL's own that may send state-changing requests (comma-separated).
  ALLOWED_ORIGINS: z
    .string()
    .default('')
    .transform((list, ctx) => {
      const origins: string[] = [];
      for (const item of list
        .split(',')
        .map((s) => s.trim())
        .filter(Boolean)) {
        const origin = URL.canParse(item) ? new URL(item).origin : 'null';
        if (origin === 'null' || origin !== item.replace(/\/$/, '')) {
          ctx.addIssue({
            code: 'custom',
            message: `"${item}" is not an origin; write each as scheme://host[:port], e.g. https://shop.example`,
          });
        } else origins.push(origin);
      }
      return origins;
    }),
  RUN_WORKERS: z.enum(['true', 'false']).default('true'),
  // On SIGTERM: seconds to keep serving while /api/health/ready already answers 503, so a load
  // balancer polling readiness stops sending work before the listener closes (0: close at once).
  SHUTDOWN_DELAY_SECONDS: z.coerce.number().int().min(0).max(300).default(0),
  // On SIGTERM: the most the whole drain (delay, jobs in flight, requests in flight) may take
  // before the process gives up and exits 1.
  SHUTDOWN_TIMEOUT_SECONDS: z.coerce.number().int().min(1).max(600).default(30),
  // With it, GET /api/metrics wants `Authorization: Bearer <METRICS_TOKEN>`; without, only loopback callers.
  METRICS_TOKEN: z.string().min(16, 'METRICS_TOKEN: at least 16 characters').optional(),
  // JSON log lines on stdout at this level and above (pino's levels).
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  // Express's "trust proxy": which proxies in front may name the client in X-Forwarded-For, so
  // req.ip (and every per-address limit) is the client, not the load balancer. `false` (the
  // default: nothing in front), a hop count such as 1, or a comma-separated list of addresses,
  // CIDR ranges or Express's names loopback, linklocal, uniquelocal. `true` trusts any sender.
  TRUST_PROXY: z
    .string()
    .default('false')
    .transform((value, ctx): boolean | number | string => {
      const v = value.trim();
      if (v === 'true' || v === 'false') return v === 'true';
      if (/^\d+$/.test(v)) return Number(v);
      const names = ['loopback', 'linklocal', 'uniquelocal'];
      const bad = v
        .split(',')
        .map((s) => s.trim())
        .filter((item) => {
          if (names.includes(item)) return false;
          const [address = '', bits, ...rest] = item.split('/');
          const family = isIP(address);
          if (!family || rest.length) return true;
          return bits !== undefined && !(/^\d+$/.test(bits) && Number(bits) <= (family === 4 ? 32 : 128));
        });
      if (bad.length) {
        ctx.addIssue({
          code: 'custom',
          message: `"${bad.join('", "')}" is not a proxy address; use false, a hop count (e.g. 1), or addresses/CIDR ranges such as 10.0.0.0/8 or loopback`,
        });
      }
      return v;
    }),
});

export type Environment = z.infer<typeof environmentSchema>;

export function validateEnvironment(raw: Record<string, unknown>): Environment {
  const parsed = environmentSchema.safeParse(raw);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n');
    throw new Error(`Loomwright cannot start: the environment has bad settings:\n${problems}`);
  }
  if (parsed.data.NODE_ENV === 'production') {
    const unsafe = productionProblems(raw);
    if (unsafe.length > 0) {
      throw new Error(`Loomwright refuses to start in production with unsafe settings:\n${unsafe.map((p) => `  - ${p}`).join('\n')}`);
    }
  }
  return parsed.data;
}

/** Where the payment SDK connects: as set; else the provider in production and the local fake elsewhere. */
function stripeEndpoint(env: Environment): { host?: string; port?: number; protocol?: 'http' | 'https' } {
  const local = env.NODE_ENV !== 'production';
  return {
    host: env.STRIPE_API_HOST ?? (local ? '127.0.0.1' : undefined),
    port: env.STRIPE_API_PORT ?? (local ? 4242 : undefined),
    protocol: env.STRIPE_API_PROTOCOL ?? (local ? 'http' : undefined),
  };
}

export function configuration() {
  const env = validateEnvironment(process.env);
  return {
    app: {
      nodeEnv: env.NODE_ENV,
      port: env.PORT,
      publicUrl: env.PUBLIC_URL.replace(/\/$/, ''),
      serveApps: env.SERVE_APPS === 'true',
      seedDemo: env.SEED_DEMO === 'true',
      runWorkers: env.RUN_WORKERS === 'true',
      shutdownDelaySeconds: env.SHUTDOWN_DELAY_SECONDS,
      shutdownTimeoutSeconds: env.SHUTDOWN_TIMEOUT_SECONDS,
      trustProxy: env.TRUST_PROXY,
      uploadsDir: env.UPLOADS_DIR,
      allowedOrigins: [new URL(env.PUBLIC_URL).origin, ...env.ALLOWED_ORIGINS],
    },
    database: { url: env.DATABASE_URL, poolMax: env.DATABASE_POOL_MAX },
    logging: { level: env.LOG_LEVEL },
    metrics: { token: env.METRICS_TOKEN },
    storage: {
      driver: env.PHOTO_STORAGE,
      uploadsDir: env.UPLOADS_DIR,
      s3: {
        bucket: env.S3_BUCKET,
        endpoint: env.S3_ENDPOINT,
        region: env.S3_REGION,
        accessKeyId: env.S3_ACCESS_KEY_ID,
        secretAccessKey: env.S3_SECRET_ACCESS_KEY,
        forcePathStyle: env.S3_FORCE_PATH_STYLE === 'true',
      },
    },
    auth: {
      jwtSecret: env.JWT_SECRET,
      sessionMinutes: env.SESSION_MINUTES,
      throttleLimit: env.AUTH_THROTTLE_LIMIT,
      throttleSeconds: env.AUTH_THROTTLE_SECONDS,
      passwordResetMinutes: env.PASSWORD_RESET_MINUTES,
      staffInviteDays: env.STAFF_INVITE_DAYS,
    },
    payments: {
      secretKey: env.STRIPE_SECRET_KEY,
      webhookSecret: env.STRIPE_WEBHOOK_SECRET,
      ...stripeEndpoint(env),
      methodTypes: env.PAYMENT_METHOD_TYPES,
    },
    mail: {
      host: env.SMTP_HOST,
      port: env.SMTP_PORT,
      secure: env.SMTP_SECURE === 'true',
      user: env.SMTP_USER,
      password: env.SMTP_PASSWORD,
      from: env.MAIL_FROM,
      retryDelaySeconds: env.MAIL_RETRY_DELAY_SECONDS,
      maxAttempts: env.MAIL_MAX_ATTEMPTS,
      batchSize: env.MAIL_BATCH_SIZE,
      concurrency: env.MAIL_CONCURRENCY,
    },
  };
}

export type AppConfig = ReturnType<typeof configuration>;
