import type { RigConfiguration } from '@loomwright/shared';
import { configurationMessages, MAX_SAVED_CONFIGURATIONS, QUOTE_EMAILS_PER_HOUR } from '@loomwright/shared';
// pdf-parse 1.x: a general-purpose PDF text extractor (over Mozilla's pdf.js). The inner module
// is imported because the package's index runs a self-test when it has no parent module.
import pdfParse from 'pdf-parse/lib/pdf-parse.js';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { referenceBoard } from '../../shared/src/estimate/reference-rigs.fixture';
import { startMailFake, type CaughtMessage, type MailFake } from '../fakes/mail/mail-fake';
import { MailDeliveryService } from '../src/mail/mail-delivery.service';
import { sessionCookieFor } from './support/sessions';
import { createTestApp, type TestApp } from './support/test-app';

const binary = (res: supertest.Response, cb: (err: Error | null, body: Buffer) => void) => {
  const stream = res as unknown as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (c: Buffer) => chunks.push(c));
  stream.on('end', () => cb(null, Buffer.concat(chunks)));
};
const flatText = async (pdf: Buffer) => (await pdfParse(pdf)).text.replace(/\s+/g, ' ');
// Dollars as any en-US reader writes them (ECMA-402 Intl.NumberFormat, ISO 4217 minor unit).
const usd = (amount: string) => new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' }).format(Number(amount));

