import { shopFormat, type ShopFormat } from '@loomwright/shared';
import { moneyOf } from '../../common/shop-voice';

/**
 * Money, days and moments in e-mail (and the history lines the API writes), through the one shared
 * formatter (`shopFormat`) in the shop's locale, currency and time zone: the same words the two apps
 * show. `renderMail` speaks in the shop's voice for the length of one (synchronous) render through
 * `inShopVoice`; outside a render the default voice (en-US, UTC) is used.
 */
let voice: ShopFormat = shopFormat();

export function inShopVoice<T>(shop: { locale?: string; currency?: string; timezone?: string }, render: () => T): T {
  const previous = voice;
  voice = shopFormat({ locale: shop.locale, currency: shop.currency, timeZone: shop.timezone });
  try {
    return render();
  } finally {
    voice = previous;
  }
}

const decimal = /^-?\d+(\.\d+)?$/;

/** "$1,120.00" in the shop's locale, with the currency's own minor unit. */
export function formatMoney(amount: string, currency: string): string {
  if (!decimal.test(amount)) throw new MailDataError(`the amount "${amount}" is not a decimal number`);
  return moneyOf({ amount, currency }, voice);
}

const day = /^\d{4}-\d{2}-\d{2}$/;

/** A calendar day ('YYYY-MM-DD') as "Tue, Jan 12, 2027"; no time zone can shift it. */
export function formatDay(value: string): string {
  if (!day.test(value) || Number.isNaN(Date.parse(`${value}T00:00:00Z`))) {
    throw new MailDataError(`"${value}" is not a calendar day (YYYY-MM-DD)`);
  }
  return voice.day(value, { year: 'always' });
}

/** An instant in the shop's time zone with the zone's name, as both apps show it: "Tue, Dec 8, 2026, 5:45 PM CST". */
export function formatInstant(value: string, timeZone?: string): string {
  const date = new Date(value);
  if (Number.isNaN(date.getTime())) throw new MailDataError(`"${value}" is not a date and time`);
  const f = timeZone && timeZone !== voice.timeZone ? shopFormat({ ...voice.voice, timeZone }) : voice;
  return f.dateTime(date);
}

/** Data a template needs is missing or malformed: the message cannot be rendered, so it is not sent. */
export class MailDataError extends Error {}

/** A key of a template's data (MailTemplateData): reading a key the type lacks fails to compile. */
type DataKey<D> = keyof D & string;

/**
 * A string the template needs. The types say it is there, but the data comes back from the outbox
 * as stored JSON (possibly from an older version), so it is still checked here.
 */
export function requireString<D extends object>(data: D, key: DataKey<D>): string {
  const value = (data as Record<string, unknown>)[key];
  if (typeof value !== 'string' || value.trim() === '') throw new MailDataError(`the data has no "${key}"`);
  return value;
}

export function optionalString<D extends object>(data: D, key: DataKey<D>): string | undefined {
  const value = (data as Record<string, unknown>)[key];
  return typeof value === 'string' && value.trim() !== '' ? value : undefined;
}

/** A whole number the template needs (checked for the same reason as requireString). */
export function requireWhole<D extends object>(data: D, key: DataKey<D>): number {
  const value = (data as Record<string, unknown>)[key];
  if (typeof value !== 'number' || !Number.isInteger(value)) throw new MailDataError(`the data has no whole number "${key}"`);
  return value;
}

/** The letter's `amount` in its `currency`: "$280.00". */
export const amountOf = (data: { amount?: string; currency?: string | null }) =>
  formatMoney(requireString(data, 'amount'), requireString(data, 'currency'));
