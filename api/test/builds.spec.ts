import { sql } from 'kysely';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import type { BenchSuggestResponse, BenchView } from '@loomwright/shared';
import { addDays } from '../src/bench/calendar-days';
import { builderId, clearBench, createBooking, openBenchShop, signIn, type Agent } from './support/bench-fixtures';
import { createTestApp, type TestApp } from './support/test-app';

describe('accepting a build, its firm quote and its way through the bench', () => {
  let t: TestApp, masterId: string, juniorId: string, monday: string;
  let owner: Agent, master: Agent, junior: Agent, player: Agent, cass: Agent;
  beforeAll(async () => ({ t, owner, master, junior, player, cass, masterId, juniorId, monday } = await openBenchShop()));
  afterAll(async () => t.close());
  beforeEach(async () => clearBench(t.db));

  it('writes the firm quote at the builder’s own rate, schedules, and queues the e-mail with what to ship', async () => {
    const b = await createBooking(t.db, { laborHours: '10.00', materialsTotal: '300.00', deposit: '150.00' });
    const res = await master.post(`/api/bookings/${b.id}/accept`).send({ builderId: masterId, benchDate: monday }).expect(200);
    // Hand-worked: the master's $125.00/h × 10 h = $1,250.00; + $300.00 materials = $1,550.00; − $150.00 deposit = $1,400.00.
    expect(res.body.firmQuote).toMatchObject({
      hourlyRate: '125.00',
      laborTotal: '1250.00',
      total: '1550.00',
      balanceDue: '1400.00',
      deposit: '150.00',
    });
    // 7 h Monday + 3 h Tuesday (the master's week is 7/7/7/7/6).
    expect(res.body.plan).toEqual([
      { date: monday, hours: 7 },
      { date: addDays(monday, 1), hours: 3 },
    ]);
    expect(res.body.expectedCompletion).toBe(addDays(monday, 1));
    // Three shop working days before the bench date: the Wednesday before.
    expect(res.body.shipBy).toBe(addDays(monday, -5));

    const row = await t.db.selectFrom('bookings').selectAll().where('id', '=', b.id).executeTakeFirstOrThrow();
    expect(row).toMatchObject({ state: 'scheduled', builder_id: masterId, bench_date: monday, expected_completion: addDays(monday, 1) });
    const firm = await t.db
      .selectFrom('quotes')
      .selectAll()
      .where('booking_id', '=', b.id)
      .where('kind', '=', 'firm')
      .executeTakeFirstOrThrow();
    expect(firm).toMatchObject({
      hourly_rate: '125.00',
      labor_total: '1250.00',
      total: '1550.00',
      builder_id: masterId,
      price_book_version: 1,
    });
    const mail = await t.db.selectFrom('mail_outbox').selectAll().where('booking_id', '=', b.id).executeTakeFirstOrThrow();
    expect(mail.template).toBe('booking-scheduled');
    expect(mail.to_address).toBe('player@mail.example');
    expect(mail.data).toMatchObject({
      reference: b.reference,
      benchDate: monday,
      builderName: 'Teodor Lind',
      builderLevel: 'master',
      firmTotal: '1550.00',
      balanceDue: '1400.00',
      currency: 'USD',
    });
    expect(mail.data.whatToShip).toEqual(expect.arrayContaining(['Fuzz', 'Analog delay']));
    const events = await t.db.selectFrom('booking_events').selectAll().where('booking_id', '=', b.id).execute();
    expect(events.map((e) => [e.from_state, e.to_state, e.actor_label])).toEqual([['deposit_paid', 'scheduled', 'Teodor Lind']]);

    // The bench calendar shows it, the signed-in builder's row first.
    const bench = await master.get(`/api/bench?from=${monday}&to=${addDays(monday, 6)}`).expect(200);
    const view = bench.body as BenchView;
    expect(view.builders[0].builder).toMatchObject({ id: masterId, isMe: true });
    expect(view.builders[0].days[0]).toMatchObject({ date: monday, capacityHours: 7, bookedHours: 7, freeHours: 0 });
    expect(view.builders[0].days[0].builds).toEqual([
      { bookingId: b.id, reference: b.reference, customerName: 'Rowan Achterberg', state: 'scheduled', hours: 7, benchDate: monday },
    ]);
    expect(view.builders[0].days[5].off).toEqual({ kind: 'day_off', label: 'Day off' });
    const juniorView = (await junior.get(`/api/bench?from=${monday}&to=${monday}`).expect(200)).body as BenchView;
    expect(juniorView.builders[0].builder).toMatchObject({ id: juniorId, isMe: true });
  });

  it('suggests per eligible builder the earliest start after time already booked, and leaves out builders below the rig’s level', async () => {
    const first = await createBooking(t.db, { laborHours: '5.00' });
    const next = await createBooking(t.db, { laborHours: '4.00', minimumLevel: 'journeyman' });
    const before = (await owner.get(`/api/bench/suggest?bookingId=${next.id}`).expect(200)).body as BenchSuggestResponse;
    expect(before.minimumLevel).toBe('journeyman');
    expect(before.ineligible.map((i) => i.builder.name)).toEqual(['Pip Okonkwo-Hale']);
    expect(before.ineligible[0].reason).toMatch(/at least a journeyman/);
    const masterFirst = before.suggestions.find((s) => s.builder.id === masterId)!;
    await master.post(`/api/bookings/${first.id}/accept`).send({ builderId: masterId, benchDate: masterFirst.benchDate }).expect(200);
    const after = (await master.get(`/api/bench/suggest?bookingId=${next.id}&builderId=${masterId}`).expect(200))
      .body as BenchSuggestResponse;
    const day = (
      (await master.get(`/api/bench?from=${masterFirst.benchDate}&to=${masterFirst.benchDate}&builderId=${masterId}`).expect(200))
        .body as BenchView
    ).builders[0].days[0];
    // The master works 6 or 7 h a day; 5 are now taken, so the 4 h build still starts that day with what is left.
    expect(day.bookedHours).toBe(5);
    expect(after.suggestions[0].benchDate).toBe(masterFirst.benchDate);
    expect(after.suggestions[0].plan[0]).toEqual({ date: masterFirst.benchDate, hours: day.capacityHours - 5 });
    expect(after.suggestions[0].plan.reduce((s, d) => s + d.hours, 0)).toBe(4);
    // The master's rate: $125.00 × 4 h = $500.00 labor (hand-worked).
    expect(after.suggestions[0].laborTotal).toBe('500.00');
  });

  it('enforces the rig’s minimum level: a builder cannot assign below it, the owner can with a reason', async () => {
    const b = await createBooking(t.db, { laborHours: '3.00', minimumLevel: 'journeyman' });
    const byBuilder = await master.post(`/api/bookings/${b.id}/accept`).send({ builderId: juniorId, benchDate: addDays(monday, 1) });
    expect(byBuilder.status).toBe(403);
    expect(byBuilder.body.message).toMatch(/needs at least a journeyman builder and Pip Okonkwo-Hale is apprentice/);
    const noReason = await owner.post(`/api/bookings/${b.id}/accept`).send({ builderId: juniorId, benchDate: addDays(monday, 1) });
    expect(noReason.status).toBe(400);
    expect(noReason.body.message).toMatch(/A reason for a builder below the level is required/);
    await owner
      .post(`/api/bookings/${b.id}/accept`)
      .send({ builderId: juniorId, benchDate: addDays(monday, 1), levelOverrideReason: 'Pip builds it with Teodor checking the loops.' })
      .expect(200);
    const row = await t.db
      .selectFrom('bookings')
      .select(['level_override_reason', 'builder_id'])
      .where('id', '=', b.id)
      .executeTakeFirstOrThrow();
    expect(row).toEqual({ level_override_reason: 'Pip builds it with Teodor checking the loops.', builder_id: juniorId });
  });

  it('refuses bad acceptance input with 4xx in words', async () => {
    const b = await createBooking(t.db, { laborHours: '3.00' });
    const badDay = await master.post(`/api/bookings/${b.id}/accept`).send({ builderId: masterId, benchDate: '2026-02-30' });
    expect(badDay.status).toBe(400);
    expect(JSON.stringify(badDay.body.message)).toContain('Bench date must be a real calendar day');
    const past = await master.post(`/api/bookings/${b.id}/accept`).send({ builderId: masterId, benchDate: '2020-01-06' });
    expect(past.status).toBe(400);
    expect(past.body.message).toMatch(/in the past/);
    const saturday = await master.post(`/api/bookings/${b.id}/accept`).send({ builderId: masterId, benchDate: addDays(monday, 5) });
    expect(saturday.status).toBe(409);
    expect(saturday.body.message).toMatch(/no free bench time/);
    const unknown = await master
      .post(`/api/bookings/${b.id}/accept`)
      .send({ builderId: '00000000-0000-4000-8000-000000000000', benchDate: monday });
    expect(unknown.status).toBe(404);
    expect((await master.post('/api/bookings/not-a-uuid/accept').send({ builderId: masterId, benchDate: monday })).status).toBe(400);
    const unpaid = await createBooking(t.db, { laborHours: '3.00', state: 'requested' });
    const early = await master.post(`/api/bookings/${unpaid.id}/accept`).send({ builderId: masterId, benchDate: monday });
    expect(early.status).toBe(409);
    expect(early.body.message).toMatch(/only once its deposit is paid/);
    expect((await master.get(`/api/bench?from=${monday}&to=${addDays(monday, 200)}`)).status).toBe(400);
    expect((await master.get(`/api/bench?from=${addDays(monday, 2)}&to=${monday}`)).body.message).toMatch(
      /The last day shown must be on or after the first day shown/,
    );
  });

  it('moves a build along the allowed edges only, and delivers once the balance is settled', async () => {
    const b = await createBooking(t.db, { laborHours: '2.00', materialsTotal: '100.00', deposit: '50.00' });
    await master.post(`/api/bookings/${b.id}/accept`).send({ builderId: masterId, benchDate: monday }).expect(200);
    const skip = await master.post(`/api/bookings/${b.id}/state`).send({ to: 'on_bench' });
    expect(skip.status).toBe(409);
    expect(skip.body.message).toBe(
      `Booking ${b.reference} is scheduled and cannot move to on bench; from there it can move to pedals received.`,
    );
    expect((await master.post(`/api/bookings/${b.id}/state`).send({ to: 'pedals_received' })).body.message).toMatch(
      /Record the intake first/,
    );
    expect((await master.post(`/api/bookings/${b.id}/state`).send({ to: 'shipped' })).status).toBe(400);

    await master
      .post(`/api/bookings/${b.id}/intake`)
      .send({
        items: [
          { item: 'Fuzz', condition: 'working' },
          { item: 'Analog delay', condition: 'faulty', note: 'Crackles when the time knob turns' },
        ],
      })
      .expect(201);
    await master.post(`/api/bookings/${b.id}/state`).send({ to: 'pedals_received' }).expect(200);
    await master.post(`/api/bookings/${b.id}/state`).send({ to: 'on_bench' }).expect(200);

    await master.post(`/api/bookings/${b.id}/layout/request`).send({ note: 'Delay moved next to the tuner.' }).expect(200);
    expect((await master.post(`/api/bookings/${b.id}/state`).send({ to: 'testing' })).body.message).toMatch(
      /waiting for the player's layout approval/,
    );
    // Another player's booking is simply not there for them.
    expect((await cass.post(`/api/bookings/${b.id}/layout/approve`).send({})).status).toBe(404);
    await player.post(`/api/bookings/${b.id}/layout/approve`).send({}).expect(200);

    const extra = await owner
      .post(`/api/bookings/${b.id}/extras`)
      .send({ description: 'Extra buffer', amount: '35.00', reason: 'Long cable run to the amp' })
      .expect(201);
    expect((await master.post(`/api/bookings/${b.id}/extras`).send({ description: 'x', amount: '1.00', reason: 'because' })).status).toBe(
      403,
    );
    await player.post(`/api/bookings/${b.id}/extras/${extra.body.id}/decision`).send({ approve: true }).expect(200);
    expect((await player.post(`/api/bookings/${b.id}/extras/${extra.body.id}/decision`).send({ approve: false })).status).toBe(409);

    await master.post(`/api/bookings/${b.id}/time-entries`).send({ workedOn: '2026-11-30', hours: 1.75, note: 'Cables cut' }).expect(201);
    const hours = await master.get(`/api/bookings/${b.id}/time-entries`).expect(200);
    expect(hours.body).toMatchObject({ totalHours: 1.75, plannedHours: 2 });
    expect((await master.post(`/api/bookings/${b.id}/time-entries`).send({ workedOn: '2026-11-30', hours: 25 })).body.details).toEqual(
      expect.arrayContaining(['Hours can be at most 24 for one day']),
    );

    await master.post(`/api/bookings/${b.id}/state`).send({ to: 'testing' }).expect(200);
    await master.post(`/api/bookings/${b.id}/state`).send({ to: 'ready', note: 'Every path and preset tested.' }).expect(200);
    const balanceMail = await t.db
      .selectFrom('mail_outbox')
      .selectAll()
      .where('booking_id', '=', b.id)
      .where('template', '=', 'balance-requested')
      .executeTakeFirstOrThrow();
    // Hand-worked: $125.00 × 2 h + $100.00 materials = $350.00; + $35.00 approved extra − $50.00 deposit = $335.00.
    expect(balanceMail.data).toMatchObject({ firmTotal: '350.00', extras: '35.00', paidSoFar: '50.00', balanceDue: '335.00' });

    const early = await master.post(`/api/bookings/${b.id}/state`).send({ to: 'delivered' });
    expect(early.status).toBe(409);
    expect(early.body.message).toMatch(/still has a balance of \$335\.00 to pay/);
    expect((await master.post(`/api/bookings/${b.id}/waive-balance`).send({ reason: 'Paid cash' })).status).toBe(403);
    await owner.post(`/api/bookings/${b.id}/waive-balance`).send({ reason: 'Paid in cash at collection.' }).expect(200);
    await master.post(`/api/bookings/${b.id}/state`).send({ to: 'delivered' }).expect(200);
    expect((await master.post(`/api/bookings/${b.id}/state`).send({ to: 'ready' })).status).toBe(409);

    const statusMails = await t.db
      .selectFrom('mail_outbox')
      .select(['data'])
      .where('booking_id', '=', b.id)
      .where('template', '=', 'status-changed')
      .execute();
    expect(statusMails.map((m) => m.data.state)).toEqual(['pedals_received', 'ready', 'delivered']);
    expect(statusMails[0].data.faultyItems).toEqual([{ item: 'Analog delay', note: 'Crackles when the time knob turns' }]);
    const events = await t.db
      .selectFrom('booking_events')
      .select(['from_state', 'to_state', 'actor_label'])
      .where('booking_id', '=', b.id)
      .orderBy('id')
      .execute();
    // Written out, not read from bookingStates in shared/src/domain.ts: that list's order is what this
    // walk checks (a board is scheduled, its pedals arrive, it is built, tested, ready, delivered:
    // common practice, no published source).
    const moves = events.filter((e) => e.from_state !== e.to_state).map((e) => e.to_state);
    expect(moves).toEqual(['scheduled', 'pedals_received', 'on_bench', 'testing', 'ready', 'delivered']);
    expect(events.length).toBeGreaterThanOrEqual(13);
    expect(events.every((e) => e.actor_label.length > 0)).toBe(true);
  });

  it('declines a request; only the owner may decline a paid one', async () => {
    const unpaid = await createBooking(t.db, { laborHours: '2.00', state: 'requested' });
    const declined = await master
      .post(`/api/bookings/${unpaid.id}/decline`)
      .send({ reason: 'We do not wire this kind of rig.' })
      .expect(200);
    expect(declined.body).toMatchObject({ id: unpaid.id, state: 'declined', declineReason: 'We do not wire this kind of rig.' });
    const declineMail = await t.db.selectFrom('mail_outbox').selectAll().where('booking_id', '=', unpaid.id).executeTakeFirstOrThrow();
    expect(declineMail).toMatchObject({ template: 'booking-declined', to_address: 'player@mail.example' });
    expect(declineMail.data).toMatchObject({ reason: 'We do not wire this kind of rig.', depositRefunded: false });
    const row = await t.db.selectFrom('bookings').select(['state', 'decline_reason']).where('id', '=', unpaid.id).executeTakeFirstOrThrow();
    expect(row).toEqual({ state: 'declined', decline_reason: 'We do not wire this kind of rig.' });
    expect((await master.post(`/api/bookings/${unpaid.id}/decline`).send({ reason: 'again please' })).status).toBe(409);
    const paid = await createBooking(t.db, { laborHours: '2.00' });
    const byBuilder = await master.post(`/api/bookings/${paid.id}/decline`).send({ reason: 'No room this season.' });
    expect(byBuilder.status).toBe(403);
    // A deposit with no provider payment behind it cannot be refunded automatically: the decline is refused whole.
    const noProvider = await owner.post(`/api/bookings/${paid.id}/decline`).send({ reason: 'No room this season.' });
    expect(noProvider.status).toBe(409);
    expect(noProvider.body.message).toMatch(/no provider payment to refund/);
    expect((await t.db.selectFrom('bookings').select('state').where('id', '=', paid.id).executeTakeFirstOrThrow()).state).toBe(
      'deposit_paid',
    );
    expect((await t.db.selectFrom('booking_events').select('id').where('booking_id', '=', paid.id).execute()).length).toBe(0);
    expect((await owner.post(`/api/bookings/${paid.id}/decline`).send({})).body.details).toEqual(
      expect.arrayContaining(['Reason must say why, in at least a few words']),
    );
  });
});

