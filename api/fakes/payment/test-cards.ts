/**
 * How the fake answers a typed card number. The numbers and their outcomes are the payment
 * provider's published test cards (Stripe testing documentation, "Test card numbers" and
 * "Declined payments"); any other number is refused the way test mode refuses a real card.
 */
export type CardOutcome =
  | { kind: 'success' }
  | { kind: 'declined'; code: string; declineCode?: string; message: string };

const testCards: Record<string, CardOutcome> = {
  '4242424242424242': { kind: 'success' },
  '4000000000000002': {
    kind: 'declined',
    code: 'card_declined',
    declineCode: 'generic_decline',
    message: 'Your card was declined.',
  },
  '4000000000009995': {
    kind: 'declined',
    code: 'card_declined',
    declineCode: 'insufficient_funds',
    message: 'Your card has insufficient funds.',
  },
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

export function outcomeForCard(typed: string): CardOutcome {
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
