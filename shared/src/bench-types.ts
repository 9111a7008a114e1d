import type { BuilderRef, PaymentView, PersonRef, Page } from './booking-types';
import type { BookingState, BuilderLevel, WeeklyHours } from './domain';
import type { ShopIdentity } from './api-types';

/**
 * Shapes of the bench, builds, team, settings and customers routes. Hours are plain numbers
 * (two decimals at most); money stays a decimal string; days are 'YYYY-MM-DD'.
 */

/** One build's share of one builder's day on the bench. */
export interface BenchBuild {
  bookingId: string;
  reference: string;
  customerName: string;
  state: BookingState;
  hours: number;
  /** The build's own bench date (its first day), for moving it. */
  benchDate: string | null;
}

/** Why a day holds no bench time, in words ("Thanksgiving Day", "Shop closed: stocktake", "Day off"). */
export type BenchDayOff = { kind: 'holiday' | 'closure' | 'day_off' | 'absence'; label: string } | null;

export interface BenchDay {
  date: string;
  capacityHours: number;
  bookedHours: number;
  freeHours: number;
  /** Hours builders recorded against builds on this day (time entries), beside the hours planned. */
  recordedHours: number;
  off: BenchDayOff;
  builds: BenchBuild[];
}

export interface BenchBuilder extends BuilderRef {
  /** The builder's hourly rate; null for a builder looking at a colleague (only the owner sees every rate). */
  hourlyRate: string | null;
  weeklyHours: WeeklyHours;
  active: boolean;
  /** The signed-in builder's own row (listed first). */
  isMe: boolean;
}

/** GET /api/bench?from=&to=&builderId= */
export interface BenchView {
  from: string;
  to: string;
  builders: Array<{ builder: BenchBuilder; days: BenchDay[] }>;
}

/** One day of a build's bench plan: the day and the hours spent on it then. */
export interface BenchPlanDay {
  date: string;
  hours: number;
}

/** One builder's earliest start for a build (GET /api/bench/suggest?bookingId=&builderId=). */
export interface BenchSuggestion {
  builder: BenchBuilder;
  benchDate: string;
  expectedCompletion: string;
  /** When the player should ship or drop off their pedals (a few working days before). */
  shipBy: string;
  /** Each day the build would take and how many hours on it. */
  plan: BenchPlanDay[];
  /** Builder's rate × labor hours (decimal string), and that plus materials. */
  laborTotal: string;
  firmTotal: string;
  /** False when the builder is below the rig's minimum level (only the owner may assign, with a reason). */
  meetsMinimumLevel: boolean;
  /** False when the builder is below the level the player chose (or the rig's minimum): owner only, with a reason. */
  meetsChosenLevel: boolean;
  /** True when this builder's firm total is above the high end the player was quoted: the player must consent. */
  aboveQuotedRange: boolean;
}

export interface BenchSuggestResponse {
  bookingId: string;
  reference: string;
  laborHours: number;
  minimumLevel: BuilderLevel;
  /** The level the player chose in the configurator (never below the rig's minimum). */
  chosenLevel: BuilderLevel;
  /** The high end of the estimate the player was quoted. */
  quotedHigh: string;
  currency: string;
  materialsTotal: string;
  deposit: string;
  /** Eligible builders, those of the chosen level or above first, then earliest start (the signed-in builder first on a tie). */
  suggestions: BenchSuggestion[];
  /** Builders left out, and why in words. */
  ineligible: Array<{ builder: BuilderRef; reason: string }>;
}

/** POST /api/bookings/:id/accept */
export interface AcceptBookingRequest {
  builderId: string;
  benchDate: string;
  /** Owner only: assign a builder below the rig's minimum level. */
  levelOverrideReason?: string;
}

export interface AcceptBookingResponse {
  bookingId: string;
  state: 'scheduled';
  builderId: string;
  benchDate: string;
  expectedCompletion: string;
  shipBy: string;
  plan: BenchPlanDay[];
  firmQuote: {
    id: string;
    hourlyRate: string;
    laborHours: string;
    laborTotal: string;
    materialsTotal: string;
    total: string;
    deposit: string;
    balanceDue: string;
    currency: string;
  };
}

/** Why a bench date cannot be chosen, in a word a dialog can explain. */
export type BenchDateRefusal = 'full' | 'closed' | 'holiday' | 'day_off' | 'away' | 'too_soon_to_ship' | 'past' | 'no_capacity';

/**
 * GET /api/bench/preview?bookingId=&benchDate=&builderId= : what choosing this day would mean for
 * each builder, before anything is submitted.
 */
export interface BenchPreview {
  bookingId: string;
  reference: string;
  benchDate: string;
  /** The shop's today, and the earliest bench date the player could still ship in time for. */
  today: string;
  earliestShippableDate: string;
  /** The build's current bench date (when it already has one). */
  currentBenchDate: string | null;
  options: BenchPreviewOption[];
}

