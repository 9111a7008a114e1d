import sharp from 'sharp';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { MESSAGE_MAX_CHARS, MESSAGE_MAX_PHOTOS } from '@loomwright/shared';
import { MessageClock } from '../src/messages/message-clock';
import { MessageNoticesService } from '../src/messages/message-notices.service';
import { renderMail } from '../src/mail/templates/render';
import { builderId, createBooking } from './support/bench-fixtures';
import { sessionCookieFor, type DemoPerson } from './support/sessions';
import { clearTables, createTestApp, type TestApp } from './support/test-app';

/**
 * Messages on a build: who may read and write them, what bad input is told, the e-mail that gathers
 * five minutes of messages into one (with a controlled clock, never a sleep), unread counts per
 * side, and the separation from the shop's internal notes.
 */
describe('messages on a build', () => {
  let t: TestApp;
  let cookies: Record<DemoPerson, string>;
  let clock: { now: () => Date };
  let notices: MessageNoticesService;
  let bookingId: string;
  let reference: string;
  const start = new Date('2027-03-01T15:00:00Z');
  const at = (minutes: number) => new Date(start.getTime() + minutes * 60_000);

  /** A small PNG made by an image library, as a phone upload would be (re-encoded on the way in). */
  const png = () =>
    sharp({ create: { width: 40, height: 30, channels: 3, background: { r: 20, g: 90, b: 80 } } })
      .png()
      .toBuffer();

  beforeAll(async () => {
    t = await createTestApp();
    cookies = {
      customerA: await sessionCookieFor(t, 'customerA'),
      customerB: await sessionCookieFor(t, 'customerB'),
      builder: await sessionCookieFor(t, 'builder'),
      apprentice: await sessionCookieFor(t, 'apprentice'),
      owner: await sessionCookieFor(t, 'owner'),
    };
    clock = t.app.get(MessageClock);
    notices = t.app.get(MessageNoticesService);
  });
  afterAll(async () => t?.close());

  beforeEach(async () => {
    await clearTables(t.db, ['message_notices', 'message_read_markers', 'build_messages', 'mail_outbox']);
    clock.now = () => start;
    const booking = await createBooking(t.db, { laborHours: '6' });
    bookingId = booking.id;
    reference = booking.reference;
    // Assigned to the master-level demo builder; the apprentice is a builder of the shop without it.
    await t.db
      .updateTable('bookings')
      .set({ builder_id: await builderId(t.db, 'builder@shop.example'), state: 'scheduled' })
      .where('id', '=', bookingId)
      .execute();
  });

  /** The route takes a multipart form (its photos travel beside the text), as the build pages send it. */
  const post = (who: DemoPerson, fields: Record<string, string>, id = bookingId) =>
    Object.entries(fields).reduce(
      (req, [name, value]) => req.field(name, value),
      t.http().post(`/api/bookings/${id}/messages`).set('Cookie', cookies[who]),
    );
  const thread = (who: DemoPerson, id = bookingId) => t.http().get(`/api/bookings/${id}/messages`).set('Cookie', cookies[who]);
  const unread = async (who: DemoPerson) => (await t.http().get('/api/messages/unread').set('Cookie', cookies[who]).expect(200)).body;
  const outbox = () => t.db.selectFrom('mail_outbox').selectAll().where('template', '=', 'build-messages').orderBy('created_at').execute();

  describe('who may read and write', () => {
    it('lets the player, the assigned builder and the owner write and read each other', async () => {
      await post('customerA', { body: 'Could the tuner sit first in the chain?' }).expect(201);
      clock.now = () => at(1);
      await post('builder', { body: 'Yes, the tuner goes first, straight off the guitar.' }).expect(201);
      clock.now = () => at(2);
      await post('owner', { body: 'We will send a photo of the layout before wiring.' }).expect(201);
      for (const who of ['customerA', 'builder', 'owner'] as const) {
        const res = await thread(who).expect(200);
        expect(res.body.messages.map((m: { body: string; side: string }) => [m.side, m.body])).toEqual([
          ['player', 'Could the tuner sit first in the chain?'],
          ['shop', 'Yes, the tuner goes first, straight off the guitar.'],
          ['shop', 'We will send a photo of the layout before wiring.'],
        ]);
        expect(res.body.side).toBe(who === 'customerA' ? 'player' : 'shop');
        expect(res.body.messages.filter((m: { mine: boolean }) => m.mine)).toHaveLength(1);
      }
    });

    it('answers 404 in words to another player and to a builder the build is not assigned to, and stores nothing', async () => {
      for (const who of ['customerB', 'apprentice'] as const) {
        const read = await thread(who).expect(404);
        expect(read.body).toMatchObject({ statusCode: 404, code: 'not_found' });
        expect(read.body.message).toMatch(/There is no build .* whose messages you can read/);
        const write = await post(who, { body: 'Let me in' }).expect(404);
        expect(write.body.code).toBe('not_found');
      }
      await t.http().get(`/api/bookings/${bookingId}/messages`).expect(401);
      expect(await t.db.selectFrom('build_messages').selectAll().execute()).toHaveLength(0);
    });
  });

  describe('bad input', () => {
    it('refuses an empty message, an overlong one, unknown fields and a bad id, in words', async () => {
      const empty = await post('customerA', { body: '   ' }).expect(400);
      expect(empty.body).toMatchObject({ code: 'bad_request', message: 'Write a message or attach a photo before sending' });
      const long = await post('customerA', { body: 'x'.repeat(MESSAGE_MAX_CHARS + 1) }).expect(400);
      expect(long.body.code).toBe('validation_failed');
      expect(long.body.message).toMatch(/^Message/);
      expect(long.body.message).toContain(String(MESSAGE_MAX_CHARS));
      const unknown = await post('customerA', { body: 'hi', urgent: 'yes' }).expect(400);
      expect(unknown.body.code).toBe('validation_failed');
      const badId = await t.http().get('/api/bookings/not-a-booking/messages').set('Cookie', cookies.customerA).expect(400);
      expect(badId.body.message).toMatch(/does not name a booking/);
      expect(await t.db.selectFrom('build_messages').selectAll().execute()).toHaveLength(0);
    });

    it('refuses a file that is not a photo and too many photos, in words, and keeps no message', async () => {
      const text = await t
        .http()
        .post(`/api/bookings/${bookingId}/messages`)
        .set('Cookie', cookies.customerA)
        .field('body', 'my receipt')
        .attach('photos', Buffer.from('%PDF-1.4 not a photo'), { filename: 'receipt.jpg', contentType: 'image/jpeg' })
        .expect(400);
      expect(text.body.message).toMatch(/upload a JPEG, PNG or WebP photo/);
      const image = await png();
      let many = t.http().post(`/api/bookings/${bookingId}/messages`).set('Cookie', cookies.customerA).field('body', 'lots');
      for (let i = 0; i <= MESSAGE_MAX_PHOTOS; i += 1)
        many = many.attach('photos', image, { filename: `p${i}.png`, contentType: 'image/png' });
      const tooMany = await many.expect(400);
      expect(tooMany.body.message).toContain(`Attach at most ${MESSAGE_MAX_PHOTOS} photos to one message`);
      expect(await t.db.selectFrom('build_messages').selectAll().execute()).toHaveLength(0);
      expect(await t.db.selectFrom('photos').selectAll().where('message_id', 'is not', null).execute()).toHaveLength(0);
    });
  });

  describe('photos', () => {
    it('keeps a message photo private to the build and out of the booking photo list', async () => {
      const sent = await t
        .http()
        .post(`/api/bookings/${bookingId}/messages`)
        .set('Cookie', cookies.customerA)
        .field('body', 'This is how the board sits in my van.')
        .attach('photos', await png(), { filename: 'van.png', contentType: 'image/png' })
        .expect(201);
      expect(sent.body.photos).toHaveLength(1);
      const [photo] = (await thread('builder').expect(200)).body.messages[0].photos;
      expect(photo).toMatchObject({ width: 40, height: 30 });
      const thumb = await t.http().get(photo.thumbnailUrl).set('Cookie', cookies.builder).expect(200);
      expect(thumb.headers['content-type']).toBe('image/webp');
      // The photo was re-encoded, not stored as uploaded: its metadata names WebP, 40 × 30.
      expect(await sharp(thumb.body as Buffer).metadata()).toMatchObject({ format: 'webp', width: 40, height: 30 });
      await t.http().get(photo.url).set('Cookie', cookies.customerA).expect(200);
      await t.http().get(photo.url).set('Cookie', cookies.customerB).expect(404);
      await t.http().get(photo.url).expect(401);
      const detail = await t.http().get(`/api/bookings/${bookingId}`).set('Cookie', cookies.customerA).expect(200);
      expect(detail.body.photos).toEqual([]);
    });
  });

  describe('e-mail to the other side', () => {
    it('gathers the messages of five minutes into one mail, sent exactly once however many sweeps race for it', async () => {
      await post('customerA', { body: 'First: the case arrived?' }).expect(201);
      clock.now = () => at(2);
      await post('customerA', { body: 'Second: I can drop the pedals off on Friday.' }).expect(201);
      clock.now = () => at(4.5);
      await post('customerA', { body: 'Third: never mind, I will ship them.' }).expect(201);

      // Four minutes fifty-nine after the first: the window is still open.
      expect(await notices.sendDue(at(4.98))).toEqual({ sent: 0, skipped: 0 });
      expect(await outbox()).toHaveLength(0);

      // Five sweeps at once, each on its own pooled connection (as two API processes would be).
      const runs = await Promise.all(Array.from({ length: 5 }, () => notices.sendDue(at(5.01))));
      expect(runs.reduce((n, r) => n + r.sent, 0)).toBe(1);
      expect(await notices.sendDue(at(30))).toEqual({ sent: 0, skipped: 0 });

      const mails = await outbox();
      expect(mails).toHaveLength(1);
      // The build is assigned: the shop's side of the conversation is its builder.
      expect(mails[0]).toMatchObject({ to_address: 'builder@shop.example', booking_id: bookingId, state: 'queued' });
      const data = mails[0].data as { messages: { body: string }[]; bookingUrl: string };
      expect(data.messages.map((m) => m.body)).toEqual([
        'First: the case arrived?',
        'Second: I can drop the pedals off on Friday.',
        'Third: never mind, I will ship them.',
      ]);
      expect(data.bookingUrl).toMatch(new RegExp(`/backoffice/builds/${bookingId}$`));
      const shop = { name: 'Test shop', contactEmail: 'shop@shop.example', timezone: 'America/Chicago', locale: 'en-US', currency: 'USD' };
      const rendered = renderMail('build-messages', data as never, shop, { bookingId });
      expect(rendered.subject).toMatch(new RegExp(`wrote 3 messages about build ${reference}$`));
      // 15:00 UTC is 9:00 AM in Chicago on 1 March 2027 (CST, UTC−6; IANA tz database, America/Chicago).
      expect(rendered.text).toMatch(/Mon, Mar 1, 2027, 9:00\s?AM CST/);
      expect(rendered.text).toContain(`/backoffice/builds/${bookingId}`);
    });

    it('opens a new window for a message after the mail went, and mails the player about the shop’s reply', async () => {
      await post('customerA', { body: 'One' }).expect(201);
      expect((await notices.sendDue(at(6))).sent).toBe(1);
      clock.now = () => at(7);
      await post('customerA', { body: 'Two, after the first mail' }).expect(201);
      expect((await notices.sendDue(at(11))).sent).toBe(0);
      expect((await notices.sendDue(at(12.5))).sent).toBe(1);
      clock.now = () => at(13);
      await post('builder', { body: 'Got both.' }).expect(201);
      expect((await notices.sendDue(at(18.5))).sent).toBe(1);
      const mails = await outbox();
      expect(mails.map((m) => m.to_address)).toEqual(['builder@shop.example', 'builder@shop.example', 'player@mail.example']);
      expect((mails[1].data as { messages: { body: string }[] }).messages.map((m) => m.body)).toEqual(['Two, after the first mail']);
      const data = mails[2].data as { messages: { body: string }[]; bookingUrl: string; audience: string };
      expect(data).toMatchObject({ audience: 'player', messages: [{ body: 'Got both.' }] });
      expect(data.bookingUrl).toMatch(new RegExp(`/builds/${bookingId}$`));
    });

    it('tells the shop nothing about a message its builder has already answered (writing marks the thread read)', async () => {
      await post('customerA', { body: 'Is Friday fine?' }).expect(201);
      clock.now = () => at(1);
      await post('builder', { body: 'Friday is fine.' }).expect(201);
      expect(await notices.sendDue(at(6))).toEqual({ sent: 1, skipped: 1 });
      expect((await outbox()).map((m) => m.to_address)).toEqual(['player@mail.example']);
    });

    it('sends nothing when the other side has already read the messages in the app', async () => {
      await post('builder', { body: 'Your board is on the bench today.' }).expect(201);
      clock.now = () => at(1);
      await thread('customerA').expect(200);
      expect(await notices.sendDue(at(6))).toEqual({ sent: 0, skipped: 1 });
      expect(await outbox()).toHaveLength(0);
    });
  });

  describe('unread counts', () => {
    it('counts per side, clears when either side opens the thread, and never counts one’s own messages', async () => {
      await post('customerA', { body: 'Question one' }).expect(201);
      await post('customerA', { body: 'Question two' }).expect(201);
      expect(await unread('customerA')).toEqual({ total: 0, bookings: [] });
      expect(await unread('owner')).toEqual({ total: 2, bookings: [{ bookingId, reference, unread: 2 }] });
      expect(await unread('builder')).toMatchObject({ total: 2 });
      // Another builder of the shop does not see a build that is not theirs.
      expect(await unread('apprentice')).toEqual({ total: 0, bookings: [] });

      const opened = await thread('builder').expect(200);
      expect(opened.body.unreadBefore).toBe(2);
      // The shop's side has read them: the owner's count clears too.
      expect(await unread('owner')).toMatchObject({ total: 0 });

      await post('owner', { body: 'Answer' }).expect(201);
      expect(await unread('customerA')).toEqual({ total: 1, bookings: [{ bookingId, reference, unread: 1 }] });
      expect((await thread('customerA').expect(200)).body.unreadBefore).toBe(1);
      expect(await unread('customerA')).toMatchObject({ total: 0 });
    });
  });

  describe('internal notes', () => {
    it('keeps a staff note out of the thread, its counts and its mail', async () => {
      await post('customerA', { body: 'Hello shop' }).expect(201);
      await t
        .http()
        .post(`/api/bookings/${bookingId}/notes`)
        .set('Cookie', cookies.builder)
        .send({ note: 'Player seems unsure; quote the spare loop.' })
        .expect((res) => {
          expect(res.status).toBeLessThan(300);
        });
      for (const who of ['customerA', 'builder', 'owner'] as const) {
        const res = await thread(who).expect(200);
        expect(JSON.stringify(res.body)).not.toContain('quote the spare loop');
        expect(res.body.messages).toHaveLength(1);
      }
      expect(await unread('customerA')).toMatchObject({ total: 0 });
      await notices.sendDue(at(10));
      for (const mail of await outbox()) expect(JSON.stringify(mail.data)).not.toContain('quote the spare loop');
    });
  });
});
