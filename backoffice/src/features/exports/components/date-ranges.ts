import type { DateRangeQuery } from '@loomwright/shared';

/** Today on the shop's wall clock, YYYY-MM-DD (en-CA writes dates that way). */
export function shopToday(timeZone: string | undefined, now = new Date()): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone: timeZone ?? 'UTC', year: 'numeric', month: '2-digit', day: '2-digit' }).format(now);
}

const lastDayOfMonth = (year: number, month: number) => new Date(Date.UTC(year, month, 0)).getUTCDate();
const pad = (n: number) => String(n).padStart(2, '0');

/** The ranges a bookkeeper asks for most, on the shop's calendar. */
export function presetRanges(today: string): Array<{ label: string; range: DateRangeQuery }> {
  const [y, m] = today.split('-').map(Number);
  const prevY = m === 1 ? y - 1 : y;
  const prevM = m === 1 ? 12 : m - 1;
  const quarterStart = Math.floor((m - 1) / 3) * 3 + 1;
  return [
    { label: 'This month', range: { from: `${y}-${pad(m)}-01`, to: `${y}-${pad(m)}-${pad(lastDayOfMonth(y, m))}` } },
    {
      label: 'Last month',
      range: { from: `${prevY}-${pad(prevM)}-01`, to: `${prevY}-${pad(prevM)}-${pad(lastDayOfMonth(prevY, prevM))}` },
    },
    {
      label: 'This quarter',
      range: { from: `${y}-${pad(quarterStart)}-01`, to: `${y}-${pad(quarterStart + 2)}-${pad(lastDayOfMonth(y, quarterStart + 2))}` },
    },
    { label: 'This year', range: { from: `${y}-01-01`, to: `${y}-12-31` } },
  ];
}
