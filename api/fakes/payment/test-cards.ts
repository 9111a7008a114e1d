import type { IntentPlan } from './store';

/**
 * How the fake answers what the player types. The numbers and their outcomes are the payment
 * provider's published test numbers (Stripe testing documentation: "Test card numbers",
 * "Declined payments", "Disputes", "Refunds", and the ACH Direct Debit guide's test account
 * numbers); the exact numbers for disputes, refund failures and bank accounts are written from
 * memory. Any other number is refused the way test mode refuses a real card.
 */
export type PayOutcome =
  | { kind: 'success'; plan?: IntentPlan }
  /** A bank debit: the checkout completes unpaid, the money settles (or fails) later. */
  | { kind: 'delayed'; plan: IntentPlan }
  | { kind: 'declined'; code: string; declineCode?: string; message: string };

const testCards: Record<string, PayOutcome> = {
  '4242424242424242': { kind: 'success' },
  '4000000000000002': { kind: 'declined', code: 'card_declined', declineCode: 'generic_decline', message: 'Your card was declined.' },
  '4000000000009995': {
    kind: 'declined',
    code: 'card_declined',
    declineCode: 'insufficient_funds',
    message: 'Your card has insufficient funds.',
  },
  // Pays, then the cardholder's bank opens a dispute (fraudulent).
  '4000000000000259': { kind: 'success', plan: { dispute: { reason: 'fraudulent' } } },
  // Pays; a refund starts "succeeded" and later turns "failed".
  '4000000000005126': { kind: 'success', plan: { refund: 'fail_later' } },
};

/** ACH test routing number and account numbers: the debit settles later, or fails later. */
export const TEST_ROUTING_NUMBER = '110000000';
const testAccounts: Record<string, IntentPlan> = {
  '000123456789': { settle: { outcome: 'succeed' } },
  '000111111113': { settle: { outcome: 'fail', code: 'account_closed', message: 'The bank account has been closed.' } },
  '000222222227': { settle: { outcome: 'fail', code: 'insufficient_funds', message: 'The bank account has insufficient funds.' } },
};

/** The Luhn (mod 10) check digit rule of ISO/IEC 7812-1, which every card number satisfies. */
export function passesLuhn(digits: string): boolean {
  let sum = 0;
  for (let i = 0; i < digits.length; i += 1) {
    let d = Number(digits[digits.length - 1 - i]);
    if (i % 2 === 1) {
      d *= 2;
      if (d > 9) d -= 9;
    }
    sum += d;
  }
  return digits.length >= 12 && sum % 10 === 0;
}

export function outcomeForCard(typed: string): PayOutcome {
  const digits = typed.replace(/[\s-]/g, '');
  if (!/^\d{12,19}$/.test(digits) || !passesLuhn(digits)) {
    return { kind: 'declined', code: 'incorrect_number', message: 'Your card number is incorrect.' };
  }
  return (
    testCards[digits] ?? {
      kind: 'declined',
      code: 'card_declined',
      declineCode: 'test_mode_live_card',
      message: 'Your card was declined. This is a test checkout, so only test card numbers work.',
    }
  );
}

export function outcomeForBankAccount(routing: string, account: string): PayOutcome {
  const r = routing.replace(/\s/g, '');
  const a = account.replace(/\s/g, '');
  if (r !== TEST_ROUTING_NUMBER) {
    return {
      kind: 'declined',
      code: 'invalid_routing_number',
      message: `The routing number is not valid here; in test mode use ${TEST_ROUTING_NUMBER}.`,
    };
  }
  const plan = testAccounts[a];
  if (!plan) return { kind: 'declined', code: 'invalid_account_number', message: 'The account number is not a test account number.' };
  return { kind: 'delayed', plan };
}
