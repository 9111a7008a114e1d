import Decimal from 'decimal.js';
import type { EstimateLine } from '../estimate/types';
import { formatMoney, minorUnitDigits } from '../estimate/money';
import { shopFormat } from '../format/shop-format';
import { rigWords } from '../words';

/**
 * The money facts of one booking, computed in one place for the API, both apps, the e-mails and
 * the build sheet: what the player owes (firm quote + approved extras), what they paid, what came
 * back to them, and what is still due.
 */

export type ExtraStatus = 'proposed' | 'approved' | 'declined';
export type PaymentKindWord = 'deposit' | 'balance';

export interface MoneyExtraInput {
  description: string;
  amount: string;
  status: ExtraStatus;
}

export interface MoneyPaymentInput {
  kind: PaymentKindWord;
  amount: string;
  /** A payment counts as money in once it is paid; a refunded one is paid money that went back. */
  status: string;
  paidAt: string | null;
  refundedAt: string | null;
}

export interface MoneyFactsInput {
  currency: string;
  /** The firm quote's total; null until a builder with a known rate accepts. */
  firmTotal: string | null;
  extras: MoneyExtraInput[];
  payments: MoneyPaymentInput[];
  /** The owner waived what is left, with a reason. */
  balanceWaived: boolean;
}

/** One line of the money ledger: money in (a payment) or money back (a refund), each at its own time. */
export interface MoneyLedgerEntry {
  kind: 'payment' | 'refund';
  paymentKind: PaymentKindWord;
  /** Positive for a payment, negative for a refund. */
  amount: string;
  at: string | null;
}

export interface MoneyFacts {
  currency: string;
  firmTotal: string | null;
  approvedExtras: string;
  /** Extras waiting for the player's yes: not owed until approved. */
  proposedExtras: string;
  /** Firm total + approved extras; null until there is a firm quote. */
  totalOwed: string | null;
  paid: string;
  refunded: string;
  /** paid − refunded. */
  netPaid: string;
  /** max(0, totalOwed − netPaid); null until there is a firm quote. */
  balanceDue: string | null;
  /** What the shop holds beyond what is owed (to refund or settle), never negative. */
  credit: string;
  balanceWaived: boolean;
  /** Nothing stands between the build and delivery: no firm quote is missing, and nothing is due or the owner waived it. */
  settled: boolean;
  ledger: MoneyLedgerEntry[];
}

const sum = (values: Decimal.Value[]) => values.reduce<Decimal>((s, v) => s.plus(v), new Decimal(0));

/** Paid money is a payment whose status says the money arrived, whether or not it later went back. */
const arrived = (p: MoneyPaymentInput) => p.status === 'paid' || p.status === 'refunded';

export function moneyFacts(input: MoneyFactsInput): MoneyFacts {
  const money = (d: Decimal.Value) => formatMoney(d, input.currency);
  const approved = sum(input.extras.filter((e) => e.status === 'approved').map((e) => e.amount));
  const proposed = sum(input.extras.filter((e) => e.status === 'proposed').map((e) => e.amount));
  const paidRows = input.payments.filter(arrived);
  const refundedRows = input.payments.filter((p) => p.status === 'refunded');
  const paid = sum(paidRows.map((p) => p.amount));
  const refunded = sum(refundedRows.map((p) => p.amount));
  const netPaid = paid.minus(refunded);
  const owed = input.firmTotal === null ? null : new Decimal(input.firmTotal).plus(approved);
  const due = owed === null ? null : Decimal.max(0, owed.minus(netPaid));
  const credit = owed === null ? new Decimal(0) : Decimal.max(0, netPaid.minus(owed));
  const ledger: MoneyLedgerEntry[] = [
    ...paidRows.map((p) => ({ kind: 'payment' as const, paymentKind: p.kind, amount: money(p.amount), at: p.paidAt })),
    ...refundedRows.map((p) => ({
      kind: 'refund' as const,
      paymentKind: p.kind,
      amount: money(new Decimal(p.amount).neg()),
      at: p.refundedAt,
    })),
  ].sort((a, b) => (a.at ?? '').localeCompare(b.at ?? ''));
  return {
    currency: input.currency,
    firmTotal: input.firmTotal === null ? null : money(input.firmTotal),
    approvedExtras: money(approved),
    proposedExtras: money(proposed),
    totalOwed: owed === null ? null : money(owed),
    paid: money(paid),
    refunded: money(refunded),
    netPaid: money(netPaid),
    balanceDue: due === null ? null : money(due),
    credit: money(credit),
    balanceWaived: input.balanceWaived,
    settled: due !== null && (due.isZero() || input.balanceWaived),
    ledger,
  };
}

