import { ForbiddenException, Injectable } from '@nestjs/common';
import Decimal from 'decimal.js';
import {
  shopFormat,
  todayWords,
  type AuthUser,
  type TodayBuild,
  type TodayQuery,
  type TodayResponse,
  type TodayWaitKind,
} from '@loomwright/shared';
import { addDays, todayIn } from '../bench/calendar-days';
import { bookingMoney } from '../exports/booking-money';
import { OfficeRepository } from '../exports/office.repository';
import { mondayOf } from '../reports/iso-week';
import { shopSetUp } from '../shop/shop-profile';
import { ShopRepository } from '../shop/shop.repository';
import { TodayRepository } from './today.repository';

const WORKING_STATES = new Set(['pedals_received', 'on_bench', 'testing']);
const h = (value: Decimal.Value) => new Decimal(value).toFixed(2);

/**
 * A builder's today: their builds with bench hours today or later this week (Monday to Sunday in
 * the shop's time zone) and their builds that are ready and not yet gone, each with what it waits
 * for and the next thing to do. Builders see their own; the owner sees all, or only their own bench.
 */
@Injectable()
export class TodayService {
  constructor(
    private readonly rowsOf: TodayRepository,
    private readonly office: OfficeRepository,
    private readonly shop: ShopRepository,
  ) {}

  async today(user: AuthUser, query: TodayQuery, now = new Date()): Promise<TodayResponse> {
    if (user.role !== 'owner' && query.scope === 'all') throw new ForbiddenException(todayWords.ownerOnlyAll);
    const scope = query.scope ?? (user.role === 'owner' ? 'all' : 'mine');
    const shop = shopSetUp(await this.shop.findSettings());
    const format = shopFormat({ locale: shop.locale, currency: shop.currency, timeZone: shop.timezone });
    const today = todayIn(shop.timezone, now);
    const weekStart = mondayOf(today);
    const weekEnd = addDays(weekStart, 6);
    const own = await this.rowsOf.builderIdOf(user.id);
    const base = { today, weekStart, weekEnd, scope, hasOwnBench: own !== undefined } as const;
    if (scope === 'mine' && !own) return { ...base, builds: [] };
    const rows = await this.rowsOf.builds({ today, start: weekStart, end: weekEnd }, scope === 'mine' ? own!.id : undefined);

    // The balance of each ready build, from the same money facts the build page and the exports use.
    const readyIds = new Set(rows.filter((r) => r.state === 'ready').map((r) => r.id));
    const balances = new Map<string, { due: string | null; waived: boolean; currency: string }>();
    if (readyIds.size > 0) {
      for (const row of await this.office
        .bookingsInStates(['ready'])
        .where('b.id', 'in', [...readyIds])
        .execute()) {
        const { currency, money } = bookingMoney(row, shop.currency);
        balances.set(row.id, { due: money.balanceDue, waived: money.balanceWaived, currency });
      }
    }

    const builds: TodayBuild[] = rows.map((r) => {
      const benchDays = r.bench_days.map((d) => ({ day: d.day, hours: h(d.hours) }));
      const hoursToday = benchDays.find((d) => d.day === today)?.hours ?? h(0);
      const waitingFor: Array<{ kind: TodayWaitKind; words: string }> = [];
      if (r.state === 'scheduled') {
        waitingFor.push(
          r.inbound_tracking
            ? { kind: 'intake', words: todayWords.parcelOnItsWay(r.inbound_carrier, r.inbound_tracking) }
            : { kind: 'parcel', words: todayWords.noTracking },
        );
      }
      const layoutWaiting = r.awaiting_layout_approval || r.waiting_layouts > 0;
      if (layoutWaiting) waitingFor.push({ kind: 'approval', words: todayWords.layoutApproval });
      if (r.proposed_extras > 0) waitingFor.push({ kind: 'approval', words: todayWords.extraApproval(r.proposed_extras) });
      const balance = balances.get(r.id);
      const balanceOwed = balance?.due != null && new Decimal(balance.due).gt(0) && !balance.waived;
      if (r.state === 'ready' && balanceOwed)
        waitingFor.push({ kind: 'balance', words: todayWords.balance(format.money(balance!.due!, balance!.currency)) });
      if (WORKING_STATES.has(r.state) && new Decimal(hoursToday).gt(0) && new Decimal(r.recorded_today).lt(hoursToday)) {
        waitingFor.push({ kind: 'hours', words: todayWords.hoursToRecord(format.hours(hoursToday), format.hours(r.recorded_today)) });
      }
      const next =
        r.state === 'scheduled'
          ? r.inbound_tracking
            ? todayWords.checkIn
            : todayWords.askForTracking
          : r.state === 'ready'
            ? balanceOwed
              ? todayWords.waitForBalance
              : todayWords.handOver
            : layoutWaiting || r.proposed_extras > 0
              ? todayWords.waitForApproval
              : r.state === 'pedals_received'
                ? todayWords.startBuild
                : r.state === 'testing'
                  ? todayWords.test
                  : todayWords.keepBuilding;
      return {
        bookingId: r.id,
        reference: r.reference,
        customerName: r.customer_name,
        state: r.state,
        builderId: r.builder_id,
        builderName: r.builder_name,
        when: new Decimal(hoursToday).gt(0) ? 'today' : r.state === 'ready' ? 'ready' : 'week',
        benchDays,
        hoursToday,
        recordedToday: h(r.recorded_today),
        quotedHours: r.quoted_hours === null ? null : h(r.quoted_hours),
        recordedHours: h(r.recorded_hours),
        waitingFor,
        nextAction: { words: next, to: `/builds/${r.id}` },
      };
    });
    const order = { today: 0, week: 1, ready: 2 } as const;
    builds.sort(
      (a, b) =>
        order[a.when] - order[b.when] ||
        (a.benchDays[0]?.day ?? '').localeCompare(b.benchDays[0]?.day ?? '') ||
        a.reference.localeCompare(b.reference),
    );
    return { ...base, builds };
  }
}