export interface BenchPreviewOption {
  builder: BenchBuilder;
  ok: boolean;
  refusal: BenchDateRefusal | null;
  /** Why not, in words ("Shop closed: stocktake", "The pedals could not arrive in time: …"). */
  message: string | null;
  /** This builder's load on the days the build would take (or on the chosen day when it cannot start). */
  load: Array<{ date: string; capacityHours: number; bookedHours: number; thisBuildHours: number; off: BenchDayOff }>;
  expectedCompletion: string | null;
  shipBy: string;
  firmTotal: string;
  meetsChosenLevel: boolean;
  aboveQuotedRange: boolean;
  /** The first day on or after the chosen one that holds the build for this builder. */
  nextPossibleDate: string | null;
}

/** POST /api/bookings/:id/reschedule */
export interface RescheduleRequest {
  builderId: string;
  benchDate: string;
  reason: string;
  reprice?: boolean;
  levelOverrideReason?: string;
}

export interface RescheduleResponse {
  bookingId: string;
  builderId: string;
  benchDate: string;
  previousBenchDate: string | null;
  expectedCompletion: string;
  shipBy: string | null;
  plan: BenchPlanDay[];
  /** "3 days later", "2 days earlier" or "same day". */
  shift: string;
  firmTotal: string;
  repriced: boolean;
  priceConsent: 'pending' | 'given' | null;
  calendarSequence: number;
}

/** GET /api/bookings/:id/cancellation: what cancelling a scheduled build would refund, per the policy. */
export interface CancellationPreview {
  bookingId: string;
  reference: string;
  state: BookingState;
  currency: string;
  depositPaid: string;
  /** Refund for each cause, and the policy words behind it. */
  refundIfPlayerAsked: string;
  refundIfShopCancels: string;
  policy: string;
  benchHours: number;
}

/** A build already on the bench in days that just closed, and which of its days they are (it does not move by itself). */
export interface BuildOnBenchThen {
  bookingId: string;
  reference: string;
  days: string[];
}

export interface BuilderAbsenceView {
  id: string;
  builderId: string;
  startsOn: string;
  endsOn: string;
  reason: string;
}

/** POST /api/team/:builderId/absences: the absence, and the builds it hits (they move through the reschedule route). */
export interface AddAbsenceResponse extends BuilderAbsenceView {
  buildsOnBenchThen: BuildOnBenchThen[];
}

/** POST /api/bookings/:id/decline answers with the booking's BookingDetail. */
export interface DeclineBookingRequest {
  reason: string;
}

/** The moves a build makes on the bench, in order. */
export const benchStates = ['scheduled', 'pedals_received', 'on_bench', 'testing', 'ready', 'delivered'] as const;
export type BenchState = (typeof benchStates)[number];

/** Allowed moves through POST /api/bookings/:id/state (testing may go back to the bench for a fix). */
export const benchTransitions: Record<BenchState, BenchState[]> = {
  scheduled: ['pedals_received'],
  pedals_received: ['on_bench'],
  on_bench: ['testing'],
  testing: ['ready', 'on_bench'],
  ready: ['delivered'],
  delivered: [],
};

export interface ChangeStateRequest {
  to: BenchState;
  note?: string;
  /** Tell the player the note (by e-mail and on their page); otherwise it stays internal. */
  tellPlayer?: boolean;
}

export interface BookingStateResponse {
  bookingId: string;
  state: BookingState;
  awaitingLayoutApproval: boolean;
}

export interface TimeEntryView {
  id: string;
  builder: BuilderRef;
  workedOn: string;
  hours: number;
  note: string;
  createdAt: string;
  updatedAt: string | null;
  /** Who wrote the entry (null for entries older than authorship); they and the owner may correct it. */
  recordedBy: { id: string; name: string } | null;
}

/** POST /api/bookings/:id/notes: the note is on the build's history; `told` when it was also e-mailed to the player. */
export interface StaffNoteAdded {
  bookingId: string;
  told: boolean;
}

export interface TimeEntriesResponse {
  entries: TimeEntryView[];
  totalHours: number;
  /** The hours the firm quote planned, for "spent vs planned". */
  plannedHours: number | null;
}

export interface IntakeItemView {
  id: string;
  /** The item's place in the rig: 'chain:<n>', 'switcher', 'supply' or 'other:<name>'. */
  key: string;
  item: string;
  condition: 'working' | 'faulty';
  note: string;
  recordedBy: string;
  createdAt: string;
  updatedAt: string | null;
}

/** How a decision reached the shop: the player in the app, or staff recording it. */
export type DecidedVia = 'app' | 'phone' | 'in_person' | 'email';

/** Who decided, and how: shown in the history and beside the extra or layout. */
export interface DecisionView {
  approved: boolean;
  via: DecidedVia;
  /** The person who gave the answer (the player, or whom staff spoke to). */
  givenBy: string;
  /** The staff member who recorded it, when it was not the player in the app. */
  recordedBy: string | null;
  comment: string;
  at: string;
}

export interface ExtraView {
  id: string;
  description: string;
  amount: string;
  reason: string;
  status: 'proposed' | 'approved' | 'declined';
  decidedAt: string | null;
  decision: DecisionView | null;
  createdAt: string;
}

