import { startPaymentFake } from './payment-fake';

export { startPaymentFake } from './payment-fake';

// Run directly (npm start's stack script does): a local stand-in for the payment provider.
if (require.main === module) {
  const port = Number(process.env.PAYMENT_FAKE_PORT ?? 4242);
  const settleSeconds = Number(process.env.PAYMENT_FAKE_SETTLE_SECONDS ?? 20);
  if (!Number.isFinite(settleSeconds) || settleSeconds < 0) {
    console.error('PAYMENT_FAKE_SETTLE_SECONDS must be a number of seconds, 0 or more.');
    process.exit(1);
  }
  startPaymentFake({
    port,
    webhookUrl: process.env.PAYMENT_FAKE_WEBHOOK_URL,
    webhookSecret: process.env.STRIPE_WEBHOOK_SECRET ?? 'whsec_loomwright_local',
    stateFile: process.env.PAYMENT_FAKE_STATE_FILE || undefined,
    // A bank debit settles (or fails) on its own after this long; 0: only when told (POST /_control/…).
    settleDelayMs: settleSeconds > 0 ? settleSeconds * 1000 : null,
  })
    .then((fake) => console.log(`Payment fake on ${fake.url} (webhooks to ${process.env.PAYMENT_FAKE_WEBHOOK_URL ?? 'nowhere'})`))
    .catch((error: unknown) => {
      console.error(error instanceof Error ? error.message : error);
      process.exit(1);
    });
}
