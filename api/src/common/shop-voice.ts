import { shopFormat, type ShopFormat } from '@loomwright/shared';

/** A calendar day with its year, in the shop's voice: "Tue, Jan 12, 2027", "Di., 12. Jan. 2027". */
export const dayWords = (f: ShopFormat, day: string) => f.day(day, { year: 'always' });

/**
 * An amount that carries its own currency (a payment row, a letter's data) in a voice: "$220.99".
 * The one money helper for the API's words; the default voice is the shared formatter's (en-US).
 */
export const moneyOf = (held: { amount: string; currency: string }, f: ShopFormat = shopFormat()) =>
  f.money(held.amount, held.currency.trim());