/**
 * The firm quote's lines: materials as estimated, labor at the assigned builder's one rate.
 * Each labor line's exact amount (hours × rate) is rounded so the labor lines sum to the firm
 * labor total to the cent, by the largest-remainder method (Hamilton's apportionment): the lines
 * round down, then the cents left over go to the lines that lost most in rounding. So the lines
 * a player reads always add up to the total beneath them.
 */
export function firmQuoteLines(
  lines: EstimateLine[],
  hourlyRate: string,
  laborTotal: string,
  currency: string,
  locale?: string,
): EstimateLine[] {
  const rateWords = shopFormat({ currency, ...(locale && { locale }) }).money(hourlyRate);
  const digits = minorUnitDigits(currency);
  if (digits === undefined) throw new Error(`Unknown ISO 4217 currency ${currency}`);
  const unit = new Decimal(10).pow(-digits);
  const labor = lines.filter((l) => l.kind === 'labor');
  const exact = labor.map((l) => new Decimal(l.quantity).times(hourlyRate));
  const floors = exact.map((e) => e.toDecimalPlaces(digits, Decimal.ROUND_DOWN));
  let leftover = new Decimal(laborTotal).minus(sum(floors)).div(unit).round().toNumber();
  const byRemainder = exact.map((e, i) => ({ i, rest: e.minus(floors[i]) })).sort((a, b) => b.rest.comparedTo(a.rest) || a.i - b.i);
  const amounts = [...floors];
  // leftover is the cents rounding dropped; it can be negative when the stored total was rounded differently.
  for (let k = 0; leftover !== 0 && byRemainder.length > 0; k++) {
    const { i } = byRemainder[k % byRemainder.length];
    const step = leftover > 0 ? unit : unit.neg();
    amounts[i] = amounts[i].plus(step);
    leftover += leftover > 0 ? -1 : 1;
  }
  let j = 0;
  return lines.map((line) => {
    if (line.kind !== 'labor') return line;
    const amount = amounts[j++];
    const { amountHigh: _high, ...rest } = line;
    // The estimate explains a labor line at the level's range of rates; a firm line is at one rate.
    const basis = rest.basis ?? storedLaborBasis(rest.explanation);
    const explanation = basis !== undefined ? rigWords.laborAt(basis, rateWords) : rest.explanation;
    return {
      ...rest,
      ...(explanation !== undefined && { explanation }),
      unitPrice: formatMoney(hourlyRate, currency),
      amount: amount.toFixed(digits),
    };
  });
}

/**
 * Quotes are never rewritten (a database trigger refuses it), so a labor line stored before lines
 * carried their `basis` still reads "…, at 80.00–100.00 per hour". Its basis is the text before the
 * rate, so a firm quote can word it at its one rate like any newer line.
 */
const STORED_LABOR_LINE = /^(.*), at \d+(?:\.\d+)?–\d+(?:\.\d+)? per hour$/s;
export function storedLaborBasis(explanation: string | undefined): string | undefined {
  return explanation === undefined ? undefined : STORED_LABOR_LINE.exec(explanation)?.[1];
}
