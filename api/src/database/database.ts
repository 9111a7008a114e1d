import type { ColumnType, Generated, JSONColumnType } from 'kysely';
import { Kysely } from 'kysely';
import type {
  BookingState,
  BuilderLevel,
  DepositStatus,
  EstimateResult,
  PriceBook,
  RigConfiguration,
  UserRole,
  WeeklyHours,
} from '@loomwright/shared';

/**
 * The typed shape of every table (see migrations/ for the constraints behind them).
 * numeric and bigint columns arrive from pg as strings, date columns as 'YYYY-MM-DD' strings:
 * money stays a decimal string until decimal.js takes it; a bench day is a calendar day.
 * A Timestamp's insert type allows undefined, so a column with a default (now()) may be left out
 * or set (the demo seed sets its history times).
 */
export type Timestamp = ColumnType<Date, Date | string | undefined, Date | string>;
export type NullableTimestamp = ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;
/** numeric: read as a decimal string, written from a string or a number. */
export type Numeric = ColumnType<string, string | number, string | number>;
export type NullableNumeric = ColumnType<string | null, string | number | null | undefined, string | number | null>;
/** date: 'YYYY-MM-DD'. */
export type CalendarDay = ColumnType<string, string, string>;
export type NullableCalendarDay = ColumnType<string | null, string | null | undefined, string | null>;

export interface ShopSettingsTable {
  id: Generated<number>;
  name: string;
  tagline: string;
  currency: string;
  country_code: string;
  timezone: string;
  locale: Generated<string>;
  contact_email: string;
  address_line1: Generated<string>;
  address_line2: Generated<string>;
  address_city: Generated<string>;
  address_region: Generated<string>;
  address_postal_code: Generated<string>;
  updated_at: Timestamp;
}

export interface UsersTable {
  id: Generated<string>;
  email: string;
  name: string;
  role: UserRole;
  password_hash: string | null;
  phone: string | null;
  created_at: Timestamp;
  last_sign_in_at: NullableTimestamp;
  password_changed_at: NullableTimestamp;
}

export interface AuthTokensTable {
  id: Generated<string>;
  user_id: string;
  purpose: 'password_reset' | 'staff_invite';
  token_hash: string;
  expires_at: Timestamp;
  used_at: NullableTimestamp;
  created_at: Timestamp;
}

export type SessionEndReason = 'signed_out' | 'signed_out_everywhere' | 'password_changed';

/** One signed-in device; its id travels in the session token as `sid`. */
export interface SessionsTable {
  id: Generated<string>;
  user_id: string;
  created_at: Timestamp;
  renewed_at: Timestamp;
  expires_at: Timestamp;
  ended_at: NullableTimestamp;
  ended_reason: SessionEndReason | null;
  ended_by: string | null;
  user_agent: string | null;
}

/** rate-limiter-flexible's PostgreSQL store (expire: epoch milliseconds, as a bigint string). */
export interface RateLimitsTable {
  key: string;
  points: number;
  expire: string | null;
}

export interface BuildersTable {
  id: Generated<string>;
  user_id: string;
  level: BuilderLevel;
  hourly_rate: Numeric;
  weekly_hours: JSONColumnType<WeeklyHours>;
  active: Generated<boolean>;
  created_at: Timestamp;
}

export interface ShopClosuresTable {
  id: Generated<string>;
  starts_on: CalendarDay;
  ends_on: CalendarDay;
  reason: string;
}

/** Append-only: the latest row per country and day says whether the shop works that public holiday. */
export interface ShopHolidayChoicesTable {
  id: Generated<string>;
  country_code: string;
  day: CalendarDay;
  holiday_name: string;
  shop_works: boolean;
  decided_by: string | null;
  decided_at: Generated<Date>;
}

export interface PriceBookVersionsTable {
  version: number;
  currency: string;
  book: JSONColumnType<PriceBook>;
  notes: Generated<string>;
  published_by: string | null;
  published_at: Timestamp;
}

export interface BookingsTable {
  id: Generated<string>;
  reference: string;
  customer_id: string;
  state: BookingState;
  configuration: JSONColumnType<RigConfiguration>;
  customer_notes: Generated<string>;
  builder_id: string | null;
  bench_date: NullableCalendarDay;
  expected_completion: NullableCalendarDay;
  awaiting_layout_approval: Generated<boolean>;
  inbound_carrier: string | null;
  inbound_tracking: string | null;
  decline_reason: string | null;
  cancel_reason: string | null;
  balance_waived_reason: string | null;
  level_override_reason: string | null;
  calendar_sequence: Generated<number>;
  price_consent: 'pending' | 'given' | null;
  /** Kept by a trigger on payments (migration 20261202_1345); never written by the application. */
  deposit_status: Generated<DepositStatus>;
  created_at: Timestamp;
  updated_at: Timestamp;
}

