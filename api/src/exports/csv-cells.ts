/**
 * Cell values of the CSV exports: times as ISO 8601 on the shop's wall clock with its UTC offset,
 * and free text made safe for the spreadsheet programs a bookkeeper opens the file in.
 */

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatterFor(timeZone: string): Intl.DateTimeFormat {
  let f = formatters.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', {
      timeZone,
      hourCycle: 'h23',
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      second: '2-digit',
      timeZoneName: 'longOffset',
    });
    formatters.set(timeZone, f);
  }
  return f;
}

/**
 * An instant as ISO 8601 local time with the offset in force then, e.g. 2026-12-02T09:15:00-06:00
 * (ISO 8601-1:2019 §5.4.2 / RFC 3339 §5.6 "date-time"): the shop's clock, and still one exact instant.
 */
export function isoInTimeZone(at: Date | string, timeZone: string): string {
  const date = at instanceof Date ? at : new Date(at);
  const parts: Record<string, string> = {};
  for (const p of formatterFor(timeZone).formatToParts(date)) parts[p.type] = p.value;
  // longOffset writes "GMT-06:00", "GMT+05:30", or a bare "GMT" at offset zero.
  const offset = parts.timeZoneName === 'GMT' ? '+00:00' : parts.timeZoneName.replace('GMT', '');
  return `${parts.year}-${parts.month}-${parts.day}T${parts.hour}:${parts.minute}:${parts.second}${offset}`;
}

/** The shop's calendar day of an instant, YYYY-MM-DD. */
export function dayInTimeZone(at: Date | string, timeZone: string): string {
  return isoInTimeZone(at, timeZone).slice(0, 10);
}

/**
 * Text a person typed (a name, a note) as a cell: a spreadsheet runs a cell that starts with
 * = + - @ or a tab or carriage return as a formula, so such a cell is written with a leading
 * apostrophe, which spreadsheets show as plain text (OWASP, "CSV Injection").
 */
export function textCell(value: string | null | undefined): string {
  if (value === null || value === undefined) return '';
  return /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
}
