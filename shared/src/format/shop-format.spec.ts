import { describe, expect, it } from 'vitest';
import { dayIn, dayToDate, shopFormat } from './shop-format';

/**
 * Expected strings are CLDR's own output. Node.js is built with full ICU (process.versions.icu
 * 78.2 carries CLDR 48.0 here; a small-ICU build would know only English and fail these tests).
 * The CLDR data each check follows is named beside it: number symbols and currency patterns from
 * CLDR `main/<locale>/numbers.json`, units from `units.json`, dates from `ca-gregorian.json`.
 * U+00A0 (no-break space) and U+2009 (thin space) are written out where CLDR uses them.
 */
const NBSP = '\u00a0';
const THIN = '\u2009';

describe('the one formatter, against CLDR for three locales', () => {
  it('runs on full ICU (all three locales are really supported)', () => {
    expect(Intl.NumberFormat.supportedLocalesOf(['en-US', 'de-DE', 'ja-JP'])).toEqual(['en-US', 'de-DE', 'ja-JP']);
  });

  describe('en-US (CLDR en: decimal ".", group ",", currency pattern "¤#,##0.00")', () => {
    const f = shopFormat({ locale: 'en-US', currency: 'USD', timeZone: 'America/Chicago' });

    it('money keeps the currency’s two decimals, also on round amounts, and never floats', () => {
      expect(f.money('1120')).toBe('$1,120.00');
      expect(f.money('2050.5')).toBe('$2,050.50');
      // 2^53 + 1 cannot be a float: a string passed as a string stays exact.
      expect(f.money('9007199254740993.10')).toBe('$9,007,199,254,740,993.10');
      expect(f.money('-12.5')).toBe('-$12.50');
      expect(f.money(null)).toBe('—');
    });

    it('ranges use CLDR en’s range pattern "{0} – {1}"', () => {
      expect(f.moneyRange('2050', '3075')).toBe('$2,050.00 – $3,075.00');
      expect(f.moneyRange('2050', '2050.00')).toBe('$2,050.00');
    });

    it('a yen amount in an English-speaking shop has no decimals (ISO 4217: JPY minor unit 0)', () => {
      expect(f.money('3500', 'JPY')).toBe('¥3,500');
    });

    it('hours, rates and quantities use CLDR en units: "hr", "ft", "mm"', () => {
      expect(f.hours('20.5')).toBe('20.5 hr');
      expect(f.hours('20.50')).toBe('20.5 hr');
      expect(f.hours(1)).toBe('1 hr');
      expect(f.perHour('100')).toBe('$100.00/hr');
      expect(f.quantity(12.5, 'foot')).toBe('12.5 ft');
      expect(f.quantity(460, 'millimeter')).toBe('460 mm');
      expect(f.quantity(1234)).toBe('1,234');
      expect(f.quantity(30, 'percent')).toBe('30%');
    });

    it('calendar days: "EEE, MMM d, y" (CLDR en yMMMEd), and no time zone moves them', () => {
      expect(f.day('2027-01-12', { year: 'always' })).toBe('Tue, Jan 12, 2027');
      expect(f.shortDay('2026-12-07')).toBe('12/7/26');
      expect(f.month('2026-12-07')).toBe('December 2026');
      expect(f.dayRange('2027-01-12', '2027-01-15')).toBe(`Tue, Jan 12${THIN}–${THIN}Fri, Jan 15, 2027`);
      expect(f.dayRange('2026-12-30', '2027-01-04')).toBe(`Wed, Dec 30, 2026${THIN}–${THIN}Mon, Jan 4, 2027`);
    });

    it('moments are in the shop’s time zone with its name: 23:45 UTC is 5:45 PM in Chicago in December (CST, UTC−6)', () => {
      // IANA tz database: America/Chicago is UTC−6 (CST) in December, UTC−5 (CDT) in July.
      expect(f.dateTime('2026-12-08T23:45:00Z')).toBe('Tue, Dec 8, 2026, 5:45 PM CST');
      expect(f.time('2026-07-08T23:45:00Z')).toBe('6:45 PM CDT');
      // A moment's day is the shop's: 05:59 UTC on the 9th is still the 8th in Chicago; 06:00 is the 9th.
      expect(f.dayOf('2026-12-09T05:59:00Z', { year: 'always' })).toBe('Tue, Dec 8, 2026');
      expect(f.dayOf('2026-12-09T06:00:00Z', { year: 'always' })).toBe('Wed, Dec 9, 2026');
    });
  });

  describe('de-DE (CLDR de: decimal ",", group ".", currency pattern "#,##0.00 ¤")', () => {
    const f = shopFormat({ locale: 'de-DE', currency: 'EUR', timeZone: 'Europe/Berlin' });

    it('money', () => {
      expect(f.money('1234567.5')).toBe(`1.234.567,50${NBSP}€`);
      expect(f.moneyRange('2050', '3075')).toBe(`2.050,00–3.075,00${NBSP}€`);
      expect(f.money('1120', 'USD')).toBe(`1.120,00${NBSP}$`);
    });

    it('hours and quantities: CLDR de short hour unit "Std."', () => {
      expect(f.hours('20.5')).toBe('20,5 Std.');
      expect(f.perHour('100')).toBe(`100,00${NBSP}€/Std.`);
      expect(f.quantity(1234.5)).toBe('1.234,5');
    });

    it('days and moments (CLDR de yMMMEd "EEE, d. MMM y"; Berlin is UTC+1 in winter)', () => {
      expect(f.day('2027-01-12', { year: 'always' })).toBe('Di., 12. Jan. 2027');
      expect(f.shortDay('2026-12-07')).toBe('07.12.26');
      expect(f.dateTime('2026-12-08T23:45:00Z')).toBe('Mi., 9. Dez. 2026, 00:45 MEZ');
      expect(f.dayRange('2027-01-12', '2027-01-15')).toBe(`Di., 12.${THIN}–${THIN}Fr., 15. Jan. 2027`);
    });
  });

  describe('ja-JP (CLDR ja: yen sign "￥" U+FFE5, no decimals for JPY; dates "y年M月d日(EEE)")', () => {
    const f = shopFormat({ locale: 'ja-JP', currency: 'JPY', timeZone: 'Asia/Tokyo' });

    it('money', () => {
      expect(f.money('1234567')).toBe('￥1,234,567');
      expect(f.moneyRange('2050', '3075')).toBe('￥2,050 ～ ￥3,075');
    });

    it('hours: CLDR ja short hour unit "時間"', () => {
      expect(f.hours('20.5')).toBe('20.5 時間');
      expect(f.perHour('12000')).toBe('￥12,000/時間');
    });

    it('days and moments (Tokyo is UTC+9 all year)', () => {
      expect(f.day('2027-01-12', { year: 'always' })).toBe('2027年1月12日(火)');
      expect(f.shortDay('2026-12-07')).toBe('2026/12/07');
      expect(f.dateTime('2026-12-08T23:45:00Z')).toBe('2026年12月9日(水) 8:45 JST');
    });
  });

  describe('money follows the product’s one source of minor units, not CLDR’s display digits', () => {
    const f = shopFormat({ locale: 'en-US', currency: 'USD', timeZone: 'UTC' });
    it('IDR keeps its two ISO 4217 decimals, which CLDR would drop', () => {
      // ISO 4217: IDR minor unit 2. CLDR 48 supplemental currencyData gives IDR digits 0 for display.
      expect(f.money('1234.56', 'IDR')).toBe(`IDR${NBSP}1,234.56`);
    });
    it('HUF is counted in whole forints (the payment provider charges and pays out whole units)', () => {
      expect(f.money('1235', 'HUF')).toBe(`HUF${NBSP}1,235`);
    });
    it('KWD shows its three ISO decimals', () => {
      expect(f.money('12.35', 'KWD')).toBe(`KWD${NBSP}12.350`);
    });
  });

  describe('helpers', () => {
    it('a calendar day is noon UTC of that day; a bad day is refused', () => {
      expect(dayToDate('2026-12-07').toISOString()).toBe('2026-12-07T12:00:00.000Z');
      expect(() => dayToDate('07/12/2026')).toThrow(RangeError);
    });
    it('the shop’s today follows its time zone (IANA tz: Pacific/Kiritimati UTC+14, Pacific/Pago_Pago UTC−11)', () => {
      const at = new Date('2026-12-08T12:30:00Z');
      expect(dayIn('Pacific/Kiritimati', at)).toBe('2026-12-09');
      expect(dayIn('Pacific/Pago_Pago', at)).toBe('2026-12-08');
      expect(dayIn('UTC', at)).toBe('2026-12-08');
    });
  });
});
