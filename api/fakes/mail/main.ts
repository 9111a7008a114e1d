import { startMailFake } from './mail-fake';

// Entry for `npm start` (api/scripts/stack.mjs): ports come from the environment.
async function main() {
  const fake = await startMailFake({
    smtpPort: Number(process.env.MAIL_FAKE_SMTP_PORT ?? 2525),
    httpPort: Number(process.env.MAIL_FAKE_HTTP_PORT ?? 8025),
  });
  console.log(`[mail fake] SMTP on 127.0.0.1:${fake.smtpPort}, mailbox at http://127.0.0.1:${fake.httpPort}`);
  const stop = () => void fake.stop().then(() => process.exit(0));
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((error: Error) => {
  console.error(`[mail fake] could not start: ${error.message}`);
  process.exit(1);
});
