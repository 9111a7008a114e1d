import type { MoneyFacts } from '@loomwright/shared';
import { bookingMoneyFacts } from '../bookings/booking-money';
import type { OfficeRepository } from './office.repository';

export type OfficeBookingRow = Awaited<ReturnType<ReturnType<OfficeRepository['bookingsQuery']>['execute']>>[number];

/** An export row's currency and money facts, through the bookings' one adapter to moneyFacts(). */
export function bookingMoney(b: OfficeBookingRow, shopCurrency: string): { currency: string; money: MoneyFacts } {
  const money = bookingMoneyFacts({ ...b, balanceWaivedReason: b.balance_waived_reason }, shopCurrency);
  return { currency: money.currency, money };
}
