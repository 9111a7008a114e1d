import Decimal from 'decimal.js';
import type { MoneyFacts } from './money-facts';

/** One line of a booking's money account as every reader shows it (screen, paper). */
export interface MoneyAccountRow {
  key: string;
  label: string;
  /** When the money moved (a payment or a refund, each at its own time); the reader formats it. */
  at: string | null;
  /** Decimal string; a refund is negative. */
  amount: string;
  /** The line that answers "what do I still owe". */
  strong: boolean;
}

export interface MoneyAccount {
  rows: MoneyAccountRow[];
  /** Words under the account: extras still waiting for the player, or a balance not yet known. */
  notes: string[];
}

const paymentWords = { deposit: 'Deposit', balance: 'Balance' } as const;
const isZero = (amount: string) => new Decimal(amount).isZero();

/**
 * The booking's money as one short account, in the same words in the storefront, the backoffice
 * and the build sheet: firm quote, approved extras, each payment and each refund at its own time,
 * and what is due. Every figure comes from `moneyFacts()`; this only says them in order.
 * `formatMoney` writes the amounts inside the notes in the reader's format.
 */
export function moneyAccount(money: MoneyFacts, formatMoney: (amount: string, currency: string) => string): MoneyAccount {
  const rows: MoneyAccountRow[] = [];
  if (money.firmTotal !== null) rows.push({ key: 'firm', label: 'Firm quote', at: null, amount: money.firmTotal, strong: false });
  if (money.firmTotal !== null || !isZero(money.approvedExtras)) {
    rows.push({ key: 'extras', label: 'Approved extras', at: null, amount: money.approvedExtras, strong: false });
  }
  money.ledger.forEach((entry, i) =>
    rows.push({
      key: `ledger-${i}`,
      label: entry.kind === 'refund' ? `${paymentWords[entry.paymentKind]} refunded` : `${paymentWords[entry.paymentKind]} paid`,
      at: entry.at,
      amount: entry.amount,
      strong: false,
    }),
  );
  if (money.balanceDue !== null) {
    rows.push({
      key: 'due',
      label: money.balanceWaived && !isZero(money.balanceDue) ? 'Balance due (waived by the shop)' : 'Balance due',
      at: null,
      amount: money.balanceDue,
      strong: true,
    });
  }
  if (!isZero(money.credit))
    rows.push({ key: 'credit', label: 'Paid beyond the total (the shop refunds it)', at: null, amount: money.credit, strong: false });
  const notes: string[] = [];
  if (!isZero(money.proposedExtras)) {
    notes.push(
      `Extras waiting for the player's answer (${formatMoney(money.proposedExtras, money.currency)}) are not counted until approved.`,
    );
  }
  if (money.firmTotal === null) notes.push('The balance is worked out once a builder accepts and the quote is firm.');
  return { rows, notes };
}
