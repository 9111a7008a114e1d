import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import type { BookingDetail, ExtraView, IntakeItemView, TimeEntriesResponse } from '@loomwright/shared';
import { clearBench, createBooking, openBenchShop, type Agent } from './support/bench-fixtures';
import type { TestApp } from './support/test-app';

/**
 * Approvals (by the player, and recorded by staff), note privacy, money facts, and corrections
 * to intake and hours. Amounts are worked by hand beside each check.
 */
describe('approvals, notes, money facts and corrections', () => {
  let t: TestApp, masterId: string, monday: string;
  let owner: Agent, master: Agent, junior: Agent, player: Agent, cass: Agent;
  beforeAll(async () => ({ t, owner, master, junior, player, cass, masterId, monday } = await openBenchShop()));
  afterAll(async () => t.close());
  beforeEach(async () => clearBench(t.db));

  /**
   * A build on the bench: $125.00/h × 2 h + $100.00 materials = $350.00 firm; $50.00 deposit paid.
   * Accepted by the master, its intake recorded, then moved to pedals_received and on_bench with
   * the given extras on each move (a note, tellPlayer).
   */
  async function onBench(
    items: Array<{ item: string; condition: string; note?: string }> = [
      { item: 'Fuzz', condition: 'working' },
      { item: 'Analog delay', condition: 'working' },
      { item: 'Power supply', condition: 'working' },
    ],
    received: object = {},
    bench: object = {},
  ) {
    const b = await createBooking(t.db, { laborHours: '2.00', materialsTotal: '100.00', deposit: '50.00' });
    await master.post(`/api/bookings/${b.id}/accept`).send({ builderId: masterId, benchDate: monday }).expect(200);
    await master.post(`/api/bookings/${b.id}/intake`).send({ items }).expect(201);
    await master
      .post(`/api/bookings/${b.id}/state`)
      .send({ to: 'pedals_received', ...received })
      .expect(200);
    await master
      .post(`/api/bookings/${b.id}/state`)
      .send({ to: 'on_bench', ...bench })
      .expect(200);
    return b;
  }

  /** The owner proposes an extra on the build. */
  const proposeExtra = async (id: string, extra: { description: string; amount: string; reason: string }) =>
    (await owner.post(`/api/bookings/${id}/extras`).send(extra).expect(201)).body as ExtraView;
  const detailOf = async (agent: Agent, id: string) => (await agent.get(`/api/bookings/${id}`).expect(200)).body as BookingDetail;
  const mails = (bookingId: string, template: string) =>
    t.db
      .selectFrom('mail_outbox')
      .selectAll()
      .where('booking_id', '=', bookingId)
      .where('template', '=', template)
      .orderBy('created_at')
      .execute();

  it('an extra reaches the player by e-mail with its price; the player approves it in the app; only approved extras are owed', async () => {
    const b = await onBench();
    const cable = await proposeExtra(b.id, {
      description: 'Deeper road case',
      amount: '45.00',
      reason: 'The wah does not fit the quoted case.',
    });
    const buffer = await proposeExtra(b.id, { description: 'Input buffer', amount: '60.00', reason: 'Long cable run.' });

    const asked = await mails(b.id, 'approval-requested');
    expect(asked.map((m) => m.data)).toEqual([
      expect.objectContaining({
        kind: 'extra',
        description: 'Deeper road case',
        amount: '45.00',
        currency: 'USD',
        reason: 'The wah does not fit the quoted case.',
      }),
      expect.objectContaining({ kind: 'extra', description: 'Input buffer', amount: '60.00' }),
    ]);
    expect(asked[0].to_address).toBe('player@mail.example');

    // Proposed extras are not owed: $350.00 − $50.00 = $300.00 (hand-worked).
    let seen = await detailOf(player, b.id);
    expect(seen.money).toMatchObject({ firmTotal: '350.00', approvedExtras: '0.00', proposedExtras: '105.00', balanceDue: '300.00' });

    // Another player cannot answer; the player approves one with a comment and declines the other.
    expect((await cass.post(`/api/bookings/${b.id}/extras/${cable.id}/decision`).send({ approve: true })).status).toBe(404);
    const approved = await player
      .post(`/api/bookings/${b.id}/extras/${cable.id}/decision`)
      .send({ approve: true, comment: 'Yes, go ahead.' })
      .expect(200);
    expect(approved.body).toMatchObject({
      status: 'approved',
      decision: { approved: true, via: 'app', givenBy: 'Rowan Achterberg', recordedBy: null, comment: 'Yes, go ahead.' },
    });
    await player.post(`/api/bookings/${b.id}/extras/${buffer.id}/decision`).send({ approve: false }).expect(200);
    const again = await player.post(`/api/bookings/${b.id}/extras/${cable.id}/decision`).send({ approve: false });
    expect(again.status).toBe(409);
    expect(again.body.message).toMatch(/already approved/);

    // $350.00 + $45.00 approved − $50.00 deposit = $345.00; the declined $60.00 is not owed (hand-worked).
    seen = await detailOf(player, b.id);
    expect(seen.money).toMatchObject({ approvedExtras: '45.00', proposedExtras: '0.00', totalOwed: '395.00', balanceDue: '345.00' });
    expect(seen.balanceDue).toBe('345.00');
    expect((await detailOf(owner, b.id)).money.balanceDue).toBe('345.00');
    const lines = seen.events.map((e) => e.note);
    expect(lines).toEqual(
      expect.arrayContaining([
        expect.stringMatching(/^Extra approved by Rowan Achterberg \(in the app\): Deeper road case, 45.00\. Comment: Yes, go ahead\.$/),
      ]),
    );
  });

  it('staff record an approval given by phone, with who gave it and how; bad input gets 400 in words', async () => {
    const b = await onBench();
    const extra = await proposeExtra(b.id, { description: 'Deeper road case', amount: '45.00', reason: 'The wah does not fit.' });
    const bad = await master.post(`/api/bookings/${b.id}/extras/${extra.id}/recorded-decision`).send({ approve: true, via: 'pigeon' });
    expect(bad.status).toBe(400);
    expect(bad.body.details).toEqual(
      expect.arrayContaining(['How the answer came must be one of: "phone", "in_person" or "email"', 'Say who gave the answer']),
    );
    expect(
      (
        await player
          .post(`/api/bookings/${b.id}/extras/${extra.id}/recorded-decision`)
          .send({ approve: true, via: 'phone', givenBy: 'Rowan' })
      ).status,
    ).toBe(403);

    const recorded = await master
      .post(`/api/bookings/${b.id}/extras/${extra.id}/recorded-decision`)
      .send({ approve: true, via: 'phone', givenBy: 'Rowan Achterberg', comment: 'Called at 10:15, happy with the price.' })
      .expect(200);
    expect(recorded.body.decision).toMatchObject({
      approved: true,
      via: 'phone',
      givenBy: 'Rowan Achterberg',
      recordedBy: 'Teodor Lind',
      comment: 'Called at 10:15, happy with the price.',
    });
    const row = await t.db.selectFrom('booking_extras').selectAll().where('id', '=', extra.id).executeTakeFirstOrThrow();
    expect(row).toMatchObject({ status: 'approved', decided_via: 'phone', decided_by_name: 'Rowan Achterberg' });
    const history = (await detailOf(player, b.id)).events.map((e) => e.note);
    expect(history).toContain(
      'Extra approved by Rowan Achterberg (by phone, recorded by Teodor Lind): Deeper road case, 45.00. Comment: Called at 10:15, happy with the price.',
    );
    expect((await detailOf(player, b.id)).money.balanceDue).toBe('345.00');
  });

  it('a layout goes to the player by e-mail; testing waits; the player declines with a comment, then approves the next one; staff can record one given in person', async () => {
    const b = await onBench();
    await master.post(`/api/bookings/${b.id}/layout/request`).send({ message: 'Delay moved next to the tuner.' }).expect(200);
    expect((await master.post(`/api/bookings/${b.id}/layout/request`).send({})).status).toBe(409);
    const [asked] = await mails(b.id, 'approval-requested');
    expect(asked.data).toMatchObject({ kind: 'layout', message: 'Delay moved next to the tuner.' });
    let seen = await detailOf(player, b.id);
    expect(seen.awaitingLayoutApproval).toBe(true);
    expect(seen.layoutApprovals).toEqual([
      expect.objectContaining({ status: 'waiting', message: 'Delay moved next to the tuner.', requestedBy: 'Teodor Lind', decision: null }),
    ]);
    expect((await master.post(`/api/bookings/${b.id}/state`).send({ to: 'testing' })).status).toBe(409);

    await player
      .post(`/api/bookings/${b.id}/layout/decision`)
      .send({ approve: false, comment: 'Tuner first in the chain, please.' })
      .expect(200);
    seen = await detailOf(player, b.id);
    expect(seen.awaitingLayoutApproval).toBe(false);
    expect(seen.layoutApprovals[0]).toMatchObject({
      status: 'declined',
      decision: { approved: false, via: 'app', comment: 'Tuner first in the chain, please.' },
    });
    expect((await player.post(`/api/bookings/${b.id}/layout/decision`).send({ approve: true })).status).toBe(409);

    await master.post(`/api/bookings/${b.id}/layout/request`).send({ message: 'Tuner first now.' }).expect(200);
    await owner
      .post(`/api/bookings/${b.id}/layout/recorded-decision`)
      .send({ approve: true, via: 'in_person', givenBy: 'Rowan Achterberg' })
      .expect(200);
    seen = await detailOf(player, b.id);
    expect(seen.layoutApprovals.map((l) => [l.status, l.decision?.via, l.decision?.recordedBy])).toEqual([
      ['declined', 'app', null],
      ['approved', 'in_person', 'Odile Varga'],
    ]);
    await master.post(`/api/bookings/${b.id}/state`).send({ to: 'testing' }).expect(200);
  });

  it('keeps staff notes, hours and intake remarks out of the player’s answer and mail, unless the writer tells the player', async () => {
    const b = await onBench(
      [
        { item: 'Fuzz', condition: 'working', note: 'INTAKE-SECRET scuffed corner' },
        { item: 'Analog delay', condition: 'faulty', note: 'Crackles on the time knob' },
      ],
      { note: 'STATE-SECRET parcel was damp' },
      { note: 'Starting today.', tellPlayer: true },
    );
    await master
      .post(`/api/bookings/${b.id}/time-entries`)
      .send({ workedOn: '2026-11-30', hours: 1.5, note: 'HOURS-SECRET slow going' })
      .expect(201);
    await master.post(`/api/bookings/${b.id}/notes`).send({ note: 'NOTE-SECRET player sounded unsure' }).expect(201);
    await master.post(`/api/bookings/${b.id}/notes`).send({ note: 'Your supply has a spare 18 V output.', tellPlayer: true }).expect(201);
    const missing = await master.post(`/api/bookings/${b.id}/state`).send({ to: 'testing', tellPlayer: true });
    expect(missing.status).toBe(400);
    expect(missing.body.details).toEqual(['Write the words the player should read, or leave “tell the player” off']);

    const playerAnswer = JSON.stringify((await player.get(`/api/bookings/${b.id}`).expect(200)).body);
    for (const secret of ['INTAKE-SECRET', 'STATE-SECRET', 'HOURS-SECRET', 'NOTE-SECRET', 'Recorded 1.5 hr'])
      expect(playerAnswer).not.toContain(secret);
    expect(playerAnswer).toContain('Starting today.');
    expect(playerAnswer).toContain('Your supply has a spare 18 V output.');
    const playerEvents = ((await player.get(`/api/bookings/${b.id}`)).body as BookingDetail).events;
    expect(playerEvents.every((e) => e.visibility === 'player')).toBe(true);
    // The moves themselves still show: the player sees their board reach the bench.
    expect(playerEvents.map((e) => e.toState)).toEqual(expect.arrayContaining(['pedals_received', 'on_bench']));

    const staffAnswer = JSON.stringify((await owner.get(`/api/bookings/${b.id}`).expect(200)).body);
    for (const secret of ['INTAKE-SECRET', 'STATE-SECRET', 'HOURS-SECRET', 'NOTE-SECRET']) expect(staffAnswer).toContain(secret);

    const outbox = await t.db
      .selectFrom('mail_outbox')
      .select(['template', 'data'])
      .where('to_address', '=', 'player@mail.example')
      .execute();
    const mailed = JSON.stringify(outbox);
    for (const secret of ['INTAKE-SECRET', 'STATE-SECRET', 'HOURS-SECRET', 'NOTE-SECRET']) expect(mailed).not.toContain(secret);
    expect(outbox.find((m) => m.template === 'shop-note')?.data).toMatchObject({ note: 'Your supply has a spare 18 V output.' });
    const received = outbox.find((m) => m.template === 'status-changed' && m.data.state === 'pedals_received');
    expect(received?.data).toMatchObject({ note: '', faultyItems: [{ item: 'Analog delay', note: 'Crackles on the time knob' }] });
  });

  it('records intake once per item in signal-chain order; a second recording corrects instead of duplicating; faulty needs a note', async () => {
    const b = await createBooking(t.db, { laborHours: '2.00' });
    await master.post(`/api/bookings/${b.id}/accept`).send({ builderId: masterId, benchDate: monday }).expect(200);
    const noNote = await master.post(`/api/bookings/${b.id}/intake`).send({ items: [{ item: 'Fuzz', condition: 'faulty' }] });
    expect(noNote.status).toBe(400);
    expect(noNote.body.details).toEqual(['Item 1: Note must say what is wrong with a faulty item']);

    // Recorded out of order: the rig lists Fuzz, then Analog delay; the supply comes after the chain.
    const items = [
      { item: 'Power supply', condition: 'working' },
      { item: 'Analog delay', condition: 'working' },
      { item: 'Fuzz', condition: 'working' },
    ];
    await master.post(`/api/bookings/${b.id}/intake`).send({ items }).expect(201);
    const twice = (await master.post(`/api/bookings/${b.id}/intake`).send({ items }).expect(201)).body as IntakeItemView[];
    expect(twice.map((i) => [i.key, i.item])).toEqual([
      ['chain:0', 'Fuzz'],
      ['chain:1', 'Analog delay'],
      ['supply', 'Power supply'],
    ]);
    expect(await t.db.selectFrom('intake_items').select('id').where('booking_id', '=', b.id).execute()).toHaveLength(3);

    const fixed = (
      await master
        .post(`/api/bookings/${b.id}/intake`)
        .send({
          items: [
            { item: 'analog delay', condition: 'faulty', note: 'Crackles on the time knob' },
            { item: 'Spare patch cable', condition: 'working' },
          ],
        })
        .expect(201)
    ).body as IntakeItemView[];
    expect(fixed.map((i) => [i.item, i.condition])).toEqual([
      ['Fuzz', 'working'],
      ['analog delay', 'faulty'],
      ['Power supply', 'working'],
      ['Spare patch cable', 'working'],
    ]);
    const fuzz = fixed[0];
    const edited = (
      await master
        .patch(`/api/bookings/${b.id}/intake/${fuzz.id}`)
        .send({ item: 'Fuzz', condition: 'faulty', note: 'Input jack loose' })
        .expect(200)
    ).body as IntakeItemView[];
    expect(edited[0]).toMatchObject({ item: 'Fuzz', condition: 'faulty', note: 'Input jack loose' });
    expect(edited[0].updatedAt).not.toBeNull();
    expect((await master.patch(`/api/bookings/${b.id}/intake/${fuzz.id}`).send({ item: 'Fuzz', condition: 'faulty' })).status).toBe(400);

    const notes = (
      await t.db.selectFrom('booking_events').select(['note', 'visibility']).where('booking_id', '=', b.id).orderBy('id').execute()
    ).filter((e) => e.note.startsWith('Intake'));
    expect(notes.map((n) => n.note)).toEqual([
      'Intake: Power supply (working); Analog delay (working); Fuzz (working).',
      'Intake: Spare patch cable (working).',
      'Intake corrected: analog delay: working → faulty (note: Crackles on the time knob).',
      'Intake corrected: Fuzz working → faulty (note: Input jack loose).',
    ]);
    expect(notes.every((n) => n.visibility === 'internal')).toBe(true);
  });

  it('hour entries take 2.3 h, and can be corrected or deleted by their author or the owner, with history', async () => {
    const b = await onBench();
    const added = (
      await master.post(`/api/bookings/${b.id}/time-entries`).send({ workedOn: '2026-11-30', hours: 2.3, note: 'Cables cut' }).expect(201)
    ).body as TimeEntriesResponse;
    expect(added.totalHours).toBe(2.3);
    const entry = added.entries[0];
    expect(entry.recordedBy).toMatchObject({ name: 'Teodor Lind' });
    expect((await master.post(`/api/bookings/${b.id}/time-entries`).send({ workedOn: '2026-11-30', hours: 2.345 })).body.details).toEqual([
      'Hours takes at most two decimals, like 1.25',
    ]);

    // A colleague may not correct another's hours; the author and the owner may.
    const byOther = await junior.patch(`/api/bookings/${b.id}/time-entries/${entry.id}`).send({ hours: 1 });
    expect(byOther.status).toBe(403);
    expect(byOther.body.message).toMatch(/Only the person who recorded these hours, or the owner/);
    const corrected = (await master.patch(`/api/bookings/${b.id}/time-entries/${entry.id}`).send({ hours: 2.25 }).expect(200))
      .body as TimeEntriesResponse;
    expect(corrected.entries[0]).toMatchObject({ hours: 2.25, workedOn: '2026-11-30' });
    expect(corrected.entries[0].updatedAt).not.toBeNull();
    expect((await master.patch(`/api/bookings/${b.id}/time-entries/${entry.id}`).send({})).body.details).toEqual([
      'Say what to change: the day worked, the hours or the note',
    ]);
    await owner.patch(`/api/bookings/${b.id}/time-entries/${entry.id}`).send({ note: 'Cables cut and labelled' }).expect(200);
    expect((await junior.delete(`/api/bookings/${b.id}/time-entries/${entry.id}`).set('Content-Type', 'application/json')).status).toBe(
      403,
    );
    const gone = (await owner.delete(`/api/bookings/${b.id}/time-entries/${entry.id}`).set('Content-Type', 'application/json').expect(200))
      .body as TimeEntriesResponse;
    expect(gone.entries).toEqual([]);
    expect((await owner.delete(`/api/bookings/${b.id}/time-entries/${entry.id}`).set('Content-Type', 'application/json')).status).toBe(404);

    const history = (await t.db.selectFrom('booking_events').select('note').where('booking_id', '=', b.id).orderBy('id').execute()).map(
      (e) => e.note,
    );
    expect(history).toEqual(
      expect.arrayContaining([
        // In the shop's voice (en-US): days and hours as ECMA-402 Intl writes them with CLDR en data
        // (weekday, month abbreviation, "hr" as the short unit of hour), never ISO dates.
        'Hours corrected: 2.3 hr on Mon, Nov 30, 2026 → 2.25 hr on Mon, Nov 30, 2026.',
        'Hours corrected: 2.25 hr on Mon, Nov 30, 2026 → 2.25 hr on Mon, Nov 30, 2026 (note: Cables cut and labelled).',
        'Hours deleted: 2.25 hr on Mon, Nov 30, 2026 (Cables cut and labelled).',
      ]),
    );
  });

  it('while a balance is due: ready waits for open extras, delivery waits for the money; a balance taken at the counter settles it once', async () => {
    const b = await onBench();
    const extra = await proposeExtra(b.id, { description: 'Deeper road case', amount: '45.00', reason: 'Fit.' });
    await master.post(`/api/bookings/${b.id}/state`).send({ to: 'testing' }).expect(200);
    const early = await master.post(`/api/bookings/${b.id}/state`).send({ to: 'ready' });
    expect(early.status).toBe(409);
    expect(early.body.message).toMatch(/Deeper road case still waits for the player's answer/);
    await player.post(`/api/bookings/${b.id}/extras/${extra.id}/decision`).send({ approve: true }).expect(200);
    await master.post(`/api/bookings/${b.id}/state`).send({ to: 'ready' }).expect(200);

    // $350.00 + $45.00 − $50.00 = $345.00 (hand-worked).
    const [asked] = await mails(b.id, 'balance-requested');
    expect(asked.data).toMatchObject({ firmTotal: '350.00', extras: '45.00', paidSoFar: '50.00', balanceDue: '345.00', currency: 'USD' });
    const deliver = await master.post(`/api/bookings/${b.id}/state`).send({ to: 'delivered' });
    expect(deliver.status).toBe(409);
    expect(deliver.body.message).toMatch(/still has a balance of \$345\.00 to pay; request or record the balance first/);

    await master.post(`/api/bookings/${b.id}/balance/request`).send({}).expect(200);
    await master.post(`/api/bookings/${b.id}/balance/request`).send({}).expect(200);
    // Two clicks in one minute: one reminder.
    expect(await mails(b.id, 'balance-requested')).toHaveLength(2);

    expect((await master.post(`/api/bookings/${b.id}/balance/record`).send({ amount: '345.00', method: 'cash' })).status).toBe(403);
    const wrong = await owner.post(`/api/bookings/${b.id}/balance/record`).send({ amount: '300.00', method: 'cash' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.message).toMatch(/the balance due on .* is \$345\.00; record the whole amount/);
    const recorded = (
      await owner
        .post(`/api/bookings/${b.id}/balance/record`)
        .send({ amount: '345.00', method: 'card_terminal', note: 'At collection' })
        .expect(200)
    ).body as BookingDetail;
    expect(recorded.money).toMatchObject({ netPaid: '395.00', balanceDue: '0.00', settled: true });
    const twice = await owner.post(`/api/bookings/${b.id}/balance/record`).send({ amount: '345.00', method: 'card_terminal' });
    expect(twice.status).toBe(409);
    const paid = await t.db.selectFrom('payments').selectAll().where('booking_id', '=', b.id).where('kind', '=', 'balance').execute();
    expect(paid.map((p) => [p.status, p.amount, p.method])).toEqual([['paid', '345.00', 'card_terminal']]);

    // The player's page and the shop's read the same facts.
    expect((await detailOf(player, b.id)).money).toEqual((await detailOf(owner, b.id)).money);
    await master.post(`/api/bookings/${b.id}/state`).send({ to: 'delivered' }).expect(200);
  });

  it('the firm quote the player reads lists labor at the firm rate, and its lines add up to its total', async () => {
    // A real estimate from the API's own engine, then accepted at the master's $125.00/h.
    const config = {
      surfaceId: 'slate-61',
      caseId: 'shell-hard',
      routing: { mode: 'switcher' },
      pedals: [
        { name: 'Tuner', kind: 'tuner', powered: true, inLoop: false },
        { name: 'Fuzz', kind: 'compact', powered: true, inLoop: true },
        { name: 'Chorus', kind: 'compact', powered: true, inLoop: true },
        { name: 'Analog delay', kind: 'compact', powered: true, inLoop: true },
      ],
      functions: [],
      level: 'master',
    };
    const created = (await player.post('/api/bookings').send({ configuration: config }).expect(201)).body as BookingDetail;
    await t.db
      .insertInto('payments')
      .values({
        booking_id: created.id,
        kind: 'deposit',
        amount: created.deposit,
        amount_minor: 1,
        currency: 'USD',
        status: 'paid',
        paid_at: new Date(),
      })
      .execute();
    await t.db.updateTable('bookings').set({ state: 'deposit_paid' }).where('id', '=', created.id).execute();
    await master.post(`/api/bookings/${created.id}/accept`).send({ builderId: masterId, benchDate: monday }).expect(200);
    const firm = (await detailOf(player, created.id)).firmQuote!;
    const cents = (s: string) => Math.round(Number(s) * 100);
    const labor = firm.lines.filter((l) => l.kind === 'labor');
    expect(labor.length).toBeGreaterThan(0);
    expect(labor.every((l) => l.unitPrice === '125.00')).toBe(true);
    expect(labor.reduce((s, l) => s + cents(l.amount), 0)).toBe(cents(firm.laborTotal!));
    expect(firm.lines.reduce((s, l) => s + cents(l.amount), 0)).toBe(cents(firm.total!));
  });
});
