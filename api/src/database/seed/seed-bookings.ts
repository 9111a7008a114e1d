import { estimateRig, intakeChecklist, type BookingState, type PriceBook, type RigConfiguration } from '@loomwright/shared';
import Decimal from 'decimal.js';
import type { Kysely } from 'kysely';
import { addDays, todayIn } from '../../bench/calendar-days';
import { publicHolidaysBetween } from '../../bench/public-holidays';
import { earliestBenchDateFor, earliestStart, dayCapacity, toCentihours, type BenchCalendar, type HourSlice } from '../../bench/scheduling';
import { firmQuoteFigures } from '../../builds/firm-quote';
import { formatDay } from '../../mail/templates/format';
import type { DB } from '../database';

/**
 * A handful of invented bookings in several states so the backoffice has a queue to show.
 * Idempotent: each booking has a fixed reference below the live sequence (which starts at 1001);
 * a reference already present is left exactly as it is.
 */
const pedal = (name: string, kind: NonNullable<RigConfiguration['pedals']>[number]['kind'], inLoop = false, currentMa = 20) => ({
  name,
  kind,
  powered: true,
  inLoop,
  currentMa,
  voltage: 9,
});

const demoBookings: Array<{
  reference: string;
  customer: string;
  state: BookingState;
  builder?: string;
  /** Days from today the bench search starts (negative: a build already under way). */
  startOffset?: number;
  /** For a request with no bench date yet: how many days ago it was sent. */
  ageDays?: number;
  notes: string;
  configuration: RigConfiguration;
}> = [
  {
    reference: 'LW-0901',
    ageDays: 3,
    customer: 'player@mail.example',
    state: 'requested',
    notes: 'Small fly rig for club gigs.',
    configuration: {
      surfaceId: 'slate-46',
      caseId: 'shell-hard',
      routing: { mode: 'serial' },
      pedalCount: 5,
      functions: [],
      level: 'apprentice',
    },
  },
  {
    reference: 'LW-0902',
    ageDays: 2,
    customer: 'cass@mail.example',
    state: 'deposit_paid',
    notes: 'Touring rig; the reverb must stay on its own isolated output.',
    configuration: {
      surfaceId: 'ridge-81',
      caseId: 'tour-road',
      routing: { mode: 'switcher' },
      pedals: [
        pedal('Chromatic tuner', 'tuner', false, 60),
        pedal('Octave fuzz', 'compact', true),
        pedal('Blue overdrive', 'compact', true),
        pedal('Analog chorus', 'compact', true),
        pedal('Tape-style delay', 'large_digital', true, 300),
        pedal('Hall reverb', 'large_digital', true, 300),
        pedal('Eight-loop switcher', 'switcher', false, 250),
      ],
      functions: ['stereo_output'],
      level: 'journeyman',
    },
  },
  {
    reference: 'LW-0903',
    ageDays: 1,
    customer: 'player@mail.example',
    state: 'deposit_paid',
    notes: '',
    configuration: {
      surfaceId: 'slate-61',
      caseId: 'shell-hard',
      routing: { mode: 'serial' },
      pedals: [
        pedal('Chromatic tuner', 'tuner', false, 60),
        pedal('Compressor', 'compact'),
        pedal('Treble booster', 'mini'),
        pedal('Analog delay', 'compact', false, 40),
      ],
      functions: [],
      level: 'apprentice',
    },
  },
  {
    reference: 'LW-0904',
    customer: 'cass@mail.example',
    state: 'scheduled',
    builder: 'builder@shop.example',
    notes: 'Please keep the wah at the far left.',
    configuration: {
      surfaceId: 'ridge-100',
      caseId: 'tour-road',
      routing: { mode: 'switcher' },
      pedals: [
        pedal('Wah treadle', 'treadle', true, 10),
        pedal('Germanium fuzz', 'compact', true),
        pedal('Plexi-style drive', 'large', true),
        pedal('Phaser', 'compact', true),
        pedal('Dual delay', 'large_digital', true, 400),
        pedal('Shimmer reverb', 'large_digital', true, 350),
        pedal('Ten-loop switcher', 'switcher', false, 300),
      ],
      functions: ['four_cable', 'tuner_out'],
      level: 'master',
    },
  },
  {
    reference: 'LW-0905',
    customer: 'player@mail.example',
    state: 'on_bench',
    builder: 'junior@shop.example',
    startOffset: -4,
    notes: '',
    configuration: {
      surfaceId: 'slate-61',
      caseId: 'shell-hard',
      routing: { mode: 'serial' },
      pedalCount: 6,
      functions: [],
      level: 'apprentice',
    },
  },
  {
    reference: 'LW-0906',
    customer: 'cass@mail.example',
    state: 'delivered',
    builder: 'wren@shop.example',
    startOffset: -35,
    notes: 'Bass rig.',
    configuration: {
      surfaceId: 'slate-46',
      caseId: 'shell-hard',
      routing: { mode: 'serial' },
      pedals: [
        pedal('Bass tuner', 'tuner', false, 60),
        pedal('Bass compressor', 'compact'),
        pedal('Envelope filter', 'compact'),
        pedal('Bass preamp', 'large', false, 80),
      ],
      functions: ['tuner_out'],
      level: 'journeyman',
    },
  },
];

