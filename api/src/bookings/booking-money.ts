import { moneyFacts, type MoneyFacts } from '@loomwright/shared';
import type { PaymentRow } from './bookings.repository';

/** What the money facts of one booking are made from, however the rows were read (one booking, or a whole export). */
export interface BookingMoneyRows {
  firm: { currency: string; total: string | null } | null | undefined;
  estimate: { currency: string } | null | undefined;
  extras: Array<{ description?: string; amount: string; status: 'proposed' | 'approved' | 'declined' }>;
  payments: Array<
    Pick<PaymentRow, 'kind' | 'amount' | 'currency'> & { status: string; paid_at: Date | string | null; refunded_at: Date | string | null }
  >;
  balanceWaivedReason: string | null;
}

const iso = (d: Date | string | null) => (d === null ? null : new Date(d).toISOString());

/**
 * A booking's money facts from its rows: the one adapter from the database's rows to `moneyFacts()`
 * (shared/src/money/money-facts.ts). The booking answer, the exports, the reports and Today all call it.
 * The currency is the firm quote's, else the estimate's, else the first payment's, else the shop's.
 */
export function bookingMoneyFacts(rows: BookingMoneyRows, shopCurrency = 'USD'): MoneyFacts {
  const currency = (rows.firm ?? rows.estimate)?.currency.trim() ?? rows.payments[0]?.currency.trim() ?? shopCurrency.trim();
  return moneyFacts({
    currency,
    firmTotal: rows.firm?.total ?? null,
    extras: rows.extras.map((e) => ({ description: e.description ?? '', amount: e.amount, status: e.status })),
    payments: rows.payments.map((p) => ({
      kind: p.kind,
      amount: p.amount,
      status: p.status,
      paidAt: iso(p.paid_at),
      refundedAt: iso(p.refunded_at),
    })),
    balanceWaived: rows.balanceWaivedReason !== null,
  });
}
