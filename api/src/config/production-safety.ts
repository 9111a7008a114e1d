/**
 * What production refuses at boot. Every value written in this repository is public, so a
 * production process that falls back to one of them (a session secret, a webhook secret, the
 * demo shop with its published password) is open to anyone who reads the code. Each rule names
 * the setting and says what to do, and every problem is reported at once, so a shop fixes its
 * environment in one pass instead of one restart per mistake.
 */

/** The defaults this repository ships for local use; production must never run on them. */
export const DEVELOPMENT_DEFAULTS = {
  JWT_SECRET: 'loomwright-development-secret-change-me',
  STRIPE_SECRET_KEY: 'sk_test_loomwright_local',
  STRIPE_WEBHOOK_SECRET: 'whsec_loomwright_local',
} as const;

/** Other secrets that appear in the repository (test suites, fakes): public too. */
const PUBLISHED_SECRETS = new Set<string>([
  DEVELOPMENT_DEFAULTS.JWT_SECRET,
  DEVELOPMENT_DEFAULTS.STRIPE_SECRET_KEY,
  DEVELOPMENT_DEFAULTS.STRIPE_WEBHOOK_SECRET,
  'loomwright-test-secret-0123456789',
  'whsec_loomwright_test_0123456789',
  'sk_test_loomwright_suite',
]);

/** 32 bytes is the HMAC-SHA256 key length that matches its output (RFC 2104 §3 recommends at least L bytes). */
export const MIN_JWT_SECRET_BYTES = 32;
/** A provider-issued webhook signing secret is `whsec_` and 32 base64 characters (from memory); shorter is made up. */
const MIN_WEBHOOK_SECRET_LENGTH = 32;

type RawEnvironment = Record<string, unknown>;

const setting = (raw: RawEnvironment, name: string): string | undefined => {
  const value = raw[name];
  return typeof value === 'string' && value.trim() !== '' ? value : undefined;
};

/** Every reason this environment must not run in production, in words; empty when it may. */
export function productionProblems(raw: RawEnvironment): string[] {
  const problems: string[] = [];

  const jwtSecret = setting(raw, 'JWT_SECRET');
  if (!jwtSecret) {
    problems.push(
      `JWT_SECRET is not set, so sessions would be signed with the development secret written in the repository. Set a random secret of at least ${MIN_JWT_SECRET_BYTES} bytes (for example the output of \`openssl rand -base64 48\`).`,
    );
  } else if (PUBLISHED_SECRETS.has(jwtSecret)) {
    problems.push(
      'JWT_SECRET is a value written in the repository; anyone could sign a session for the owner. Set a random secret of your own.',
    );
  } else if (Buffer.byteLength(jwtSecret, 'utf8') < MIN_JWT_SECRET_BYTES) {
    problems.push(
      `JWT_SECRET is ${Buffer.byteLength(jwtSecret, 'utf8')} bytes long; production needs at least ${MIN_JWT_SECRET_BYTES} random bytes.`,
    );
  }

  const paymentKey = setting(raw, 'STRIPE_SECRET_KEY');
  if (!paymentKey) {
    problems.push(
      "STRIPE_SECRET_KEY is not set, so payments would use the local payment fake's development key. Set your payment account's live secret key.",
    );
  } else if (PUBLISHED_SECRETS.has(paymentKey)) {
    problems.push("STRIPE_SECRET_KEY is the local payment fake's development key. Set your payment account's live secret key.");
  } else if (/^(sk|rk)_test_/.test(paymentKey)) {
    problems.push(
      'STRIPE_SECRET_KEY is a test-mode key: players would pay with test cards and no money would move. Set the live secret key.',
    );
  }

  const webhookSecret = setting(raw, 'STRIPE_WEBHOOK_SECRET');
  if (!webhookSecret) {
    problems.push(
      'STRIPE_WEBHOOK_SECRET is not set, so payment webhooks would be checked against the development secret and anyone could mark a deposit paid. Set the signing secret of your webhook endpoint.',
    );
  } else if (PUBLISHED_SECRETS.has(webhookSecret)) {
    problems.push(
      'STRIPE_WEBHOOK_SECRET is a value written in the repository; anyone could sign a webhook that marks a deposit paid. Set the signing secret of your webhook endpoint.',
    );
  } else if (webhookSecret.length < MIN_WEBHOOK_SECRET_LENGTH) {
    problems.push(
      `STRIPE_WEBHOOK_SECRET is ${webhookSecret.length} characters long; a provider-issued signing secret is longer. Copy the whole secret of your webhook endpoint.`,
    );
  }

  if (setting(raw, 'STRIPE_API_PROTOCOL') === 'http') {
    problems.push(
      'STRIPE_API_PROTOCOL is http, which only the local payment fake speaks; payment calls must travel over https. Leave STRIPE_API_HOST, STRIPE_API_PORT and STRIPE_API_PROTOCOL unset to reach the provider.',
    );
  }

  if (setting(raw, 'SEED_DEMO') === 'true') {
    problems.push(
      'SEED_DEMO is true: the demo shop, whose owner account and password are published in the README, would be created. Leave SEED_DEMO unset (or false) in production.',
    );
  }

  const publicUrl = setting(raw, 'PUBLIC_URL');
  if (!publicUrl) {
    problems.push(
      'PUBLIC_URL is not set; links in e-mails and the allowed origin would point at localhost. Set the https address players visit, e.g. https://shop.example.',
    );
  } else if (!/^https:\/\//i.test(publicUrl)) {
    problems.push(`PUBLIC_URL is ${publicUrl}; production needs an https address, because the session cookie is sent over https only.`);
  }

  if (!setting(raw, 'DATABASE_URL')) {
    problems.push(
      'DATABASE_URL is not set, so the API would look for the development database on 127.0.0.1:54329. Set the address of your PostgreSQL database.',
    );
  }
  if (!setting(raw, 'SMTP_HOST')) {
    problems.push(
      "SMTP_HOST is not set, so mail would go to the local mail fake and no player would receive it. Set your mail server's host (and SMTP_PORT, SMTP_USER, SMTP_PASSWORD as it needs).",
    );
  }
  if (!setting(raw, 'MAIL_FROM')) {
    problems.push(
      'MAIL_FROM is not set, so mail would be sent from the demo shop\'s name and address. Set your shop\'s sender, e.g. "Your Shop <bench@your-shop.example>".',
    );
  }
  return problems;
}