const HOUR = 3_600_000;

/**
 * When each state of a demo booking was reached, so the timelines read like a real queue: a
 * request about two weeks before its bench date, paid the same day, accepted the next, pedals in
 * two days before the bench, and so on. Every time is in the past and in order.
 */
function demoTimeline(reached: BookingState[], benchDate: string | null, completion: string | null, ageDays: number): Date[] {
  const now = Date.now();
  const at = (day: string, hour: number) => Date.parse(`${day}T${String(hour).padStart(2, '0')}:00:00Z`);
  const requested = benchDate ? at(addDays(benchDate, -12), 10) : now - ageDays * 24 * HOUR;
  const planned: Partial<Record<BookingState, number>> = {
    requested,
    deposit_paid: requested + 2 * HOUR,
    scheduled: requested + 26 * HOUR,
    ...(benchDate ? { pedals_received: at(addDays(benchDate, -2), 11), on_bench: at(benchDate, 9) } : {}),
    ...(completion ? { testing: at(completion, 13), ready: at(completion, 16), delivered: at(addDays(completion, 2), 12) } : {}),
  };
  const times: number[] = [];
  reached.forEach((state, i) => {
    const latest = now - (reached.length - i) * 60_000;
    times.push(Math.min(Math.max(planned[state] ?? requested, times[i - 1] ?? 0), latest));
  });
  return times.map((t) => new Date(t));
}

const path: BookingState[] = ['requested', 'deposit_paid', 'scheduled', 'pedals_received', 'on_bench', 'testing', 'ready', 'delivered'];

