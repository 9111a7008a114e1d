import { currencyUnit } from '../money/currency-unit';

/**
 * How the shop speaks numbers, money, dates and times: its locale (BCP 47), its currency (ISO 4217)
 * and its time zone (IANA). Every page of both apps, every e-mail, calendar file and PDF formats
 * through `shopFormat(voice)`, so one amount or one moment reads the same everywhere.
 *
 * Everything goes through ECMA-402 `Intl` with the locale's CLDR data (Node.js ships full ICU, and
 * so does Chromium), so "1.234,50 €" in de-DE and "￥1,235" in ja-JP come from CLDR, not from us.
 * Amounts arrive as decimal strings and are handed to Intl as strings (ECMA-402 NumberFormat v3
 * formats a numeric string exactly), so no price ever passes through a float.
 */
export interface ShopVoice {
  locale: string;
  currency: string;
  timeZone: string;
}

/** What a shop speaks before its settings are known (tests, the first paint). */
export const defaultShopVoice: ShopVoice = { locale: 'en-US', currency: 'USD', timeZone: 'UTC' };

const DAY = /^(\d{4})-(\d{2})-(\d{2})/;

/** A calendar day ('YYYY-MM-DD') as a Date at noon UTC: formatted in UTC, no time zone can move its day. */
export function dayToDate(day: string): Date {
  const m = DAY.exec(day);
  if (!m) throw new RangeError(`"${day}" is not a calendar day (YYYY-MM-DD)`);
  const date = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]), 12));
  if (Number.isNaN(date.getTime())) throw new RangeError(`"${day}" is not a calendar day (YYYY-MM-DD)`);
  return date;
}

/** The calendar day an instant falls on in a time zone, as 'YYYY-MM-DD'. */
export function dayIn(timeZone: string, at: Date | string | number = new Date()): string {
  // en-CA writes dates as YYYY-MM-DD (CLDR), so the parts need no reordering.
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(new Date(at));
}

const cache = new Map<string, ShopFormat>();

/** The formatter for one shop voice (cached: Intl formatters are costly to build). */
export function shopFormat(voice: Partial<ShopVoice> = {}): ShopFormat {
  const v: ShopVoice = {
    locale: voice.locale || defaultShopVoice.locale,
    currency: (voice.currency || defaultShopVoice.currency).trim().toUpperCase(),
    timeZone: voice.timeZone || defaultShopVoice.timeZone,
  };
  const key = `${v.locale}|${v.currency}|${v.timeZone}`;
  let f = cache.get(key);
  if (!f) {
    f = new ShopFormat(v);
    cache.set(key, f);
  }
  return f;
}

type Amount = string | number;
type RangeFormat = Intl.NumberFormat & { formatRange(start: string, end: string): string };

export class ShopFormat {
  private readonly numberFormats = new Map<string, Intl.NumberFormat>();
  private readonly dateFormats = new Map<string, Intl.DateTimeFormat>();

  constructor(readonly voice: ShopVoice) {}

  get locale() {
    return this.voice.locale;
  }

  get timeZone() {
    return this.voice.timeZone;
  }

  get currency() {
    return this.voice.currency;
  }

  private number(key: string, options: Intl.NumberFormatOptions): Intl.NumberFormat {
    let f = this.numberFormats.get(key);
    if (!f) {
      f = new Intl.NumberFormat(this.voice.locale, options);
      this.numberFormats.set(key, f);
    }
    return f;
  }

  private date(key: string, options: Intl.DateTimeFormatOptions): Intl.DateTimeFormat {
    let f = this.dateFormats.get(key);
    if (!f) {
      f = new Intl.DateTimeFormat(this.voice.locale, options);
      this.dateFormats.set(key, f);
    }
    return f;
  }

  /**
   * The money formatter of a currency: as many decimals as the product counts it in (one source:
   * money/minor-units.ts), so IDR shows its two ISO decimals although CLDR would drop them, and a
   * whole-unit currency (JPY, HUF) shows none. Three-decimal currencies keep their ISO three.
   */
  private moneyFormat(currency: string): Intl.NumberFormat {
    const code = currency.trim().toUpperCase();
    const unit = currencyUnit(code);
    const digits = unit ? (unit.digits === 0 ? 0 : Math.max(unit.digits, unit.isoDigits)) : 2;
    return this.number(`money:${code}`, {
      style: 'currency',
      currency: unit ? code : 'XXX',
      minimumFractionDigits: digits,
      maximumFractionDigits: digits,
    });
  }

  /** "$1,120.00", "1.120,00 €", "￥1,120"; "—" when there is no amount. */
  money(amount: Amount | null | undefined, currency = this.voice.currency): string {
    if (amount === null || amount === undefined || amount === '') return '—';
    return this.moneyFormat(currency).format(String(amount) as unknown as number);
  }

  /** "$2,050.00–$3,075.00" (the locale's own range pattern), or one figure when both ends agree. */
  moneyRange(low: Amount, high: Amount, currency = this.voice.currency): string {
    const f = this.moneyFormat(currency);
    const a = f.format(String(low) as unknown as number);
    const b = f.format(String(high) as unknown as number);
    if (a === b) return a;
    // ES2023 Intl.NumberFormat.prototype.formatRange (Node 20, Chromium); the project's TS lib predates it.
    return (f as RangeFormat).formatRange(String(low), String(high));
  }

