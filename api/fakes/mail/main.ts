import { runFake } from '../run-fake';
import { startMailFake } from './mail-fake';

// Entry for `npm start` (api/scripts/stack.mjs): ports come from the environment.
runFake(
  'mail fake',
  () =>
    startMailFake({
      smtpPort: Number(process.env.MAIL_FAKE_SMTP_PORT ?? 2525),
      httpPort: Number(process.env.MAIL_FAKE_HTTP_PORT ?? 8025),
    }),
  (fake) => `SMTP on 127.0.0.1:${fake.smtpPort}, mailbox at http://127.0.0.1:${fake.httpPort}`,
  (fake) => fake.stop(),
);
