/** Concrete money and dates for e-mail: "$1,120.00", "Tue 12 Jan 2027". */

const decimal = /^-?\d+(\.\d+)?$/;

export function formatMoney(amount: string, currency: string): string {
  if (!decimal.test(amount)) throw new MailDataError(`the amount "${amount}" is not a decimal number`);
  // Intl formats a decimal string exactly (no float rounding) and knows each currency's minor unit.
  return new Intl.NumberFormat('en-US', { style: 'currency', currency }).format(amount as unknown as number);
}

const day = /^\d{4}-\d{2}-\d{2}$/;

/** A calendar day ('YYYY-MM-DD') as "Tue 12 Jan 2027"; no time zone can shift it. */
export function formatDay(value: string): string {
  if (!day.test(value) || Number.isNaN(Date.parse(`${value}T00:00:00Z`))) {
    throw new MailDataError(`"${value}" is not a calendar day (YYYY-MM-DD)`);
  }
  const parts = new Intl.DateTimeFormat('en-GB', {
    weekday: 'short',
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    timeZone: 'UTC',
  }).formatToParts(new Date(`${value}T00:00:00Z`));
  const get = (type: string) => parts.find((p) => p.type === type)?.value ?? '';
  return `${get('weekday')} ${get('day')} ${get('month')} ${get('year')}`;
}

/** An instant as "Tue 12 Jan 2027, 14:30 (UTC)" in the shop's time zone. */
export function formatInstant(value: string, timeZone: string): string {
  const date = new Date(value);
  if (Number.isNaN(date.getTime())) throw new MailDataError(`"${value}" is not a date and time`);
  const local = new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(date);
  const time = new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).format(date);
  const zone =
    new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'short' }).formatToParts(date).find((p) => p.type === 'timeZoneName')
      ?.value ?? timeZone;
  return `${formatDay(local)}, ${time} (${zone})`;
}

/** Data a template needs is missing or malformed: the message cannot be rendered, so it is not sent. */
export class MailDataError extends Error {}

export function requireString(data: Record<string, unknown>, key: string): string {
  const value = data[key];
  if (typeof value !== 'string' || value.trim() === '') throw new MailDataError(`the data has no "${key}"`);
  return value;
}

export function optionalString(data: Record<string, unknown>, key: string): string | undefined {
  const value = data[key];
  return typeof value === 'string' && value.trim() !== '' ? value : undefined;
}
