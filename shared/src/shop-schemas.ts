import countries from 'i18n-iso-countries';
import { z } from 'zod';
import type { PostalAddress } from './bench-types';
import { builderLevels } from './domain';
import { mailStates } from './mail-types';
import { decodeCursorParts, encodeCursorParts, timestampKeyShape, uuidShape } from './list-cursor';
import { calendarDay, oneOf, pageCursor, pagingQuery, requestObject, sortOrder, text, uuid } from './request-fields';
import { authWords, rules, shopWords } from './words';

/**
 * The IANA time zones a shop can choose: the runtime's list (ECMA-402
 * `Intl.supportedValuesOf('timeZone')`, the IANA tz database names its CLDR data treats as canonical)
 * plus UTC, which that list leaves out.
 */
export function shopTimeZones(): string[] {
  const zones = Intl.supportedValuesOf('timeZone');
  return zones.includes('UTC') ? zones : [...zones, 'UTC'].sort();
}

let zoneSet: Set<string> | undefined;

/**
 * The shop's time zone as stored: a name from `shopTimeZones()`, or an IANA alias of one that the
 * runtime resolves to it (Asia/Kolkata → the runtime's own name). Anything else ("EST", "Mars/Olympus",
 * "Etc/GMT+5") is refused.
 */
export function canonicalTimeZone(name: string): string | undefined {
  zoneSet ??= new Set(shopTimeZones());
  if (zoneSet.has(name)) return name;
  try {
    const resolved = new Intl.DateTimeFormat('en-US', { timeZone: name }).resolvedOptions().timeZone;
    return zoneSet.has(resolved) ? resolved : undefined;
  } catch {
    return undefined;
  }
}

/** A time zone name from the shop's list (see `canonicalTimeZone`). */
export const isTimeZone = (name: string): boolean => canonicalTimeZone(name) !== undefined;

/**
 * ISO 3166-1 alpha-2 country codes, from the registry's i18n-iso-countries dataset (countries and
 * territories). Names for people come from `Intl.DisplayNames` in the reader's language.
 */
export function countryCodes(): string[] {
  return Object.keys(countries.getAlpha2Codes()).sort();
}

/** An ISO 3166-1 alpha-2 code of a country or territory, upper case ("US", "GB"). */
export const isCountryCode = (code: string): boolean => /^[A-Z]{2}$/.test(code) && countries.isValid(code);

/**
 * A BCP 47 language tag the runtime can format with (ECMA-402 `Intl.getCanonicalLocales` and
 * `supportedLocalesOf`), canonicalised: "de-de" → "de-DE".
 */
export function canonicalLocale(tag: string): string | undefined {
  try {
    const [canonical] = Intl.getCanonicalLocales(tag);
    if (!canonical || !/^[a-z]{2,3}-[A-Z]{2}$/.test(canonical)) return undefined;
    return Intl.NumberFormat.supportedLocalesOf([canonical]).length > 0 ? canonical : undefined;
  } catch {
    return undefined;
  }
}

/**
 * Locales the settings page offers (language and region, so dates and money read as the shop's
 * customers expect); the API takes any tag `canonicalLocale` accepts.
 */
export const commonShopLocales = [
  'en-US',
  'en-CA',
  'en-GB',
  'en-IE',
  'en-AU',
  'en-NZ',
  'de-DE',
  'de-AT',
  'de-CH',
  'fr-FR',
  'fr-CA',
  'fr-BE',
  'nl-NL',
  'it-IT',
  'es-ES',
  'es-MX',
  'pt-PT',
  'pt-BR',
  'sv-SE',
  'nb-NO',
  'da-DK',
  'fi-FI',
  'pl-PL',
  'cs-CZ',
  'hu-HU',
  'ja-JP',
  'ko-KR',
  'zh-TW',
  'id-ID',
  'ar-KW',
] as const;

const localeWords = shopWords.locale;

const timeZoneWords = shopWords.timezone;
const emailWords = shopWords.contactEmail;

/**
 * The shop's postal address, where players ship or drop off their pedals: street lines, city,
 * region (state, county or province, where the country uses one) and postal code; the country is
 * the shop's countryCode. A street line, the city and the postal code are needed for a label.
 */
export const postalAddressSchema = requestObject({
  line1: text('Street and number', { max: 120, min: 2, tooShort: 'Give the street and number of the shop’s address' }),
  line2: text('Second address line', { max: 120 }).optional(),
  city: text('Town or city', { max: 80, min: 1, tooShort: 'Give the town or city of the shop’s address' }),
  region: text('State or region', { max: 80 }).optional(),
  postalCode: text('Postal code', { max: 20, min: 2, tooShort: 'Give the postal code of the shop’s address' }),
});
export type PostalAddressInput = z.infer<typeof postalAddressSchema>;

/** One line for mails, calendar files and paper: "14 Foundry Lane, Unit 3, Millbrook, OR 97000, US". */
export function postalAddressLine(address: PostalAddress, countryCode: string): string {
  const cityLine = [address.city, [address.region, address.postalCode].filter(Boolean).join(' ')].filter(Boolean).join(', ');
  return [address.line1, address.line2, cityLine, countryCode].filter((part) => part.trim() !== '').join(', ');
}