export interface QuotesTable {
  id: Generated<string>;
  booking_id: string;
  kind: 'estimate' | 'firm';
  price_book_version: number;
  currency: string;
  configuration: JSONColumnType<RigConfiguration>;
  estimate: JSONColumnType<EstimateResult>;
  labor_hours: Numeric;
  total_low: Numeric;
  total_high: Numeric;
  deposit: Numeric;
  hourly_rate: NullableNumeric;
  labor_total: NullableNumeric;
  total: NullableNumeric;
  builder_id: string | null;
  expires_at: Timestamp;
  created_at: Timestamp;
}

export interface BookingEventsTable {
  id: Generated<string>;
  booking_id: string;
  from_state: string | null;
  to_state: string;
  actor_id: string | null;
  actor_label: string;
  note: Generated<string>;
  /** 'player': the player reads this line; 'internal': only staff do (staff notes, hours, intake remarks). */
  visibility: Generated<'player' | 'internal'>;
  created_at: Timestamp;
}

export type PaymentStatus = 'pending' | 'processing' | 'paid' | 'failed' | 'expired' | 'refunded';
export type RefundStatus = 'pending' | 'requires_action' | 'succeeded' | 'failed' | 'canceled';

export interface PaymentsTable {
  id: Generated<string>;
  booking_id: string;
  kind: 'deposit' | 'balance';
  amount: Numeric;
  amount_minor: ColumnType<string, string | number | bigint, string | number | bigint>;
  currency: string;
  status: PaymentStatus;
  checkout_session_id: string | null;
  checkout_url: string | null;
  payment_intent_id: string | null;
  refund_id: string | null;
  failure_message: string | null;
  paid_at: NullableTimestamp;
  refunded_at: NullableTimestamp;
  /** 'checkout', or how the shop took it in person. */
  method: Generated<'checkout' | 'cash' | 'card_terminal' | 'bank_transfer'>;
  recorded_by: string | null;
  note: Generated<string>;
  created_at: Timestamp;
  updated_at: Timestamp;
  /** The provider's status of the latest refund of this payment. */
  refund_status: RefundStatus | null;
  refund_failure: string | null;
  refund_attempts: Generated<number>;
  dispute_id: string | null;
  /** The provider's dispute status (needs_response, under_review, won, lost, …). */
  dispute_status: string | null;
  dispute_reason: string | null;
  dispute_amount_minor: ColumnType<string | null, string | number | null | undefined, string | number | null>;
  dispute_opened_at: NullableTimestamp;
  /** The owner's decision that the build may be delivered despite the dispute. */
  dispute_released_at: NullableTimestamp;
  dispute_released_by: string | null;
}

export interface PaymentEventsTable {
  event_id: string;
  type: string;
  payload: JSONColumnType<Record<string, unknown>>;
  received_at: Timestamp;
}

export interface BookingExtrasTable {
  id: Generated<string>;
  booking_id: string;
  description: string;
  amount: Numeric;
  reason: string;
  status: 'proposed' | 'approved' | 'declined';
  proposed_by: string | null;
  decided_at: NullableTimestamp;
  decided_via: DecidedVia | null;
  decision_comment: Generated<string>;
  /** Who gave the answer, as the shop recorded it ("Rowan, by phone"); the player's own name when they decided in the app. */
  decided_by_name: string | null;
  /** The staff member who recorded a decision given by phone or in person; null when the player decided in the app. */
  recorded_by: string | null;
  created_at: Timestamp;
}

export type DecidedVia = 'app' | 'phone' | 'in_person' | 'email';

export interface LayoutApprovalsTable {
  id: Generated<string>;
  booking_id: string;
  requested_by: string | null;
  message: Generated<string>;
  status: Generated<'waiting' | 'approved' | 'declined'>;
  decided_via: DecidedVia | null;
  decision_comment: Generated<string>;
  decided_by_name: string | null;
  recorded_by: string | null;
  decided_at: NullableTimestamp;
  created_at: Timestamp;
}

export interface PhotosTable {
  id: Generated<string>;
  booking_id: string;
  uploaded_by: string;
  kind: 'customer' | 'intake' | 'build';
  storage_key: string;
  content_type: string;
  size_bytes: number;
  caption: Generated<string>;
  created_at: Timestamp;
  /** The list-sized copy; null for a photo stored before uploads were re-encoded. */
  thumbnail_key: string | null;
  width: number | null;
  height: number | null;
  /** Set when the photo travels with a message on the build's conversation. */
  message_id: string | null;
}

export type MessageSideColumn = 'player' | 'shop';

export interface BuildMessagesTable {
  id: Generated<string>;
  /** bigserial: a decimal string. */
  seq: ColumnType<string, never, never>;
  booking_id: string;
  author_id: string;
  side: MessageSideColumn;
  body: string;
  created_at: Timestamp;
}

export interface MessageReadMarkersTable {
  booking_id: string;
  side: MessageSideColumn;
  read_seq: ColumnType<string, string | number, string | number>;
  read_at: Timestamp;
}

export interface MessageNoticesTable {
  id: Generated<string>;
  booking_id: string;
  side: MessageSideColumn;
  from_seq: ColumnType<string, string | number, string | number>;
  due_at: ColumnType<Date, Date | string, Date | string>;
  state: ColumnType<'waiting' | 'sent' | 'skipped', 'waiting' | undefined, 'waiting' | 'sent' | 'skipped'>;
  message_count: number | null;
  outbox_id: string | null;
  settled_at: NullableTimestamp;
  created_at: Timestamp;
}

