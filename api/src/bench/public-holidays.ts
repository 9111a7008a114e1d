import Holidays from 'date-holidays';
import { addDays, daysBetween } from './calendar-days';

/**
 * Public holidays of a country from the date-holidays package (code ISC, holiday data
 * CC-BY-3.0). Only the 'public' type closes the bench: bank, school, optional and observance days
 * are ordinary working days for a pedalboard shop.
 */
export function isKnownCountry(countryCode: string): boolean {
  const countries = new Holidays().getCountries() as Record<string, string>;
  return Object.prototype.hasOwnProperty.call(countries, countryCode.toUpperCase());
}

export function publicHolidaysBetween(countryCode: string, from: string, to: string): Map<string, string> {
  const out = new Map<string, string>();
  if (!isKnownCountry(countryCode)) return out;
  const hd = new Holidays(countryCode.toUpperCase());
  const firstYear = Number(from.slice(0, 4));
  const lastYear = Number(to.slice(0, 4));
  for (let year = firstYear; year <= lastYear; year++) {
    for (const h of hd.getHolidays(year)) {
      if (h.type !== 'public') continue;
      const first = h.date.slice(0, 10);
      // A holiday that lasts more than a day closes each of its days.
      const length = Math.max(1, Math.round((h.end.getTime() - h.start.getTime()) / 86_400_000));
      for (let i = 0; i < length; i++) {
        const day = addDays(first, i);
        if (daysBetween(from, day) >= 0 && daysBetween(day, to) >= 0 && !out.has(day)) out.set(day, h.name);
      }
    }
  }
  return out;
}
