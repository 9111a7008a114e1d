import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BenchView, HolidayChoiceResponse, ShopSettingsView } from '@loomwright/shared';
import { BenchService } from '../src/bench/bench.service';
import { isShopWorkingDay } from '../src/bench/scheduling';
import { createTestApp, type TestApp } from './support/test-app';
import { sessionCookieFor } from './support/sessions';

/**
 * The fourth Thursday of November of a year: Thanksgiving Day, a US federal holiday by
 * 5 U.S.C. § 6103(a). Worked out here from the calendar, not read from the holiday dataset.
 */
function thanksgiving(year: number): string {
  const firstWeekday = new Date(Date.UTC(year, 10, 1)).getUTCDay(); // 0 Sunday … 4 Thursday
  const firstThursday = 1 + ((4 - firstWeekday + 7) % 7);
  return `${year}-11-${String(firstThursday + 21).padStart(2, '0')}`;
}

/** The owner switches single public holidays off (the shop works) and on again (PUT /api/settings/holidays/:day). */
describe('per-holiday opt-out (PUT /api/settings/holidays/:day)', () => {
  let t: TestApp;
  let owner: string;
  let day: string;

  const benchDay = async (date: string) => {
    const view = (await t.http().get(`/api/bench?from=${date}&to=${date}`).set('Cookie', owner).expect(200)).body as BenchView;
    return view.builders.map((b) => b.days[0]!);
  };

  beforeAll(async () => {
    t = await createTestApp();
    owner = await sessionCookieFor(t, 'owner');
    // The demo shop is in the US; take the next Thanksgiving inside the settings page's twelve months.
    const { today } = await t.app.get(BenchService).shopCalendar();
    const year = Number(today.slice(0, 4));
    day = thanksgiving(year) > today ? thanksgiving(year) : thanksgiving(year + 1);
  });
  afterAll(async () => t.close());

  it('lists the holiday as closed, then a switched-off holiday becomes a working bench day with a history line, and can be closed again', async () => {
    const before = (await t.http().get('/api/settings').set('Cookie', owner).expect(200)).body as ShopSettingsView;
    expect(before.countryCode).toBe('US');
    expect(before.upcomingHolidays.find((h) => h.date === day)).toMatchObject({ shopWorks: false });
    // Closed on the bench: no builder has hours that Thursday.
    for (const d of await benchDay(day)) expect(d.capacityHours).toBe(0);
    expect(isShopWorkingDay(day, await t.app.get(BenchService).shopCalendar())).toBe(false);

    const opened = (await t.http().put(`/api/settings/holidays/${day}`).set('Cookie', owner).send({ shopWorks: true }).expect(200))
      .body as HolidayChoiceResponse;
    expect(opened).toMatchObject({ day, shopWorks: true, decidedBy: expect.any(String), buildsOnBenchThen: [] });
    // Every demo builder works Thursdays (seed-people.ts), so each now has bench hours that day.
    const days = await benchDay(day);
    expect(days.length).toBeGreaterThan(0);
    for (const d of days) expect(d.capacityHours).toBeGreaterThan(0);
    expect(isShopWorkingDay(day, await t.app.get(BenchService).shopCalendar())).toBe(true);
    const after = (await t.http().get('/api/settings').set('Cookie', owner).expect(200)).body as ShopSettingsView;
    expect(after.upcomingHolidays.find((h) => h.date === day)).toMatchObject({ shopWorks: true });
    expect(after.holidayHistory[0]).toMatchObject({ day, shopWorks: true, decidedBy: opened.decidedBy });

    // Asking again for the state it is in adds no second history line.
    await t.http().put(`/api/settings/holidays/${day}`).set('Cookie', owner).send({ shopWorks: true }).expect(200);
    expect(((await t.http().get('/api/settings').set('Cookie', owner).expect(200)).body as ShopSettingsView).holidayHistory).toHaveLength(
      1,
    );

    const closed = (await t.http().put(`/api/settings/holidays/${day}`).set('Cookie', owner).send({ shopWorks: false }).expect(200))
      .body as HolidayChoiceResponse;
    expect(closed).toMatchObject({ day, shopWorks: false });
    for (const d of await benchDay(day)) expect(d.capacityHours).toBe(0);
    const history = ((await t.http().get('/api/settings').set('Cookie', owner).expect(200)).body as ShopSettingsView).holidayHistory;
    expect(history.map((h) => h.shopWorks)).toEqual([false, true]);
  });

  it('refuses a day that is not a public holiday, a malformed day or answer in words (400), and anyone but the owner (403)', async () => {
    const dayBefore = `${day.slice(0, 8)}${String(Number(day.slice(8)) - 1).padStart(2, '0')}`;
    const notHoliday = await t.http().put(`/api/settings/holidays/${dayBefore}`).set('Cookie', owner).send({ shopWorks: true }).expect(400);
    expect(notHoliday.body).toMatchObject({ statusCode: 400, code: 'bad_request' });
    expect(notHoliday.body.message).toBe(
      `${dayBefore} is not a public holiday in US; only the country’s public holidays can be switched off or on`,
    );
    const badDay = await t.http().put('/api/settings/holidays/next-thursday').set('Cookie', owner).send({ shopWorks: true }).expect(400);
    expect(badDay.body.code).toBe('validation_failed');
    const badAnswer = await t.http().put(`/api/settings/holidays/${day}`).set('Cookie', owner).send({ shopWorks: 'yes' }).expect(400);
    expect(JSON.stringify(badAnswer.body.message)).toContain('Say whether the shop works that day');
    await t
      .http()
      .put(`/api/settings/holidays/${day}`)
      .set('Cookie', await sessionCookieFor(t, 'builder'))
      .send({ shopWorks: true })
      .expect(403);
  });

  it('takes a country from the ISO 3166 list and a time zone from the IANA list, refusing others in words', async () => {
    // ISO 3166-1: "QQ" is a user-assigned code, never a country; "ZZ" likewise.
    for (const countryCode of ['QQ', 'ZZ', 'USA', '']) {
      const res = await t.http().patch('/api/settings').set('Cookie', owner).send({ countryCode }).expect(400);
      expect(JSON.stringify(res.body.message), countryCode).toContain('Country must be a country from the list');
    }
    // IANA tz database: "Mars/Olympus" is no zone; "Etc/GMT+5" is a fixed offset, not a place, so it is off the list.
    for (const timezone of ['Mars/Olympus', 'Etc/GMT+5', '']) {
      const res = await t.http().patch('/api/settings').set('Cookie', owner).send({ timezone }).expect(400);
      expect(JSON.stringify(res.body.message), timezone).toContain('Time zone must be a place name from the time zone list');
    }
    // A country without the shop's usual holidays is allowed (ISO 3166-1: AQ Antarctica); back to the US.
    await t.http().patch('/api/settings').set('Cookie', owner).send({ countryCode: 'aq', timezone: 'UTC' }).expect(200);
    // IANA tz database, file "backward": US/Central is a link to America/Chicago; the shop stores the zone itself.
    const back = await t.http().patch('/api/settings').set('Cookie', owner).send({ countryCode: 'US', timezone: 'US/Central' }).expect(200);
    expect(back.body).toMatchObject({ countryCode: 'US', timezone: 'America/Chicago' });
  });
});
