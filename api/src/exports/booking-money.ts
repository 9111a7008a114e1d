import { moneyFacts, type MoneyFacts } from '@loomwright/shared';
import type { OfficeRepository } from './office.repository';

export type OfficeBookingRow = Awaited<ReturnType<ReturnType<OfficeRepository['bookingsQuery']>['execute']>>[number];

const iso = (d: Date | string | null) => (d === null ? null : new Date(d).toISOString());

/** A booking row's currency and money facts, through moneyFacts(), the one place the API computes them. */
export function bookingMoney(b: OfficeBookingRow, shopCurrency: string): { currency: string; money: MoneyFacts } {
  const currency = b.firm?.currency ?? b.estimate?.currency ?? b.payments[0]?.currency ?? shopCurrency;
  const money = moneyFacts({
    currency,
    firmTotal: b.firm?.total ?? null,
    extras: b.extras.map((e) => ({ description: '', amount: e.amount, status: e.status })),
    payments: b.payments.map((p) => ({
      kind: p.kind,
      amount: p.amount,
      status: p.status,
      paidAt: iso(p.paid_at),
      refundedAt: iso(p.refunded_at),
    })),
    balanceWaived: b.balance_waived_reason !== null,
  });
  return { currency, money };
}