export interface IntakeItemsTable {
  id: Generated<string>;
  booking_id: string;
  item: string;
  condition: 'working' | 'faulty';
  note: Generated<string>;
  photo_id: string | null;
  recorded_by: string;
  /** The item's place in the rig ('chain:3', 'supply', 'switcher', or 'other:<name>'): one row per item. */
  item_key: string;
  /** Signal-chain order. */
  position: Generated<number>;
  updated_at: NullableTimestamp;
  updated_by: string | null;
  created_at: Timestamp;
}

export interface TimeEntriesTable {
  id: Generated<string>;
  booking_id: string;
  builder_id: string;
  worked_on: CalendarDay;
  hours: Numeric;
  note: Generated<string>;
  /** Who wrote the entry: they and the owner may correct it. */
  created_by: string | null;
  updated_at: NullableTimestamp;
  created_at: Timestamp;
}

export interface BenchAllocationsTable {
  id: Generated<string>;
  booking_id: string;
  builder_id: string;
  day: CalendarDay;
  /** numrange as text, e.g. '[0,3.5)'; write with sql`numrange(${from}, ${to})`. */
  hours: string;
  day_capacity: Numeric;
}

export type MailState = 'queued' | 'sending' | 'sent' | 'failed' | 'unknown';

export interface MailOutboxTable {
  id: Generated<string>;
  message_id: string;
  template: string;
  to_address: string;
  data: JSONColumnType<Record<string, unknown>>;
  subject: string | null;
  booking_id: string | null;
  user_id: string | null;
  state: Generated<MailState>;
  attempts: Generated<number>;
  last_error: string | null;
  dedupe_key: string | null;
  created_at: Timestamp;
  sent_at: NullableTimestamp;
  claimed_at: NullableTimestamp;
  last_attempt_at: NullableTimestamp;
  resent_from_id: string | null;
}

export interface BuilderAbsencesTable {
  id: Generated<string>;
  builder_id: string;
  starts_on: CalendarDay;
  ends_on: CalendarDay;
  reason: string;
  created_at: Generated<Date>;
}

export interface CalendarFeedsTable {
  id: Generated<string>;
  /** null: the whole shop's feed. */
  builder_id: string | null;
  generation: Generated<number>;
  rotated_at: NullableTimestamp;
  rotated_by: string | null;
  created_at: Generated<Date>;
}

export interface SavedConfigurationsTable {
  id: Generated<string>;
  owner_id: string;
  name: string;
  configuration: JSONColumnType<RigConfiguration>;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
}

export interface ConfigurationLinksTable {
  code: string;
  digest: string;
  configuration: JSONColumnType<RigConfiguration>;
  created_at: Generated<Date>;
  last_opened_at: Date | null;
}

export type ReminderKindColumn = 'shipBy' | 'balanceUnpaid' | 'checkoutAbandoned' | 'requestExpiry';

export interface ReminderSettingsTable {
  kind: ReminderKindColumn;
  enabled: boolean;
  /** Days, or hours for an unfinished checkout. */
  amount: number;
  updated_at: Timestamp;
  updated_by: string | null;
}

/** One reminder sent (or one request expired); unique per kind, booking and event. */
export interface RemindersTable {
  id: Generated<string>;
  kind: ReminderKindColumn;
  booking_id: string;
  event_key: string;
  due_at: Timestamp;
  sent_at: Timestamp;
}

export interface DB {
  reminder_settings: ReminderSettingsTable;
  reminders: RemindersTable;
  calendar_feeds: CalendarFeedsTable;
  saved_configurations: SavedConfigurationsTable;
  configuration_links: ConfigurationLinksTable;
  builder_absences: BuilderAbsencesTable;
  shop_settings: ShopSettingsTable;
  users: UsersTable;
  auth_tokens: AuthTokensTable;
  sessions: SessionsTable;
  rate_limits: RateLimitsTable;
  builders: BuildersTable;
  shop_closures: ShopClosuresTable;
  shop_holiday_choices: ShopHolidayChoicesTable;
  price_book_versions: PriceBookVersionsTable;
  bookings: BookingsTable;
  quotes: QuotesTable;
  booking_events: BookingEventsTable;
  payments: PaymentsTable;
  payment_events: PaymentEventsTable;
  booking_extras: BookingExtrasTable;
  layout_approvals: LayoutApprovalsTable;
  photos: PhotosTable;
  intake_items: IntakeItemsTable;
  time_entries: TimeEntriesTable;
  bench_allocations: BenchAllocationsTable;
  mail_outbox: MailOutboxTable;
  build_messages: BuildMessagesTable;
  message_read_markers: MessageReadMarkersTable;
  message_notices: MessageNoticesTable;
}

/** The database as its own DI token: inject `Database` anywhere a Kysely instance is needed. */
export class Database extends Kysely<DB> {}

/** Repository methods take either the database or an open transaction. */
export type Executor = Kysely<DB>;
