import { startPaymentFake } from './payment-fake';

export { startPaymentFake } from './payment-fake';

// Run directly (npm start's stack script does): a local stand-in for the payment provider.
if (require.main === module) {
  const port = Number(process.env.PAYMENT_FAKE_PORT ?? 4242);
  startPaymentFake({
    port,
    webhookUrl: process.env.PAYMENT_FAKE_WEBHOOK_URL,
    webhookSecret: process.env.STRIPE_WEBHOOK_SECRET ?? 'whsec_loomwright_local',
    stateFile: process.env.PAYMENT_FAKE_STATE_FILE || undefined,
  })
    .then((fake) => console.log(`Payment fake on ${fake.url} (webhooks to ${process.env.PAYMENT_FAKE_WEBHOOK_URL ?? 'nowhere'})`))
    .catch((error: unknown) => {
      console.error(error instanceof Error ? error.message : error);
      process.exit(1);
    });
}