export interface LayoutApprovalView {
  id: string;
  status: 'waiting' | 'approved' | 'declined';
  /** The builder's words to the player with the top view. */
  message: string;
  requestedBy: string | null;
  decision: DecisionView | null;
  createdAt: string;
}

/**
 * Where a team member stands: `invited` until they accept the invitation and choose a password
 * (they take no builds until then), `active` taking builds, `inactive` switched off by the owner.
 */
export const teamMemberStatuses = ['invited', 'active', 'inactive'] as const;
export type TeamMemberStatus = (typeof teamMemberStatuses)[number];

/** GET /api/team */
export interface TeamMember extends BuilderRef {
  email: string;
  /** Null for a builder looking at a colleague: only the owner sees every rate, a builder their own. */
  hourlyRate: string | null;
  weeklyHours: WeeklyHours;
  weeklyCapacityHours: number;
  active: boolean;
  status: TeamMemberStatus;
  /** The signed-in person's own row. */
  isMe: boolean;
  /** While invited: when the latest invitation link stops working (ISO time), else null. */
  invitationExpiresAt: string | null;
}

/** POST /api/invitations/:builderId/resend: a fresh link went out and the older one stopped working. */
export interface InvitationResent {
  builderId: string;
  email: string;
  expiresAt: string;
}

export interface UpdateTeamMemberRequest {
  level?: BuilderLevel;
  hourlyRate?: string;
  weeklyHours?: WeeklyHours;
  active?: boolean;
}

export interface ShopClosureView {
  id: string;
  startsOn: string;
  endsOn: string;
  reason: string;
}

/** POST /api/settings/closures: the closure, and builds already on the bench in those days (they do not move by themselves). */
export interface AddClosureResponse extends ShopClosureView {
  buildsOnBenchThen: BuildOnBenchThen[];
}

/** The shop's postal address as stored: lines the owner left empty are empty strings (the country is the shop's countryCode). */
export interface PostalAddress {
  line1: string;
  line2: string;
  city: string;
  region: string;
  postalCode: string;
}

/** GET /api/settings */
export interface ShopSettingsView extends ShopIdentity {
  /** Where players ship or drop off their pedals; null until the owner fills it in. */
  postalAddress: PostalAddress | null;
  closures: ShopClosureView[];
  /**
   * The public holidays of the shop's country in the coming twelve months (date-holidays); the
   * bench is closed on each unless the owner switched that one off (`shopWorks`).
   */
  upcomingHolidays: UpcomingHoliday[];
  /** The owner's latest choices about single holidays, newest first (who, when, which way). */
  holidayHistory: HolidayChoiceView[];
}

export interface UpcomingHoliday {
  date: string;
  name: string;
  /** True when the owner switched this holiday off: the shop works and the bench is open that day. */
  shopWorks: boolean;
}

export interface HolidayChoiceView {
  day: string;
  name: string;
  shopWorks: boolean;
  decidedBy: string | null;
  decidedAt: string;
}

/** PUT /api/settings/holidays/:day answer; closing a day again lists builds already on the bench then. */
export interface HolidayChoiceResponse extends HolidayChoiceView {
  buildsOnBenchThen: BuildOnBenchThen[];
}

export interface UpdateShopSettingsRequest {
  name?: string;
  tagline?: string;
  contactEmail?: string;
  countryCode?: string;
  timezone?: string;
  locale?: string;
  postalAddress?: { line1: string; line2?: string; city: string; region?: string; postalCode: string };
}

/** GET /api/customers?page=&pageSize=&sort=name|email|createdAt|buildCount&order=asc|desc&search= */
export interface CustomerSummary extends PersonRef {
  phone: string | null;
  createdAt: string;
  buildCount: number;
  activeBuildCount: number;
  lastBookingAt: string | null;
}
export type CustomerPage = Page<CustomerSummary>;

export interface CustomerDetail extends CustomerSummary {
  builds: Array<{
    id: string;
    reference: string;
    state: BookingState;
    benchDate: string | null;
    createdAt: string;
  }>;
  payments: Array<{
    id: string;
    bookingId: string;
    reference: string;
    kind: 'deposit' | 'balance';
    amount: string;
    currency: string;
    status: PaymentView['status'];
    paidAt: string | null;
    createdAt: string;
  }>;
  messages: Array<{
    id: string;
    template: string;
    subject: string | null;
    /** Null for a builder looking at a customer none of whose builds is theirs. */
    toAddress: string | null;
    state: string;
    bookingId: string | null;
    createdAt: string;
    sentAt: string | null;
  }>;
}

/**
 * What a player sees before paying: the earliest day a builder of the level the rig is priced at
 * could start it, when it would be done, and by when the pedals should arrive. No builder is named.
 */
export interface BenchLeadTime {
  laborHours: string;
  level: BuilderLevel;
  earliestBenchDate: string | null;
  expectedCompletion: string | null;
  shipBy: string | null;
  /** Why there is no date, in words, when there is none. */
  message?: string;
}
