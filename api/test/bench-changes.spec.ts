import ICAL from 'ical.js';
import { sql } from 'kysely';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import type { BenchPreview, BenchView, RescheduleResponse } from '@loomwright/shared';
import { startMailFake, type CaughtMessage, type MailFake } from '../fakes/mail/mail-fake';
import { addDays, todayIn } from '../src/bench/calendar-days';
import { publicHolidaysBetween } from '../src/bench/public-holidays';
import { MailDeliveryService } from '../src/mail/mail-delivery.service';
import { clearBench, createBooking, openBenchShop, signIn, type Agent } from './support/bench-fixtures';
import type { TestApp } from './support/test-app';

/** The first weekday on or after `day` that is not a US public holiday (date-holidays, the shop's own holiday data). */
function firstWorkdayFrom(day: string): string {
  let d = day;
  while ([0, 6].includes(new Date(`${d}T00:00:00Z`).getUTCDay()) || publicHolidaysBetween('US', d, d).size > 0) d = addDays(d, 1);
  return d;
}

describe('when plans change on the bench: move, reassign, cancel, closures and release', () => {
  let fake: MailFake;
  let t: TestApp, masterId: string, juniorId: string, monday: string;
  let owner: Agent, master: Agent, junior: Agent, player: Agent;
  beforeAll(async () => {
    fake = await startMailFake({ smtpPort: 0, httpPort: 0 });
    ({ t, owner, master, junior, player, masterId, juniorId, monday } = await openBenchShop({ env: { SMTP_PORT: String(fake.smtpPort) } }));
  });
  afterAll(async () => {
    await fake.stop();
    await t.close();
  });
  beforeEach(async () => {
    await clearBench(t.db, ['builder_absences']);
    await fetch(`http://127.0.0.1:${fake.httpPort}/api/messages`, { method: 'DELETE' });
  });

  async function scheduled(laborHours: string, benchDate = monday, who = masterId, agent = () => master) {
    const b = await createBooking(t.db, { laborHours });
    await agent().post(`/api/bookings/${b.id}/accept`).send({ builderId: who, benchDate }).expect(200);
    return b;
  }

  const slicesOf = (bookingId: string) =>
    sql<{ builder_id: string; day: string; hours: string }>`
      select builder_id, day::text, (upper(hours) - lower(hours))::text as hours from bench_allocations where booking_id = ${bookingId} order by day, lower(hours)`
      .execute(t.db)
      .then((r) => r.rows);

  async function inbox(): Promise<CaughtMessage[]> {
    await t.app.get(MailDeliveryService).deliverPending();
    return (await fetch(`http://127.0.0.1:${fake.httpPort}/api/messages?to=player@mail.example`)).json();
  }

  // RFC 5545 (iCalendar), parsed by ical.js, an independent iCalendar library from the npm registry.
  function calendarEvent(message: CaughtMessage) {
    const file = message.attachments.find((a) => a.contentType.startsWith('text/calendar'));
    if (!file) throw new Error(`no calendar file on "${message.subject}"`);
    // The mail fake hands attachments over base64-encoded.
    const component = new ICAL.Component(ICAL.parse(Buffer.from(file.content, 'base64').toString('utf8')));
    const event = component.getFirstSubcomponent('vevent')!;
    return {
      method: component.getFirstPropertyValue('method'),
      status: event.getFirstPropertyValue('status'),
      vevent: new ICAL.Event(event),
    };
  }

  it('moves a scheduled build to another day in one step: bench time, history, and an updated calendar file with the same UID', async () => {
    const b = await scheduled('10.00');
    const wednesday = addDays(monday, 2);
    const res = await master
      .post(`/api/bookings/${b.id}/reschedule`)
      .send({ builderId: masterId, benchDate: wednesday, reason: 'The parcel is running late.' })
      .expect(200);
    const body = res.body as RescheduleResponse;
    // The master's week is 7/7/7/7/6 h: 10 h from Wednesday is 7 h Wednesday and 3 h Thursday.
    expect(body).toMatchObject({
      benchDate: wednesday,
      previousBenchDate: monday,
      expectedCompletion: addDays(monday, 3),
      shift: '2 days later',
      calendarSequence: 1,
      repriced: false,
    });
    expect(body.plan).toEqual([
      { date: wednesday, hours: 7 },
      { date: addDays(monday, 3), hours: 3 },
    ]);
    expect(await slicesOf(b.id)).toEqual([
      { builder_id: masterId, day: wednesday, hours: '7.00' },
      { builder_id: masterId, day: addDays(monday, 3), hours: '3.00' },
    ]);
    const row = await t.db.selectFrom('bookings').selectAll().where('id', '=', b.id).executeTakeFirstOrThrow();
    expect(row).toMatchObject({ state: 'scheduled', bench_date: wednesday, expected_completion: addDays(monday, 3), calendar_sequence: 1 });
    const events = await t.db.selectFrom('booking_events').selectAll().where('booking_id', '=', b.id).orderBy('id').execute();
    expect(events.at(-1)).toMatchObject({ from_state: 'scheduled', to_state: 'scheduled', actor_label: 'Teodor Lind' });
    expect(events.at(-1)!.note).toMatch(/^Moved to .* \(2 days later\) .*Why: The parcel is running late\./);

    // The player's page shows the new date.
    const detail = (await player.get(`/api/bookings/${b.id}`).expect(200)).body;
    expect(detail.benchDate).toBe(wednesday);

    // Both letters arrive; the second's calendar file updates the first's event (RFC 5545 §3.8.7.4:
    // same UID, higher SEQUENCE) and moves the ship-by day two days later.
    const mail = await inbox();
    const booked = mail.find((m) => m.subject.startsWith('Booked:'))!;
    const moved = mail.find((m) => m.subject.startsWith('Moved:'))!;
    expect(moved.text).toContain('The parcel is running late.');
    const first = calendarEvent(booked);
    const update = calendarEvent(moved);
    expect(update.vevent.uid).toBe(first.vevent.uid);
    expect(first.vevent.sequence).toBe(0);
    expect(update.vevent.sequence).toBe(1);
    expect(update.method).toBe('PUBLISH');
    expect(update.vevent.startDate.toString()).toBe(addDays(monday, -3));
    expect(first.vevent.startDate.toString()).toBe(addDays(monday, -5));
  });

  it('answers 409 in words when the new slot cannot hold the build, and leaves it where it was', async () => {
    await scheduled('7.00', addDays(monday, 1));
    const b = await scheduled('3.00');
    const res = await master
      .post(`/api/bookings/${b.id}/reschedule`)
      .send({ builderId: masterId, benchDate: addDays(monday, 1), reason: 'Player asked' });
    expect(res.status).toBe(409);
    expect(res.body.message).toMatch(/no free bench time on .*the day is full/);
    expect(await slicesOf(b.id)).toEqual([{ builder_id: masterId, day: monday, hours: '3.00' }]);
    expect((await t.db.selectFrom('bookings').select('bench_date').where('id', '=', b.id).executeTakeFirstOrThrow()).bench_date).toBe(
      monday,
    );
    expect(await t.db.selectFrom('mail_outbox').select('id').where('template', '=', 'booking-rescheduled').execute()).toHaveLength(0);
  });

  it('refuses dates that make no sense, in words: the past, too soon to ship, a holiday or closure, a day off', async () => {
    const b = await scheduled('3.00');
    const today = todayIn('America/Chicago');
    const move = (benchDate: string, extra: object = {}) =>
      master.post(`/api/bookings/${b.id}/reschedule`).send({ builderId: masterId, benchDate, reason: 'Testing the rules', ...extra });
    const past = await move('2020-01-06');
    expect(past.status).toBe(400);
    expect(past.body.message).toMatch(/in the past/);
    // Each refusal carries its own code, so the backoffice can say which date to pick without reading the words.
    expect(past.body.code).toBe('bench_date_in_past');
    // Tomorrow: the pedals would have to have arrived three shop working days ago (common practice, no published source).
    const tooSoon = await move(addDays(today, 1));
    expect(tooSoon.status).toBe(400);
    expect(tooSoon.body.message).toMatch(/^Too soon to ship: the pedals would have to arrive by .*, which has passed/);
    expect(tooSoon.body.code).toBe('too_soon_to_ship');
    await owner
      .post('/api/settings/closures')
      .send({ startsOn: addDays(monday, 3), endsOn: addDays(monday, 3), reason: 'stocktake' })
      .expect(201);
    const closed = await move(addDays(monday, 3));
    expect(closed.status).toBe(409);
    expect(closed.body.message).toMatch(/no free bench time on .*: Shop closed: stocktake/);
    expect(closed.body.code).toBe('bench_day_closed');
    const saturday = await move(addDays(monday, 5));
    expect(saturday.status).toBe(409);
    expect(saturday.body.message).toMatch(/Day off/);
    expect(saturday.body.code).toBe('bench_day_closed');
    // Bad input is a 400 naming the field, from the shared schema.
    const bad = await master
      .post(`/api/bookings/${b.id}/reschedule`)
      .send({ builderId: 'nobody', benchDate: '2026-02-30', reason: ' ', extra: 1 });
    expect(bad.status).toBe(400);
    expect(bad.body.details).toEqual(
      expect.arrayContaining([
        'Choose a builder from the list; this one is not known here',
        'Bench date must be a real calendar day, like 2026-12-14',
        'Reason is required: say why the build moves (the player reads it)',
      ]),
    );
    // A request that is not scheduled cannot be moved.
    const request = await createBooking(t.db, { laborHours: '2.00' });
    expect(
      (await master.post(`/api/bookings/${request.id}/reschedule`).send({ builderId: masterId, benchDate: monday, reason: 'x' })).status,
    ).toBe(409);
  });

  it('previews a date before choosing it: per builder the load, ship-by day and why a date is refused', async () => {
    await scheduled('4.00');
    const b = await createBooking(t.db, { laborHours: '5.00' });
    const preview = (await owner.get(`/api/bench/preview?bookingId=${b.id}&benchDate=${monday}`).expect(200)).body as BenchPreview;
    const forMaster = preview.options.find((o) => o.builder.id === masterId)!;
    // Monday has 7 h, 4 taken: 3 h Monday and 2 h Tuesday.
    expect(forMaster).toMatchObject({
      ok: true,
      refusal: null,
      expectedCompletion: addDays(monday, 1),
      shipBy: addDays(monday, -5),
      nextPossibleDate: monday,
    });
    expect(forMaster.load).toEqual([
      { date: monday, capacityHours: 7, bookedHours: 4, thisBuildHours: 3, off: null },
      { date: addDays(monday, 1), capacityHours: 7, bookedHours: 0, thisBuildHours: 2, off: null },
    ]);
    const saturday = (
      await owner.get(`/api/bench/preview?bookingId=${b.id}&benchDate=${addDays(monday, 5)}&builderId=${masterId}`).expect(200)
    ).body as BenchPreview;
    expect(saturday.options[0]).toMatchObject({ ok: false, refusal: 'day_off', nextPossibleDate: firstWorkdayFrom(addDays(monday, 7)) });
    const bad = await owner.get(`/api/bench/preview?bookingId=${b.id}&benchDate=someday`);
    expect(bad.status).toBe(400);
    expect(bad.body.details).toEqual(['Bench date must be a real calendar day, like 2026-12-14']);
  });

  it('reassigns to another builder: only the owner re-prices (shown to the player) or goes below the chosen level, with a reason', async () => {
    const b = await createBooking(t.db, { laborHours: '4.00', minimumLevel: 'journeyman' });
    await master.post(`/api/bookings/${b.id}/accept`).send({ builderId: masterId, benchDate: monday }).expect(200);
    // Pip is an apprentice, below the journeyman the rig needs.
    const byBuilder = await master
      .post(`/api/bookings/${b.id}/reschedule`)
      .send({ builderId: juniorId, benchDate: monday, reason: 'Teodor is ill' });
    expect(byBuilder.status).toBe(403);
    expect(byBuilder.body.message).toMatch(/only the owner can assign them, with a reason/);
    const noReason = await owner
      .post(`/api/bookings/${b.id}/reschedule`)
      .send({ builderId: juniorId, benchDate: monday, reason: 'Teodor is ill' });
    expect(noReason.status).toBe(400);
    expect(noReason.body.message).toMatch(/A reason for a builder below the level is required/);
    const builderReprices = await master
      .post(`/api/bookings/${b.id}/reschedule`)
      .send({ builderId: masterId, benchDate: addDays(monday, 1), reason: 'x', reprice: true });
    expect(builderReprices.status).toBe(403);
    // Pip does not work Mondays (the demo apprentice's week is Tuesday to Friday, 6 h).
    const monday409 = await owner.post(`/api/bookings/${b.id}/reschedule`).send({
      builderId: juniorId,
      benchDate: monday,
      reason: 'Teodor is ill this week.',
      reprice: true,
      levelOverrideReason: 'Pip builds it with Teodor checking the loops by phone.',
    });
    expect(monday409.status).toBe(409);
    expect(monday409.body.message).toMatch(/Day off/);
    const res = await owner
      .post(`/api/bookings/${b.id}/reschedule`)
      .send({
        builderId: juniorId,
        benchDate: addDays(monday, 1),
        reason: 'Teodor is ill this week.',
        reprice: true,
        levelOverrideReason: 'Pip builds it with Teodor checking the loops by phone.',
      })
      .expect(200);
    // Hand-worked: Pip's $45.00/h × 4 h = $180.00 labor + $300.00 materials = $480.00 (was $125.00 × 4 + $300.00 = $800.00).
    expect(res.body).toMatchObject({ builderId: juniorId, repriced: true, firmTotal: '480.00', shift: '1 day later' });
    const firms = await t.db
      .selectFrom('quotes')
      .select(['total', 'hourly_rate', 'builder_id'])
      .where('booking_id', '=', b.id)
      .where('kind', '=', 'firm')
      .orderBy('created_at')
      .execute();
    expect(firms).toEqual([
      { total: '800.00', hourly_rate: '125.00', builder_id: masterId },
      { total: '480.00', hourly_rate: '45.00', builder_id: juniorId },
    ]);
    expect(await slicesOf(b.id)).toEqual([{ builder_id: juniorId, day: addDays(monday, 1), hours: '4.00' }]);
    const detail = (await player.get(`/api/bookings/${b.id}`).expect(200)).body;
    expect(detail).toMatchObject({
      firmTotal: '480.00',
      levelOverrideReason: 'Pip builds it with Teodor checking the loops by phone.',
      builder: { id: juniorId },
    });
    const moved = (await inbox()).find((m) => m.subject.startsWith('Moved:'))!;
    expect(moved.text).toContain('Why this builder: Pip builds it with Teodor checking the loops by phone.');
    expect(moved.text).toContain('$480.00');
  });

  it('a firm total above the quoted range waits for the player’s yes; until then the player sees it pending', async () => {
    // The fixture quotes $300.00 at the high end; the master's firm total is $300.00 + 2 h × $125.00 = $550.00.
    const b = await scheduled('2.00');
    const detail = (await player.get(`/api/bookings/${b.id}`).expect(200)).body;
    expect(detail.priceConsent).toBe('pending');
    expect(
      (await t.db.selectFrom('mail_outbox').select('data').where('booking_id', '=', b.id).executeTakeFirstOrThrow()).data,
    ).toMatchObject({ priceConsentNeeded: true, quotedHigh: '300.00' });
    const yes = await player.post(`/api/bookings/${b.id}/price-consent`).send({ accept: true }).expect(200);
    expect(yes.body.priceConsent).toBe('given');
    expect((await player.post(`/api/bookings/${b.id}/price-consent`).send({ accept: true })).status).toBe(409);
    const other = await signIn(t.app, 'cass@mail.example');
    expect((await other.post(`/api/bookings/${b.id}/price-consent`).send({ accept: false })).status).toBe(404);
    expect((await player.post(`/api/bookings/${b.id}/price-consent`).send({ accept: 'yes' })).body.details).toEqual([
      'Answer yes to keep the build at the new price, or no to cancel with a full refund',
    ]);
  });

  it('only builders who joined take builds: a pending invitation is neither suggested nor assignable', async () => {
    const invited = await owner
      .post('/api/invitations')
      .send({ email: 'newhand@shop.example', name: 'Noor Vasquez-Lund', level: 'master', hourlyRate: '110.00' });
    expect(invited.status).toBe(201);
    const newId = (
      await t.db
        .selectFrom('builders')
        .innerJoin('users', 'users.id', 'builders.user_id')
        .select('builders.id')
        .where('users.email', '=', 'newhand@shop.example')
        .executeTakeFirstOrThrow()
    ).id;
    const b = await createBooking(t.db, { laborHours: '2.00' });
    const suggest = (await owner.get(`/api/bench/suggest?bookingId=${b.id}`).expect(200)).body;
    expect(suggest.suggestions.map((s: { builder: { id: string } }) => s.builder.id)).not.toContain(newId);
    const res = await owner.post(`/api/bookings/${b.id}/accept`).send({ builderId: newId, benchDate: monday });
    expect(res.status).toBe(409);
    expect(res.body.message).toMatch(/has not accepted their invitation yet/);
  });

  it('suggests builders of the level the player chose first; below it only the owner sees them', async () => {
    const b = await createBooking(t.db, { laborHours: '2.00', minimumLevel: 'apprentice' });
    // The player chose a master even though an apprentice could build it.
    await sql`update bookings set configuration = jsonb_set(configuration, '{level}', '"master"') where id = ${b.id}`.execute(t.db);
    await sql`delete from quotes where booking_id = ${b.id}`.execute(t.db);
    await sql`insert into quotes (booking_id, kind, price_book_version, currency, configuration, estimate, labor_hours, total_low, total_high, deposit, expires_at)
      select ${b.id}, 'estimate', 1, 'USD', configuration, jsonb_build_object('level', 'master', 'minimumLevel', 'apprentice', 'laborHours', '2.00', 'materialsTotal', '300.00', 'lines', '[]'::jsonb),
        2.00, 500.00, 600.00, 150.00, now() + interval '30 days' from bookings where id = ${b.id}`.execute(t.db);
    const asOwner = (await owner.get(`/api/bench/suggest?bookingId=${b.id}`).expect(200)).body;
    expect(asOwner.chosenLevel).toBe('master');
    expect(asOwner.suggestions[0]).toMatchObject({ builder: { id: masterId }, meetsChosenLevel: true });
    expect(asOwner.suggestions.find((s: { builder: { id: string } }) => s.builder.id === juniorId)).toMatchObject({
      meetsChosenLevel: false,
    });
    const asJunior = (await junior.get(`/api/bench/suggest?bookingId=${b.id}`).expect(200)).body;
    expect(asJunior.suggestions.map((s: { builder: { id: string } }) => s.builder.id)).not.toContain(juniorId);
    expect(asJunior.ineligible.find((i: { builder: { id: string } }) => i.builder.id === juniorId).reason).toMatch(
      /The player chose a master builder; only the owner/,
    );
    const byJunior = await junior.post(`/api/bookings/${b.id}/accept`).send({ builderId: juniorId, benchDate: monday });
    expect(byJunior.status).toBe(403);
  });

  it('a closure over booked days lists the builds it hits; each moves to the next date that holds it through the reschedule path', async () => {
    const first = await scheduled('7.00');
    const second = await scheduled('3.00', addDays(monday, 1));
    const closure = await owner
      .post('/api/settings/closures')
      .send({ startsOn: monday, endsOn: addDays(monday, 1), reason: 'flooded workshop' })
      .expect(201);
    expect(closure.body.buildsOnBenchThen.map((x: { reference: string }) => x.reference).sort()).toEqual(
      [first.reference, second.reference].sort(),
    );
    for (const hit of closure.body.buildsOnBenchThen as Array<{ bookingId: string }>) {
      const booking = await t.db
        .selectFrom('bookings')
        .select(['bench_date', 'builder_id'])
        .where('id', '=', hit.bookingId)
        .executeTakeFirstOrThrow();
      const preview = (
        await owner
          .get(`/api/bench/preview?bookingId=${hit.bookingId}&benchDate=${booking.bench_date}&builderId=${booking.builder_id}`)
          .expect(200)
      ).body as BenchPreview;
      expect(preview.options[0].refusal).toBe('closed');
      await owner
        .post(`/api/bookings/${hit.bookingId}/reschedule`)
        .send({ builderId: booking.builder_id, benchDate: preview.options[0].nextPossibleDate, reason: 'The shop is closed those days.' })
        .expect(200);
    }
    // Wednesday holds the 7 h build; the 3 h one moves in order to Thursday (Wednesday is full by then).
    expect(await slicesOf(first.id)).toEqual([{ builder_id: masterId, day: addDays(monday, 2), hours: '7.00' }]);
    expect(await slicesOf(second.id)).toEqual([{ builder_id: masterId, day: addDays(monday, 3), hours: '3.00' }]);
    const onClosedDays = await t.db
      .selectFrom('bench_allocations')
      .select('id')
      .where('day', 'in', [monday, addDays(monday, 1)])
      .execute();
    expect(onClosedDays).toHaveLength(0);
  });

  it('a builder’s absence hits their builds only, shows on the bench, and the next date that holds the build is after it', async () => {
    const mine = await scheduled('3.00');
    const absence = await owner
      .post(`/api/team/${masterId}/absences`)
      .send({ startsOn: monday, endsOn: addDays(monday, 4), reason: 'ill' })
      .expect(201);
    expect(absence.body.buildsOnBenchThen).toEqual([{ bookingId: mine.id, reference: mine.reference, days: [monday] }]);
    const bench = (await owner.get(`/api/bench?from=${monday}&to=${monday}&builderId=${masterId}`).expect(200)).body as BenchView;
    expect(bench.builders[0].days[0].off).toEqual({ kind: 'absence', label: 'Away: ill' });
    // The master is away all week: the first date that holds the build for him is the Monday after.
    const preview = (await owner.get(`/api/bench/preview?bookingId=${mine.id}&benchDate=${monday}&builderId=${masterId}`).expect(200))
      .body as BenchPreview;
    expect(preview.options[0]).toMatchObject({ ok: false, refusal: 'away', nextPossibleDate: firstWorkdayFrom(addDays(monday, 7)) });
    expect(
      (await owner.post(`/api/team/${masterId}/absences`).send({ startsOn: monday, endsOn: addDays(monday, -1), reason: 'x' })).body
        .details,
    ).toEqual(['Last day must be on or after the first day']);
    await owner.delete(`/api/team/absences/${absence.body.id}`).send({}).expect(204);
    expect((await owner.delete(`/api/team/absences/${absence.body.id}`).send({})).status).toBe(404);
  });

  it('releases bench hours after today when a build reaches testing, and the bench shows hours recorded against planned', async () => {
    const b = await scheduled('10.00');
    const today = todayIn('America/Chicago');
    // A slice on today stands for work already under way; it must stay (only later days are released).
    await sql`insert into bench_allocations (booking_id, builder_id, day, hours, day_capacity) values (${b.id}, ${masterId}, ${today}, numrange(20.00, 21.00), 24)`.execute(
      t.db,
    );
    await master
      .post(`/api/bookings/${b.id}/intake`)
      .send({ items: [{ item: 'Fuzz', condition: 'working' }] })
      .expect(201);
    await master.post(`/api/bookings/${b.id}/state`).send({ to: 'pedals_received' }).expect(200);
    await master.post(`/api/bookings/${b.id}/state`).send({ to: 'on_bench' }).expect(200);
    await master.post(`/api/bookings/${b.id}/time-entries`).send({ workedOn: today, hours: 6.5, note: 'mounted and wired' }).expect(201);
    expect((await slicesOf(b.id)).length).toBe(3);
    await master.post(`/api/bookings/${b.id}/state`).send({ to: 'testing' }).expect(200);
    expect(await slicesOf(b.id)).toEqual([{ builder_id: masterId, day: today, hours: '1.00' }]);
    const notes = (await t.db.selectFrom('booking_events').select('note').where('booking_id', '=', b.id).orderBy('id').execute()).map(
      (e) => e.note,
    );
    expect(notes.at(-1)).toMatch(/^Released 10 hr of bench time booked after \w{3}, \w{3} \d{1,2}, \d{4}: the build reached testing\.$/);
    const bench = (await master.get(`/api/bench?from=${today}&to=${today}&builderId=${masterId}`).expect(200)).body as BenchView;
    expect(bench.builders[0].days[0]).toMatchObject({ bookedHours: 1, recordedHours: 6.5 });
    // Monday's hours are free again for another build.
    const next = await createBooking(t.db, { laborHours: '7.00' });
    await master.post(`/api/bookings/${next.id}/accept`).send({ builderId: masterId, benchDate: monday }).expect(200);
  });

  it('the owner cancels a scheduled build the player asked to cancel: hours released, deposit kept per the policy, calendar event cancelled', async () => {
    const b = await scheduled('10.00');
    await player.post(`/api/bookings/${b.id}/price-consent`).send({ accept: true }).expect(200);
    const preview = (await owner.get(`/api/bookings/${b.id}/cancellation`).expect(200)).body;
    expect(preview).toMatchObject({ depositPaid: '150.00', refundIfPlayerAsked: '0.00', refundIfShopCancels: '150.00', benchHours: 10 });
    expect(preview.policy).toMatch(/if the player cancels, the shop keeps the deposit/);
    expect((await master.post(`/api/bookings/${b.id}/cancel-scheduled`).send({ reason: 'x', cause: 'player' })).status).toBe(403);
    expect((await owner.post(`/api/bookings/${b.id}/cancel-scheduled`).send({ reason: 'x', cause: 'nobody' })).body.details).toEqual([
      'Say who asked to cancel: the player, or the shop (it cannot build it)',
    ]);
    const res = await owner
      .post(`/api/bookings/${b.id}/cancel-scheduled`)
      .send({ reason: 'The player is moving abroad.', cause: 'player' })
      .expect(200);
    expect(res.body.state).toBe('cancelled');
    expect(await slicesOf(b.id)).toEqual([]);
    const deposit = await t.db.selectFrom('payments').select('status').where('booking_id', '=', b.id).executeTakeFirstOrThrow();
    expect(deposit.status).toBe('paid');
    expect((await owner.post(`/api/bookings/${b.id}/cancel-scheduled`).send({ reason: 'again', cause: 'player' })).status).toBe(409);
    const mail = await inbox();
    const cancelled = mail.find((m) => m.subject === `Cancelled: build ${b.reference}`)!;
    expect(cancelled.text).toContain('Deposit kept, per the deposit policy');
    const booked = calendarEvent(mail.find((m) => m.subject.startsWith('Booked:'))!);
    const cancel = calendarEvent(cancelled);
    // RFC 5546 §3.2.5 CANCEL and RFC 5545 §3.8.1.11 STATUS:CANCELLED, same UID, higher SEQUENCE (§3.8.7.4).
    expect(cancel.method).toBe('CANCEL');
    expect(cancel.status).toBe('CANCELLED');
    expect(cancel.vevent.uid).toBe(booked.vevent.uid);
    expect(cancel.vevent.sequence).toBeGreaterThan(booked.vevent.sequence);
  });

  it('a cancellation that owes a refund but has no provider payment is refused whole: nothing released, nothing changed', async () => {
    const b = await scheduled('3.00');
    const res = await owner.post(`/api/bookings/${b.id}/cancel-scheduled`).send({ reason: 'We cannot source the case.', cause: 'shop' });
    expect(res.status).toBe(409);
    expect(res.body.message).toMatch(/no provider payment to refund/);
    expect((await t.db.selectFrom('bookings').select('state').where('id', '=', b.id).executeTakeFirstOrThrow()).state).toBe('scheduled');
    expect(await slicesOf(b.id)).toHaveLength(1);
  });
});