  private hourUnit(): string {
    const parts = this.number('hour-unit', { style: 'unit', unit: 'hour', unitDisplay: 'short' }).formatToParts(2);
    return parts.find((p) => p.type === 'unit')?.value ?? 'h';
  }

  /** A rate: "$100.00/hr", "100,00 €/Std.". */
  perHour(amount: Amount | null | undefined, currency = this.voice.currency): string {
    if (amount === null || amount === undefined || amount === '') return '—';
    return `${this.money(amount, currency)}/${this.hourUnit()}`;
  }

  /** A range of rates: "$100.00 – $150.00/hr". */
  perHourRange(low: Amount, high: Amount, currency = this.voice.currency): string {
    return `${this.moneyRange(low, high, currency)}/${this.hourUnit()}`;
  }

  /** Hours of bench work: "20.5 hr", "20,5 Std.", "20.5 時間" (at most two decimals, as they are recorded). */
  hours(hours: Amount | null | undefined): string {
    if (hours === null || hours === undefined || hours === '') return '—';
    return this.number('hours', { style: 'unit', unit: 'hour', unitDisplay: 'short', maximumFractionDigits: 2 }).format(
      String(hours) as unknown as number,
    );
  }

  /**
   * A count or a measure: quantity(6) "6"; quantity(12.5, 'foot') "12.5 ft"; quantity(460, 'millimeter')
   * "460 mm". Units are ECMA-402's sanctioned simple units.
   */
  quantity(
    value: Amount,
    unit?: 'foot' | 'meter' | 'centimeter' | 'millimeter' | 'day' | 'hour' | 'percent',
    maximumFractionDigits = 2,
  ): string {
    const options: Intl.NumberFormatOptions = unit
      ? unit === 'percent'
        ? { style: 'percent', maximumFractionDigits }
        : { style: 'unit', unit, unitDisplay: 'short', maximumFractionDigits }
      : { maximumFractionDigits };
    const v = unit === 'percent' ? Number(value) / 100 : value;
    return this.number(`q:${unit ?? ''}:${maximumFractionDigits}`, options).format(String(v) as unknown as number);
  }

  /** The shop's today, 'YYYY-MM-DD', in its time zone. */
  today(at: Date | string | number = new Date()): string {
    return dayIn(this.voice.timeZone, at);
  }

  /**
   * A calendar day (a bench date, a ship-by day: no time of day, no time zone): "Tue, Jan 12" this
   * year, "Tue, Jan 12, 2027" otherwise, or always with the year when asked (e-mails, paper).
   */
  day(day: string | null | undefined, options: { year?: 'auto' | 'always' } = {}): string {
    if (!day) return '—';
    const withYear = options.year === 'always' || day.slice(0, 4) !== this.today().slice(0, 4);
    const f = withYear
      ? this.date('day-y', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' })
      : this.date('day', { weekday: 'short', day: 'numeric', month: 'short', timeZone: 'UTC' });
    return f.format(dayToDate(day));
  }

  /** A calendar day in numbers for tables and paper: "12/7/2026" (en-US), "7.12.2026" (de-DE), "2026/12/07" (ja-JP). */
  shortDay(day: string | null | undefined): string {
    if (!day) return '—';
    return this.date('short-day', { dateStyle: 'short', timeZone: 'UTC' }).format(dayToDate(day));
  }

  /** "December 2026". */
  month(day: string): string {
    return this.date('month', { month: 'long', year: 'numeric', timeZone: 'UTC' }).format(dayToDate(day));
  }

  /** Two calendar days as one range in the locale's own pattern: "Tue, Jan 12 – Fri, Jan 15, 2027". */
  dayRange(from: string, to: string): string {
    const f = this.date('day-range', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
    if (from === to) return f.format(dayToDate(from));
    return f.formatRange(dayToDate(from), dayToDate(to));
  }

  /**
   * A moment (an ISO timestamp) in the shop's time zone, with the zone's short name so a reader
   * elsewhere is not misled: "Tue, Dec 8, 2026, 5:45 PM CST".
   */
  dateTime(at: string | Date | null | undefined): string {
    if (at === null || at === undefined || at === '') return '—';
    const date = new Date(at);
    if (Number.isNaN(date.getTime())) throw new RangeError(`"${String(at)}" is not a date and time`);
    return this.date('date-time', {
      weekday: 'short',
      day: 'numeric',
      month: 'short',
      year: 'numeric',
      hour: 'numeric',
      minute: '2-digit',
      timeZone: this.voice.timeZone,
      timeZoneName: 'short',
    }).format(date);
  }

  /** The time of a moment in the shop's time zone, with the zone: "5:45 PM CST". */
  time(at: string | Date): string {
    return this.date('time', { hour: 'numeric', minute: '2-digit', timeZone: this.voice.timeZone, timeZoneName: 'short' }).format(
      new Date(at),
    );
  }

  /** The calendar day a moment falls on in the shop's time zone, formatted as `day()`. */
  dayOf(at: string | Date | null | undefined, options: { year?: 'auto' | 'always' } = {}): string {
    if (at === null || at === undefined || at === '') return '—';
    return this.day(dayIn(this.voice.timeZone, at), options);
  }
}