describe('who may use the bench, team, settings and customers routes', () => {
  let t: TestApp;
  let agents: Record<'owner' | 'builder' | 'player', Agent>;
  let bookingId: string;
  let someBuilder: string;

  beforeAll(async () => {
    t = await createTestApp();
    const [o, b, p] = await Promise.all(['owner@shop.example', 'builder@shop.example', 'player@mail.example'].map((e) => signIn(t.app, e)));
    agents = { owner: o, builder: b, player: p };
    bookingId = (await createBooking(t.db, { laborHours: '2.00' })).id;
    someBuilder = await builderId(t.db, 'wren@shop.example');
  });
  afterAll(async () => t.close());

  const staffRoutes = (): Array<['get' | 'post' | 'patch' | 'delete', string, object?]> => [
    ['get', '/api/bench'],
    ['get', `/api/bench/suggest?bookingId=${bookingId}`],
    ['post', `/api/bookings/${bookingId}/accept`, { builderId: someBuilder, benchDate: '2030-01-07' }],
    ['post', `/api/bookings/${bookingId}/decline`, { reason: 'not for us' }],
    ['post', `/api/bookings/${bookingId}/state`, { to: 'pedals_received' }],
    ['post', `/api/bookings/${bookingId}/waive-balance`, { reason: 'cash' }],
    ['post', `/api/bookings/${bookingId}/time-entries`, { workedOn: '2026-11-30', hours: 1 }],
    ['get', `/api/bookings/${bookingId}/time-entries`],
    ['post', `/api/bookings/${bookingId}/intake`, { items: [{ item: 'Fuzz', condition: 'working' }] }],
    ['get', `/api/bookings/${bookingId}/intake`],
    ['post', `/api/bookings/${bookingId}/extras`, { description: 'Buffer', amount: '10.00', reason: 'long run' }],
    ['post', `/api/bookings/${bookingId}/layout/request`, {}],
    ['get', '/api/team'],
    ['patch', `/api/team/${someBuilder}`, { hourlyRate: '99.00' }],
    ['get', '/api/settings'],
    ['patch', '/api/settings', { tagline: 'x' }],
    ['get', '/api/settings/closures'],
    ['post', '/api/settings/closures', { startsOn: '2030-01-01', endsOn: '2030-01-02', reason: 'stocktake' }],
    ['delete', '/api/settings/closures/00000000-0000-4000-8000-000000000000'],
    ['get', '/api/customers'],
    ['get', '/api/customers/00000000-0000-4000-8000-000000000000'],
  ];

  it('answers a customer 403 on every staff route, and 401 without a session', async () => {
    for (const [method, url, body] of staffRoutes()) {
      const res = await agents.player[method](url).send(body ?? {});
      expect(res.status, `${method} ${url}`).toBe(403);
      const anonymous = t.http();
      const anon = await anonymous[method](url).send(body ?? {});
      expect(anon.status, `anonymous ${method} ${url}`).toBe(401);
    }
  });

  it('keeps the team, settings, closures, extras and waivers to the owner', async () => {
    const ownerOnly = staffRoutes().filter(
      ([method, url]) => /waive-balance|\/extras|\/api\/team\/|\/api\/settings/.test(url) && !(method === 'get' && url === '/api/settings'),
    );
    expect(ownerOnly).toHaveLength(7);
    for (const [method, url, body] of ownerOnly) {
      const res = await agents.builder[method](url).send(body ?? {});
      expect(res.status, `builder ${method} ${url}`).toBe(403);
    }
    await agents.builder.get('/api/team').expect(200);
    await agents.builder.get('/api/settings').expect(200);
    expect((await agents.builder.patch('/api/settings').send({ tagline: 'x' })).status).toBe(403);
    expect((await agents.builder.patch(`/api/team/${someBuilder}`).send({ hourlyRate: '999.00' })).status).toBe(403);
  });

  it('lets the owner edit the team, the shop and its closures, naming a bad field', async () => {
    const res = await agents.owner
      .patch(`/api/team/${someBuilder}`)
      .send({ hourlyRate: '95.50', weeklyHours: { '1': 8, '3': 4.5 } })
      .expect(200);
    expect(res.body).toMatchObject({ hourlyRate: '95.50', weeklyHours: { '1': 8, '3': 4.5 }, weeklyCapacityHours: 12.5 });
    expect(JSON.stringify((await agents.owner.patch(`/api/team/${someBuilder}`).send({ weeklyHours: { '8': 3 } })).body.message)).toMatch(
      /days are numbered 1 \(Monday\) to 7 \(Sunday\)/,
    );
    expect(JSON.stringify((await agents.owner.patch(`/api/team/${someBuilder}`).send({ weeklyHours: { '2': 30 } })).body.message)).toMatch(
      /Tuesday must be a number of hours from 0 to 24/,
    );
    expect(JSON.stringify((await agents.owner.patch(`/api/team/${someBuilder}`).send({ level: 'wizard' })).body.message)).toContain(
      'Level must be one of',
    );

    expect(JSON.stringify((await agents.owner.patch('/api/settings').send({ countryCode: 'QQ' }).expect(400)).body.message)).toMatch(
      /Country must be a country from the list/,
    );
    expect(JSON.stringify((await agents.owner.patch('/api/settings').send({ timezone: 'Mars/Olympus' })).body.message)).toMatch(
      /Time zone must be a place name from the time zone list, like America\/Chicago/,
    );
    const gb = await agents.owner.patch('/api/settings').send({ countryCode: 'gb', timezone: 'Europe/London' }).expect(200);
    expect(gb.body).toMatchObject({ countryCode: 'GB', timezone: 'Europe/London' });
    // date-holidays (code ISC, data CC-BY-3.0): Christmas Day is a public holiday in Great Britain.
    expect(gb.body.upcomingHolidays.map((h: { name: string }) => h.name)).toContain('Christmas Day');
    // The locale is a BCP 47 tag (canonical case per BCP 47 §2.1.1: language lower, region upper).
    expect((await agents.owner.patch('/api/settings').send({ locale: 'de-de' }).expect(200)).body.locale).toBe('de-DE');
    expect((await t.http().get('/api/shop').expect(200)).body).toMatchObject({ locale: 'de-DE', timezone: 'Europe/London' });
    expect(JSON.stringify((await agents.owner.patch('/api/settings').send({ locale: 'not a locale' }).expect(400)).body.message)).toMatch(
      /Locale must be a language and region, like en-US/,
    );
    await agents.owner.patch('/api/settings').send({ locale: 'en-US' }).expect(200);

    const closure = await agents.owner
      .post('/api/settings/closures')
      .send({ startsOn: '2030-01-02', endsOn: '2030-01-03', reason: 'Stocktake' })
      .expect(201);
    expect(closure.body).toMatchObject({ startsOn: '2030-01-02', endsOn: '2030-01-03', buildsOnBenchThen: [] });
    expect(
      JSON.stringify(
        (await agents.owner.post('/api/settings/closures').send({ startsOn: '2030-01-05', endsOn: '2030-01-04', reason: 'Backwards' })).body
          .message,
      ),
    ).toMatch(/Last day must be on or after the first day/);
    const bench = await agents.owner.get(`/api/bench?from=2030-01-02&to=2030-01-02&builderId=${someBuilder}`).expect(200);
    expect(bench.body.builders[0].days[0]).toMatchObject({ capacityHours: 0, off: { kind: 'closure', label: 'Shop closed: Stocktake' } });
    await agents.owner.delete(`/api/settings/closures/${closure.body.id}`).set('Content-Type', 'application/json').expect(204);
    expect((await agents.owner.delete(`/api/settings/closures/${closure.body.id}`).set('Content-Type', 'application/json')).status).toBe(
      404,
    );
  });

  it('pages, sorts and searches customers on the server, with their builds, payments and messages', async () => {
    const list = await agents.owner.get('/api/customers?sort=buildCount&order=desc&pageSize=1').expect(200);
    expect(list.body).toMatchObject({ total: 2, page: 1, pageSize: 1 });
    expect(list.body.items[0]).toMatchObject({ email: 'player@mail.example', buildCount: 1, activeBuildCount: 1 });
    const search = await agents.owner.get('/api/customers?search=imbert').expect(200);
    expect(search.body.items.map((c: { name: string }) => c.name)).toEqual(['Cass Imbert']);
    expect((await agents.owner.get('/api/customers?search=%25')).body.total).toBe(0);
    expect(JSON.stringify((await agents.owner.get('/api/customers?pageSize=1000')).body.message)).toContain(
      'Rows per page can be at most 100',
    );
    const detail = await agents.owner.get(`/api/customers/${list.body.items[0].id}`).expect(200);
    expect(detail.body.builds).toHaveLength(1);
    expect(detail.body.payments[0]).toMatchObject({ kind: 'deposit', amount: '150.00', status: 'paid' });
    expect(Array.isArray(detail.body.messages)).toBe(true);
    // A builder lists the same customers but sees no address on a customer none of whose builds is theirs.
    const asBuilder = await agents.builder.get('/api/customers?sort=buildCount&order=desc&pageSize=1').expect(200);
    expect(asBuilder.body.items[0]).toMatchObject({ id: list.body.items[0].id, email: null, phone: null, buildCount: 1 });
  });

  it('pages customers in the order one grouped SQL query gives, for every sort and direction', async () => {
    // Reference: PostgreSQL's own ORDER BY … NULLS LAST over every customer grouped with all their
    // bookings (the list's earlier one-query form); the list now finds a page's ids first.
    await createBooking(t.db, { laborHours: '10.00', materialsTotal: '300.00', deposit: '150.00' });
    const keys = {
      name: 'u.name',
      email: 'u.email::text',
      createdAt: 'u.created_at',
      buildCount: 'count(b.id)',
      lastBookingAt: 'max(b.created_at)',
    } as const;
    for (const [sort, key] of Object.entries(keys)) {
      for (const order of ['asc', 'desc'] as const) {
        const expected = await sql<{ id: string }>`
          select u.id from users u left join bookings b on b.customer_id = u.id where u.role = 'customer'
          group by u.id order by ${sql.raw(key)} ${sql.raw(order)} nulls last, u.id`.execute(t.db);
        const seen: string[] = [];
        for (let page = 1; page <= expected.rows.length + 1; page++) {
          const res = await agents.owner.get(`/api/customers?sort=${sort}&order=${order}&pageSize=1&page=${page}`).expect(200);
          expect(res.body.total).toBe(expected.rows.length);
          seen.push(...res.body.items.map((c: { id: string }) => c.id));
        }
        expect({ sort, order, seen }).toEqual({ sort, order, seen: expected.rows.map((r) => r.id) });
      }
    }
  });
});