describe('saved configurations, short links and quotes the player keeps', () => {
  let t: TestApp;
  let fake: MailFake;
  let a: string;
  let b: string;
  const stage: RigConfiguration = {
    ...referenceBoard('switcher', 'journeyman'),
    routing: { mode: 'switcher', switcher: { currentMa: 300 } },
    powerSupply: {
      outputs: [
        { voltage: 9, currentMa: 500, isolated: true },
        ...Array.from({ length: 5 }, () => ({ voltage: 9, currentMa: 250, isolated: true })),
      ],
    },
  };
  const small: RigConfiguration = { ...referenceBoard('serial', 'apprentice') };
  const asA = () => ({
    get: (url: string) => t.http().get(url).set('Cookie', a),
    post: (url: string, body: object = {}) => t.http().post(url).set('Cookie', a).send(body),
    patch: (url: string, body: object) => t.http().patch(url).set('Cookie', a).send(body),
    delete: (url: string) => t.http().delete(url).set('Cookie', a).set('Content-Type', 'application/json'),
  });
  const inbox = async (to: string): Promise<CaughtMessage[]> =>
    (await fetch(`http://127.0.0.1:${fake.httpPort}/api/messages?to=${to}`)).json();

  beforeAll(async () => {
    fake = await startMailFake({ smtpPort: 0, httpPort: 0 });
    t = await createTestApp({ env: { SMTP_PORT: String(fake.smtpPort), PUBLIC_URL: 'http://shop.test' } });
    a = await sessionCookieFor(t, 'customerA');
    b = await sessionCookieFor(t, 'customerB');
  });
  afterAll(async () => {
    await t?.close();
    await fake?.stop();
  });

  it('saves under a name, lists, reopens whole, renames, saves changes, duplicates and deletes, for its owner only', async () => {
    const saved = (await asA().post('/api/configurations', { name: '  Stage board  ', configuration: stage }).expect(201)).body;
    expect(saved).toMatchObject({ name: 'Stage board', routing: 'switcher', pedalCount: stage.pedals!.length, surfaceId: stage.surfaceId });
    expect(saved.configuration).toEqual(stage);

    const list = (await asA().get('/api/configurations').expect(200)).body;
    expect(list.map((c: { name: string }) => c.name)).toEqual(['Stage board']);
    expect(list[0]).not.toHaveProperty('configuration');

    expect((await asA().get(`/api/configurations/${saved.id}`).expect(200)).body.configuration).toEqual(stage);

    // Another player's id is a 404 for every verb, and their list does not show it.
    await t.http().get(`/api/configurations/${saved.id}`).set('Cookie', b).expect(404);
    await t.http().patch(`/api/configurations/${saved.id}`).set('Cookie', b).send({ name: 'Mine now' }).expect(404);
    await t.http().post(`/api/configurations/${saved.id}/duplicate`).set('Cookie', b).send({}).expect(404);
    await t.http().delete(`/api/configurations/${saved.id}`).set('Cookie', b).set('Content-Type', 'application/json').expect(404);
    expect((await t.http().get('/api/configurations').set('Cookie', b).expect(200)).body).toEqual([]);
    await t.http().get('/api/configurations').expect(401);

    const renamed = (await asA().patch(`/api/configurations/${saved.id}`, { name: 'Stage board 2027' }).expect(200)).body;
    expect(renamed.name).toBe('Stage board 2027');
    expect(renamed.configuration).toEqual(stage);
    const changed = (
      await asA()
        .patch(`/api/configurations/${saved.id}`, { configuration: { ...stage, level: 'master' } })
        .expect(200)
    ).body;
    expect(changed.configuration.level).toBe('master');
    expect(changed.name).toBe('Stage board 2027');

    const copy = (await asA().post(`/api/configurations/${saved.id}/duplicate`).expect(201)).body;
    expect(copy.name).toBe('Stage board 2027 (copy)');
    expect(copy.id).not.toBe(saved.id);
    expect(copy.configuration).toEqual(changed.configuration);
    expect((await asA().post(`/api/configurations/${saved.id}/duplicate`).expect(201)).body.name).toBe('Stage board 2027 (copy 2)');
    expect((await asA().post(`/api/configurations/${copy.id}/duplicate`).expect(201)).body.name).toBe('Stage board 2027 (copy 3)');
    expect((await asA().post(`/api/configurations/${saved.id}/duplicate`, { name: 'Fly rig' }).expect(201)).body.name).toBe('Fly rig');

    await asA().delete(`/api/configurations/${copy.id}`).expect(204);
    await asA().get(`/api/configurations/${copy.id}`).expect(404);
    await asA().delete(`/api/configurations/${copy.id}`).expect(404);
    const names = (await asA().get('/api/configurations').expect(200)).body.map((c: { name: string }) => c.name).sort();
    expect(names).toEqual(['Fly rig', 'Stage board 2027', 'Stage board 2027 (copy 2)', 'Stage board 2027 (copy 3)']);
  });

  it('refuses in words: a taken name (any case), no name, nothing to change, a surface the book lacks, a bad id', async () => {
    await asA().post('/api/configurations', { name: 'Pedal train', configuration: small }).expect(201);
    const taken = await asA().post('/api/configurations', { name: 'PEDAL TRAIN', configuration: small }).expect(409);
    expect(taken.body.message).toBe(configurationMessages.nameTaken('PEDAL TRAIN'));
    // The same name is fine for another player.
    await t.http().post('/api/configurations').set('Cookie', b).send({ name: 'Pedal train', configuration: small }).expect(201);

    const noName = await asA().post('/api/configurations', { name: '   ', configuration: small }).expect(400);
    expect(noName.body.message).toContain('Give the configuration a name');
    const nothing = await asA().patch('/api/configurations/00000000-0000-4000-8000-000000000000', {}).expect(400);
    expect(nothing.body.message).toContain('Send a new name, a changed configuration, or both');
    const surface = await asA()
      .post('/api/configurations', { name: 'Plank', configuration: { ...small, surfaceId: 'plank-9000' } })
      .expect(400);
    expect(surface.body.message).toContain('plank-9000');
    const badId = await asA().get('/api/configurations/not-an-id').expect(400);
    expect(badId.body.message).toContain('saved board could not be found');
  });

  it(`keeps at most ${MAX_SAVED_CONFIGURATIONS} per player and says so`, async () => {
    const cookie = await sessionCookieFor(t, 'owner');
    for (let i = 0; i < MAX_SAVED_CONFIGURATIONS; i += 1) {
      await t.db
        .insertInto('saved_configurations')
        .values({
          owner_id: (await t.db.selectFrom('users').select('id').where('email', '=', 'owner@shop.example').executeTakeFirstOrThrow()).id,
          name: `Rig ${i}`,
          configuration: JSON.stringify(small),
        })
        .execute();
    }
    const res = await t
      .http()
      .post('/api/configurations')
      .set('Cookie', cookie)
      .send({ name: 'One more', configuration: small })
      .expect(409);
    expect(res.body.message).toBe(configurationMessages.tooMany);
  });

  it('gives any configuration a short code that opens it again, the same code for the same configuration, for anyone', async () => {
    const first = (await t.http().post('/api/configuration-links').send({ configuration: stage }).expect(201)).body;
    expect(first.code).toMatch(/^[A-Za-z0-9]{8}$/);
    expect(first.path).toBe(`/c/${first.code}`);
    // Key order is not part of a configuration: the same rig written differently gets the same code.
    const reordered = Object.fromEntries(Object.entries(stage).reverse());
    expect(
      (await t.http().post('/api/configuration-links').set('Cookie', a).send({ configuration: reordered }).expect(201)).body.code,
    ).toBe(first.code);
    expect((await t.http().post('/api/configuration-links').send({ configuration: small }).expect(201)).body.code).not.toBe(first.code);

    const opened = (await t.http().get(`/api/configuration-links/${first.code}`).expect(200)).body;
    expect(opened.configuration).toEqual(stage);
    // The old long form holds the same configuration, at many times the length.
    const longForm = `/configure?c=${Buffer.from(JSON.stringify(stage)).toString('base64url')}`;
    expect(first.path.length * 10).toBeLessThan(longForm.length);

    const missing = await t.http().get('/api/configuration-links/Zz9Zz9Zz').expect(404);
    expect(missing.body.message).toBe(configurationMessages.linkNotFound);
    const bad = await t.http().get('/api/configuration-links/no-such!').expect(400);
    expect(bad.body.message).toContain('letters and digits');
    await t
      .http()
      .post('/api/configuration-links')
      .send({ configuration: { ...stage, routing: { mode: 'daisy' } } })
      .expect(400);
  });

  it('e-mails any configuration’s quote to the signed-in player with its lines, the PDF attached (its totals the API’s) and a short link, at most five an hour', async () => {
    await fetch(`http://127.0.0.1:${fake.httpPort}/api/messages`, { method: 'DELETE' });
    const estimate = (await t.http().post('/api/estimates').send(stage).expect(200)).body;
    const sent = (await asA().post('/api/quotes/email', { configuration: stage, title: 'Stage board' }).expect(202)).body;
    expect(sent).toEqual({ sentTo: 'player@mail.example', remaining: QUOTE_EMAILS_PER_HOUR - 1 });
    expect((await t.app.get(MailDeliveryService).deliverPending()).sent).toBe(1);

    const [mail] = await inbox('player@mail.example');
    expect(mail!.subject).toContain('Stage board: your quote from');
    for (const line of estimate.lines as Array<{ label: string }>) expect(mail!.text).toContain(line.label);
    expect(mail!.text).toContain(`${usd(estimate.totalLow)} to ${usd(estimate.totalHigh)}`);
    const code = /http:\/\/shop\.test\/c\/([A-Za-z0-9]{8})/.exec(mail!.text)?.[1];
    expect((await t.http().get(`/api/configuration-links/${code}`).expect(200)).body.configuration).toEqual(stage);

    const pdf = mail!.attachments.find((x) => x.contentType === 'application/pdf');
    expect(pdf?.filename).toMatch(/^loomwright-quote-stage-board-\d{4}-\d{2}-\d{2}\.pdf$/);
    const text = await flatText(Buffer.from(pdf!.content, 'base64'));
    expect(text).toContain('Stage board');
    expect(text).toContain(`Estimated total: ${usd(estimate.totalLow)} – ${usd(estimate.totalHigh)}`);
    expect(text).toContain(`price book version ${estimate.priceBookVersion}`);

    for (let i = 1; i < QUOTE_EMAILS_PER_HOUR; i += 1) await asA().post('/api/quotes/email', { configuration: small }).expect(202);
    const limited = await asA().post('/api/quotes/email', { configuration: small }).expect(429);
    expect(limited.body.message).toBe(configurationMessages.quoteEmailLimit);
    expect(await t.db.selectFrom('mail_outbox').select('id').where('template', '=', 'configuration-quote').execute()).toHaveLength(
      QUOTE_EMAILS_PER_HOUR,
    );
    // Another player has their own allowance; nobody signed in has none.
    await t.http().post('/api/quotes/email').set('Cookie', b).send({ configuration: small }).expect(202);
    await t.http().post('/api/quotes/email').send({ configuration: small }).expect(401);
    // There is no field for another address: the quote goes only to the account's own.
    const elsewhere = await t
      .http()
      .post('/api/quotes/email')
      .set('Cookie', b)
      .send({ configuration: small, to: 'someone@else.example' })
      .expect(400);
    expect(elsewhere.body.message).toContain('"to" is not a field');
  });

  it('lists the line items in the request-received mail, whose link opens the booking’s quote PDF for its player only', async () => {
    await fetch(`http://127.0.0.1:${fake.httpPort}/api/messages`, { method: 'DELETE' });
    const booking = (await asA().post('/api/bookings', { configuration: stage }).expect(201)).body;
    await t.app.get(MailDeliveryService).deliverPending();
    const requested = (await inbox('player@mail.example')).find((m) => m.subject.startsWith('We have your build request'))!;
    const estimate = (await t.http().post('/api/estimates').send(stage).expect(200)).body;
    for (const line of estimate.lines as Array<{ label: string }>) expect(requested.text).toContain(line.label);
    const link = `http://shop.test/api/bookings/${booking.id}/quote.pdf`;
    expect(requested.text).toContain(link);

    const res = await asA().get(`/api/bookings/${booking.id}/quote.pdf`).buffer(true).parse(binary).expect(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const text = await flatText(res.body as Buffer);
    expect(text).toContain(`Build ${booking.reference}`);
    expect(text).toContain(`Estimated total: ${usd(estimate.totalLow)} – ${usd(estimate.totalHigh)}`);
    expect(text).toContain('Patch cables');

    // Staff may open it; another player gets 404; nobody signed in gets 401 in words, or a browser is sent to sign in.
    await t
      .http()
      .get(`/api/bookings/${booking.id}/quote.pdf`)
      .set('Cookie', await sessionCookieFor(t, 'builder'))
      .expect(200);
    await t.http().get(`/api/bookings/${booking.id}/quote.pdf`).set('Cookie', b).expect(404);
    expect((await t.http().get(`/api/bookings/${booking.id}/quote.pdf`).expect(401)).body.message).toContain('sign in');
    const browser = await t
      .http()
      .get(`/api/bookings/${booking.id}/quote.pdf`)
      .set('Accept', 'text/html,application/xhtml+xml,*/*;q=0.8')
      .expect(302);
    expect(browser.headers.location).toBe(`/sign-in?next=${encodeURIComponent(`/builds/${booking.id}`)}`);
  });
});