/** The shop's details as the owner edits them on the settings page (every field required there). */
export const shopDetailsSchema = requestObject({
  name: text('name', { max: 120, min: 2, tooShort: shopWords.shopNameShort }),
  tagline: text('tagline', { max: 200 }),
  contactEmail: z
    .string({ error: emailWords })
    .trim()
    .toLowerCase()
    .max(254, { error: emailWords })
    .pipe(z.email({ error: emailWords })),
  // ISO 3166-1 alpha-2 from the registry's list; a country without public-holiday data is allowed
  // (the settings page then says so and the shop adds its closed days as closures).
  countryCode: z.string({ error: shopWords.countryCode }).trim().toUpperCase().refine(isCountryCode, { error: shopWords.countryCode }),
  timezone: z
    .string({ error: timeZoneWords })
    .trim()
    .max(64, { error: timeZoneWords, abort: true })
    .refine(isTimeZone, { error: timeZoneWords, abort: true })
    .transform((name) => canonicalTimeZone(name)!),
  locale: z
    .string({ error: localeWords })
    .trim()
    .max(35, { error: localeWords, abort: true })
    .refine((tag) => canonicalLocale(tag) !== undefined, { error: localeWords, abort: true })
    .transform((tag) => canonicalLocale(tag)!),
  postalAddress: postalAddressSchema.optional(),
});
export type ShopDetailsInput = z.infer<typeof shopDetailsSchema>;

/** PATCH /api/settings: any of the shop's details. */
export const updateSettingsSchema = shopDetailsSchema.partial().refine((body) => Object.values(body).some((value) => value !== undefined), {
  error: shopWords.settingsEmpty,
});
export type UpdateSettingsInput = z.infer<typeof updateSettingsSchema>;

/** A closure may span at most a year; a longer one is two closures. */
export const MAX_CLOSURE_DAYS = 366;
const DAY_MS = 86_400_000;

/** POST /api/settings/closures: days the whole shop is closed, first and last inclusive. */
export const createClosureSchema = requestObject({
  startsOn: calendarDay('startsOn'),
  endsOn: calendarDay('endsOn'),
  reason: text('reason', { max: 200, min: 2, tooShort: shopWords.closureReason }),
})
  .refine((c) => c.endsOn >= c.startsOn, { path: ['endsOn'], error: rules.dayOrder('Last day', 'First day') })
  .refine((c) => (Date.parse(c.endsOn) - Date.parse(c.startsOn)) / DAY_MS < MAX_CLOSURE_DAYS, {
    path: ['endsOn'],
    error: shopWords.closureTooLong(MAX_CLOSURE_DAYS),
  });
export type CreateClosureInput = z.infer<typeof createClosureSchema>;

/**
 * PUT /api/settings/holidays/:day: whether the shop works on one public holiday of its country
 * (true opens the bench that day; false closes it again, the default).
 */
export const holidayChoiceSchema = requestObject({
  shopWorks: z.boolean({ error: shopWords.holidayChoice }),
});
export type HolidayChoiceInput = z.infer<typeof holidayChoiceSchema>;

export const customerSorts = ['name', 'email', 'createdAt', 'buildCount', 'lastBookingAt'] as const;
export type CustomerSort = (typeof customerSorts)[number];

/** GET /api/customers. */
export const listCustomersQuerySchema = requestObject({
  ...pagingQuery,
  sort: oneOf('sort', customerSorts).default('name'),
  order: sortOrder('asc'),
  /** Part of a name or e-mail address. */
  search: text('search', { max: 100 }).optional(),
});
export type ListCustomersQuery = z.infer<typeof listCustomersQuerySchema>;

/** GET /api/mail: the mail log. */
/**
 * Where the next page of GET /api/mail starts (keyset paging, newest first): the last row's
 * `created_at` as PostgreSQL writes it, and its id. Travels as `cursor` (see `list-cursor.ts`).
 */
export interface MailLogCursor {
  key: string;
  id: string;
}

export const encodeMailLogCursor = (c: MailLogCursor): string => encodeCursorParts(['mail', c.key, c.id]);

/** The cursor, or null when it is not one the mail log wrote (damaged, from another list, or another version). */
export function decodeMailLogCursor(value: string): MailLogCursor | null {
  const parsed = decodeCursorParts(value);
  if (!parsed || parsed.length !== 3) return null;
  const [list, key, id] = parsed;
  if (list !== 'mail' || typeof key !== 'string' || !timestampKeyShape.test(key)) return null;
  if (typeof id !== 'string' || !uuidShape.test(id)) return null;
  return { key, id };
}

export const listMailQuerySchema = requestObject({
  ...pagingQuery,
  state: oneOf('state', mailStates).optional(),
  /** Part of the recipient address. */
  q: text('q', { max: 200 }).optional(),
  /** The previous page's `nextCursor`: the page after it, through the log's (created_at, id) index (`page` is then not used). */
  cursor: pageCursor(decodeMailLogCursor).optional(),
});
export type ListMailQuery = z.infer<typeof listMailQuerySchema>;

/** GET /api/bench: the days shown (default today and 13 more) and optionally one builder. */
export const benchQuerySchema = requestObject({
  from: calendarDay('from').optional(),
  to: calendarDay('Last day shown').optional(),
  builderId: uuid('builderId', 'a builder').optional(),
});
export type BenchQuery = z.infer<typeof benchQuerySchema>;

/** GET /api/bench/suggest. */
export const benchSuggestQuerySchema = requestObject({
  bookingId: uuid('bookingId', 'a booking'),
  /** Only this builder (the owner may pick one below the rig's level). */
  builderId: uuid('builderId', 'a builder').optional(),
});
export type BenchSuggestQuery = z.infer<typeof benchSuggestQuerySchema>;

/** GET /api/bench/lead-time: the estimate's labor hours and the level it is priced at. */
export const leadTimeQuerySchema = requestObject({
  hours: z.string({ error: shopWords.leadTimeHours }).regex(/^(?!0+(\.0+)?$)\d{1,3}(\.\d{1,2})?$/, { error: shopWords.leadTimeHours }),
  level: z.enum(builderLevels, { error: authWords.level }),
});
export type LeadTimeQuery = z.infer<typeof leadTimeQuerySchema>;
