import ICAL from 'ical.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startMailFake, type CaughtMessage, type MailFake } from '../fakes/mail/mail-fake';
import { MailDeliveryService } from '../src/mail/mail-delivery.service';
import { builderId, createBooking, quietMondayWeeksAhead, signIn } from './support/bench-fixtures';
import { createTestApp, type TestApp } from './support/test-app';

// The main journey's last step: a builder accepts a paid request, and the player's confirmation
// arrives in the mail fake's mailbox over real SMTP, read back over its HTTP JSON.
describe('the booking-scheduled message after a builder accepts', () => {
  let t: TestApp;
  let fake: MailFake;

  beforeAll(async () => {
    fake = await startMailFake({ smtpPort: 0, httpPort: 0 });
    t = await createTestApp({ env: { SMTP_PORT: String(fake.smtpPort) } });
  });
  afterAll(async () => {
    await fake.stop();
    await t.close();
  });

  it('arrives once, with the bench date, what to ship, the booking link and a calendar file for the ship-by day', async () => {
    const master = await signIn(t.app, 'builder@shop.example');
    const monday = quietMondayWeeksAhead(3);
    const booking = await createBooking(t.db, { laborHours: '6.00', materialsTotal: '220.00', deposit: '120.00' });
    const accepted = await master
      .post(`/api/bookings/${booking.id}/accept`)
      .send({ builderId: await builderId(t.db, 'builder@shop.example'), benchDate: monday })
      .expect(200);
    const shipBy: string = accepted.body.shipBy;

    const delivery = t.app.get(MailDeliveryService);
    expect((await delivery.deliverPending()).sent).toBeGreaterThanOrEqual(1);
    expect((await delivery.deliverPending()).sent).toBe(0);

    const inbox: CaughtMessage[] = await (await fetch(`http://127.0.0.1:${fake.httpPort}/api/messages?to=player@mail.example`)).json();
    const scheduled = inbox.filter((m) => m.subject.startsWith('Booked: bench date'));
    expect(scheduled).toHaveLength(1);
    const [m] = scheduled;
    // The demo shop writes en-US (CLDR en yMMMEd "EEE, MMM d, y"), as its pages do.
    const words = (day: string) =>
      new Intl.DateTimeFormat('en-US', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' }).format(
        new Date(`${day}T12:00:00Z`),
      );
    expect(m.subject).toBe(`Booked: bench date ${words(monday)} for ${booking.reference}`);
    expect(m.text).toContain(words(shipBy));
    expect(m.text).toContain('- Fuzz');
    expect(m.text).toContain('- Analog delay');
    expect(m.text).toContain('Master builder');
    expect(m.text).toContain(`/builds/${booking.id}`);
    expect(m.text).toContain('two people');

    // RFC 5545 via ical.js: an all-day event on the ship-by day the accept answered with.
    const ics = Buffer.from(m.attachments.find((a) => a.filename?.endsWith('.ics'))!.content, 'base64').toString('utf8');
    const event = new ICAL.Event(new ICAL.Component(ICAL.parse(ics)).getFirstSubcomponent('vevent')!);
    expect(event.startDate.isDate).toBe(true);
    expect(event.startDate.toString()).toBe(shipBy);

    const row = await t.db
      .selectFrom('mail_outbox')
      .selectAll()
      .where('booking_id', '=', booking.id)
      .where('template', '=', 'booking-scheduled')
      .executeTakeFirstOrThrow();
    expect(m.messageId).toBe(row.message_id);
    expect(row.state).toBe('sent');
  });
});
