import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { startMailFake, type MailFake } from '../../fakes/mail/mail-fake';
import { startObjectStore, type ObjectStore } from '../../fakes/object-store/object-store';
import { startPaymentFake, type PaymentFake } from '../../fakes/payment/payment-fake';
import { createEmptyDatabase } from './test-app';

/**
 * The environment that points an API (in-process or its own process) at each local fake, written
 * once: the same variable names `npm start` and the README's deployment section use.
 */
export function paymentFakeEnv(fake: PaymentFake, keys: { secretKey: string; webhookSecret: string }): Record<string, string> {
  return {
    STRIPE_SECRET_KEY: keys.secretKey,
    STRIPE_WEBHOOK_SECRET: keys.webhookSecret,
    STRIPE_API_HOST: '127.0.0.1',
    STRIPE_API_PORT: String(fake.port),
    STRIPE_API_PROTOCOL: 'http',
  };
}

/** The mail fake's SMTP side, with a one-second retry so a failed send is tried again within a test. */
export function mailFakeEnv(mail: MailFake): Record<string, string> {
  return { SMTP_HOST: '127.0.0.1', SMTP_PORT: String(mail.smtpPort), MAIL_RETRY_DELAY_SECONDS: '1' };
}

/** PHOTO_STORAGE=s3 against the local S3-compatible store (path-style addressing, as s3rver needs). */
export function objectStoreEnv(store: ObjectStore): Record<string, string> {
  return {
    PHOTO_STORAGE: 's3',
    S3_BUCKET: store.bucket,
    S3_ENDPOINT: store.url,
    S3_ACCESS_KEY_ID: store.accessKeyId,
    S3_SECRET_ACCESS_KEY: store.secretAccessKey,
    S3_FORCE_PATH_STYLE: 'true',
  };
}

/**
 * The local object store in a scratch folder of its own; `dispose` stops it (a test may have
 * stopped it already, to see the API cope) and removes the folder.
 */
export async function startScratchObjectStore(bucket: string): Promise<ObjectStore & { dispose: () => Promise<void> }> {
  const directory = await mkdtemp(path.join(tmpdir(), `${bucket}-`));
  const store = await startObjectStore({ port: 0, directory, bucket });
  return {
    ...store,
    dispose: async () => {
      await store.close().catch(() => undefined);
      await rm(directory, { recursive: true, force: true });
    },
  };
}

/**
 * What built API processes (startApiProcess) run against: a new empty database, the payment fake
 * (webhooks retried after 0.1, 0.2 and 0.4 s) and the mail fake. `env` points an API at all three;
 * `close` stops the fakes and drops the database. The webhook target is set once an API listens.
 */
export async function startProcessFakes(databasePrefix: string, keys: { secretKey: string; webhookSecret: string }) {
  const database = await createEmptyDatabase(databasePrefix);
  const started: { close: () => Promise<void> }[] = [{ close: database.drop }];
  const close = async () => {
    for (const part of started.reverse()) await part.close();
  };
  try {
    const payments = await startPaymentFake({ port: 0, webhookSecret: keys.webhookSecret, retryDelaysMs: [100, 200, 400] });
    started.push(payments);
    const mail = await startMailFake({ smtpPort: 0, httpPort: 0 });
    started.push({ close: mail.stop });
    const env = { DATABASE_URL: database.url, ...paymentFakeEnv(payments, keys), ...mailFakeEnv(mail) };
    return { databaseUrl: database.url, payments, mail, env, close };
  } catch (error) {
    await close();
    throw error;
  }
}
