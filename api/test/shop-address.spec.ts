import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { MailTemplateData } from '../src/mail/mail.types';
import { renderMail } from '../src/mail/templates/render';
import { ShopService } from '../src/shop/shop.service';
import { createTestApp, type TestApp } from './support/test-app';
import { sessionCookieFor } from './support/sessions';

/** The shop's postal address: set in Settings, printed where players ship their pedals. */
describe('shop postal address (PATCH /api/settings postalAddress)', () => {
  let t: TestApp;
  let owner: string;
  const address = { line1: '14 Foundry Lane', line2: 'Unit 3', city: 'Millbrook', region: 'OR', postalCode: '97000' };
  /** The letter that tells a player where to ship their pedals. */
  const scheduled: MailTemplateData['booking-scheduled'] = {
    name: 'Rosa',
    reference: 'LW-1042',
    benchDate: '2027-01-12',
    shipBy: '2027-01-08',
    builderLevel: 'journeyman',
    expectedCompletion: '2027-01-15',
    whatToShip: ['Tuner', 'Fuzz'],
  };

  beforeAll(async () => {
    t = await createTestApp();
    owner = await sessionCookieFor(t, 'owner');
  });
  afterAll(async () => t.close());

  it('starts empty, so the scheduled mail still says to ask for it', async () => {
    expect((await t.http().get('/api/settings').set('Cookie', owner).expect(200)).body.postalAddress).toBeNull();
    const shop = await t.app.get(ShopService).profile();
    expect(shop.postalAddress).toBeNull();
    const mail = renderMail('booking-scheduled', scheduled, shop);
    expect(mail.text).toContain('for the address');
  });

  it('the owner sets it in structured fields; the settings, the public profile and the scheduled mail show it', async () => {
    const res = await t.http().patch('/api/settings').set('Cookie', owner).send({ postalAddress: address }).expect(200);
    expect(res.body.postalAddress).toEqual(address);
    // One line in the order a postal label reads in the US: street, unit, city, state and ZIP (common practice, no published source).
    const profile = (await t.http().get('/api/shop').expect(200)).body;
    expect(profile.postalAddress).toBe(`14 Foundry Lane, Unit 3, Millbrook, OR 97000, ${profile.countryCode}`);
    const mail = renderMail('booking-scheduled', scheduled, await t.app.get(ShopService).profile());
    expect(mail.text).toContain('14 Foundry Lane, Unit 3, Millbrook, OR 97000');
    expect(mail.text).not.toContain('for the address');
    // A region and a second line are optional.
    const short = await t
      .http()
      .patch('/api/settings')
      .set('Cookie', owner)
      .send({ postalAddress: { line1: '2 Mill Row', city: 'Harrow Vale', postalCode: 'HV1 2AB' } })
      .expect(200);
    expect(short.body.postalAddress).toEqual({ line1: '2 Mill Row', line2: '', city: 'Harrow Vale', region: '', postalCode: 'HV1 2AB' });
  });

  it('answers a missing street, city or postal code with 400 naming each field, and lets only the owner change it', async () => {
    const bad = await t
      .http()
      .patch('/api/settings')
      .set('Cookie', owner)
      .send({ postalAddress: { line1: '', city: '', postalCode: 7 } })
      .expect(400);
    const words = JSON.stringify(bad.body);
    for (const field of ['postalAddress.line1', 'postalAddress.city', 'postalAddress.postalCode']) expect(words).toContain(field);
    await t
      .http()
      .patch('/api/settings')
      .set('Cookie', await sessionCookieFor(t, 'builder'))
      .send({ postalAddress: address })
      .expect(403);
  });
});