export async function seedBookings(db: Kysely<DB>, options: { evenInTests?: boolean } = {}): Promise<void> {
  // API tests start from an empty queue so their counts mean something; seed.spec runs this step itself.
  if (process.env.NODE_ENV === 'test' && !options.evenInTests) return;
  const book = await db
    .selectFrom('price_book_versions')
    .select(['version', 'book'])
    .orderBy('version', 'desc')
    .limit(1)
    .executeTakeFirst();
  const shop = await db.selectFrom('shop_settings').select(['country_code', 'timezone']).where('id', '=', 1).executeTakeFirst();
  if (!book || !shop) return;
  const today = todayIn(shop.timezone);
  const holidays = publicHolidaysBetween(shop.country_code.trim(), addDays(today, -60), addDays(today, 400));
  const closures = (await db.selectFrom('shop_closures').selectAll().execute()).map((c) => ({
    startsOn: c.starts_on,
    endsOn: c.ends_on,
    reason: c.reason,
  }));
  const holidayOn = (d: string) => holidays.get(d) ?? null;

  for (const demo of demoBookings) {
    const customer = await db.selectFrom('users').select(['id']).where('email', '=', demo.customer).executeTakeFirst();
    if (!customer) continue;
    await db.transaction().execute(async (trx) => {
      const booking = await trx
        .insertInto('bookings')
        .values({
          reference: demo.reference,
          customer_id: customer.id,
          state: 'requested',
          configuration: JSON.stringify(demo.configuration),
          customer_notes: demo.notes,
        })
        .onConflict((oc) => oc.column('reference').doNothing())
        .returning('id')
        .executeTakeFirst();
      if (!booking) return;
      const estimate = estimateRig(demo.configuration, book.book as PriceBook, { version: book.version });
      const quoteBase = {
        booking_id: booking.id,
        price_book_version: book.version,
        currency: estimate.currency,
        configuration: JSON.stringify(demo.configuration),
        estimate: JSON.stringify(estimate),
        labor_hours: estimate.laborHours,
        deposit: estimate.deposit,
      };
      await trx
        .insertInto('quotes')
        .values({
          ...quoteBase,
          kind: 'estimate',
          total_low: estimate.totalLow,
          total_high: estimate.totalHigh,
          expires_at: new Date(Date.now() + 30 * 86_400_000),
        })
        .execute();

      const reached = path.slice(0, path.indexOf(demo.state) + 1);
      const builder = demo.builder
        ? await trx
            .selectFrom('builders')
            .innerJoin('users', 'users.id', 'builders.user_id')
            .select(['builders.id', 'builders.user_id', 'builders.hourly_rate', 'builders.weekly_hours', 'builders.level', 'users.name'])
            .where('users.email', '=', demo.builder)
            .executeTakeFirst()
        : undefined;
      let benchDate: string | null = null;
      let completion: string | null = null;
      let balancePaid: Decimal | null = null;
      if (builder && reached.includes('scheduled')) {
        const calendar: BenchCalendar = { weeklyHours: builder.weekly_hours, closures, holidayOn };
        const from = demo.startOffset ? addDays(today, demo.startOffset) : earliestBenchDateFor(today, calendar);
        const existing = await trx.selectFrom('bench_allocations').select(['day', 'hours']).where('builder_id', '=', builder.id).execute();
        const taken = (day: string): HourSlice[] =>
          existing
            .filter((a) => a.day === day)
            .map((a) => {
              const [lo, hi] = a.hours.replace(/[[\]()]/g, '').split(',');
              return { from: toCentihours(lo), to: toCentihours(hi) };
            });
        const plan = earliestStart({ laborHours: toCentihours(estimate.laborHours), from, calendar, taken });
        if (!plan.ok) return;
        benchDate = plan.benchDate;
        completion = plan.expectedCompletion;
        await trx
          .insertInto('bench_allocations')
          .values(
            plan.days.flatMap((d) =>
              d.slices.map((s) => ({
                booking_id: booking.id,
                builder_id: builder.id,
                day: d.day,
                hours: `[${(s.from / 100).toFixed(2)},${(s.to / 100).toFixed(2)})`,
                day_capacity: (dayCapacity(d.day, calendar).capacity / 100).toFixed(2),
              })),
            ),
          )
          .execute();
        const firm = firmQuoteFigures({
          hourlyRate: builder.hourly_rate,
          laborHours: estimate.laborHours,
          materialsTotal: estimate.materialsTotal,
          deposit: estimate.deposit,
        });
        await trx
          .insertInto('quotes')
          .values({
            ...quoteBase,
            kind: 'firm',
            total_low: firm.total,
            total_high: firm.total,
            hourly_rate: builder.hourly_rate,
            labor_total: firm.laborTotal,
            total: firm.total,
            builder_id: builder.id,
            expires_at: new Date(Date.parse(`${addDays(completion, 365)}T00:00:00Z`)),
          })
          .execute();
        if (reached.includes('pedals_received')) {
          const items = intakeChecklist(demo.configuration);
          await trx
            .insertInto('intake_items')
            .values(
              items.map(({ key, item, position }, i) => ({
                booking_id: booking.id,
                item_key: key,
                position,
                item,
                condition: i === 1 && demo.state === 'on_bench' ? ('faulty' as const) : ('working' as const),
                note: i === 1 && demo.state === 'on_bench' ? 'Footswitch intermittent; the player was told before the build.' : '',
                recorded_by: builder.user_id,
              })),
            )
            .execute();
          const worked = plan.days.filter((d) => d.day < today).slice(0, 3);
          if (worked.length) {
            await trx
              .insertInto('time_entries')
              .values(
                worked.map((d) => ({
                  booking_id: booking.id,
                  builder_id: builder.id,
                  worked_on: d.day,
                  hours: new Decimal(d.hours).div(100).toFixed(2),
                  note: 'Mounting and cabling',
                  created_by: builder.user_id,
                })),
              )
              .execute();
          }
        }
        if (demo.state === 'delivered' && new Decimal(firm.balanceDue).gt(0)) balancePaid = new Decimal(firm.balanceDue);
      }
      const times = demoTimeline(reached, benchDate, completion, demo.ageDays ?? 1);
      const timeOf = (state: BookingState) => times[reached.indexOf(state)] ?? new Date();
      if (balancePaid) {
        await trx
          .insertInto('payments')
          .values({
            booking_id: booking.id,
            kind: 'balance',
            amount: balancePaid.toFixed(2),
            amount_minor: balancePaid.times(100).toFixed(0),
            currency: estimate.currency,
            status: 'paid',
            paid_at: timeOf('ready'),
            created_at: timeOf('ready'),
          })
          .execute();
      }
      if (reached.includes('deposit_paid')) {
        await trx
          .insertInto('payments')
          .values({
            booking_id: booking.id,
            kind: 'deposit',
            amount: estimate.deposit,
            amount_minor: new Decimal(estimate.deposit).times(100).toFixed(0),
            currency: estimate.currency,
            status: 'paid',
            paid_at: timeOf('deposit_paid'),
            created_at: timeOf('requested'),
          })
          .execute();
      }
      await trx
        .updateTable('bookings')
        .set({
          state: demo.state,
          builder_id: builder?.id ?? null,
          bench_date: benchDate,
          expected_completion: completion,
          created_at: timeOf('requested'),
          updated_at: timeOf(demo.state),
        })
        .where('id', '=', booking.id)
        .execute();
      const labels: Record<string, string> = { requested: 'Request sent', deposit_paid: 'Deposit paid' };
      await trx
        .insertInto('booking_events')
        .values(
          reached.map((to, i) => ({
            booking_id: booking.id,
            from_state: i === 0 ? null : reached[i - 1],
            to_state: to,
            actor_id: i < 2 ? customer.id : (builder?.user_id ?? null),
            actor_label: i < 2 ? 'Demo data (player)' : `Demo data (${builder?.name ?? 'shop'})`,
            created_at: times[i] ?? new Date(),
            note:
              labels[to] ??
              (to === 'scheduled' && benchDate && completion
                ? `Bench date ${formatDay(benchDate)}, expected completion ${formatDay(completion)}.`
                : ''),
          })),
        )
        .execute();
    });
  }
}
