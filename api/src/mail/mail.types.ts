/**
 * Every message Loomwright sends, by template name. Callers enqueue by name with the data the
 * template needs; the mail module renders and delivers from the outbox.
 */
export const mailTemplates = [
  'welcome',
  'password-reset',
  'staff-invite',
  'booking-requested',
  'deposit-received',
  'booking-scheduled',
  'status-changed',
  'balance-requested',
  'deposit-refunded',
  'booking-declined',
  'shop-new-paid-request',
] as const;
export type MailTemplate = (typeof mailTemplates)[number];

export interface OutgoingMail {
  template: MailTemplate;
  to: string;
  /** Whatever the template reads (names, dates, amounts as decimal strings, links). */
  data: Record<string, unknown>;
  bookingId?: string | null;
  userId?: string | null;
  /** Makes "send this once" idempotent: a second enqueue with the same key is ignored. */
  dedupeKey?: string;
}

/*
 * What each template reads from `data`. Amounts are decimal strings ("1120.00") in `currency`
 * (ISO 4217); calendar days are 'YYYY-MM-DD'; instants are ISO 8601 strings. `name` is the
 * recipient's name. Links are absolute URLs. A message whose data lacks a required key is not
 * sent: the mail log shows it as failed, naming the key.
 */
type Money = { amount: string; currency: string };

export interface MailTemplateData {
  welcome: { name: string; signInUrl?: string };
  'password-reset': { name: string; resetUrl: string; expiresAt: string };
  'staff-invite': { name: string; inviteUrl: string; role?: 'builder' | 'owner'; expiresAt?: string };
  'booking-requested': {
    name: string;
    reference: string;
    /** The estimate range and the deposit that holds the place in the queue. */
    totalLow: string;
    totalHigh: string;
    deposit: string;
    currency: string;
    bookingUrl: string;
  };
  'deposit-received': Money & {
    name: string;
    reference: string;
    bookingUrl: string;
    /** The expected bench date shown before payment, if there was one. */
    expectedBenchDate?: string;
  };
  'booking-scheduled': {
    name: string;
    reference: string;
    benchDate: string;
    /** The day the pedals must arrive at (or be dropped off at) the shop. */
    shipBy: string;
    builderLevel: 'apprentice' | 'journeyman' | 'master';
    builderName?: string;
    expectedCompletion: string;
    /** 'ship' (default) or 'drop-off'. */
    handover?: 'ship' | 'drop-off';
    /** The pedals by type or model, as the player listed them. */
    pedals: string[];
    /** Defaults: a power supply is always brought; a switcher only when the rig uses one. */
    powerSupply?: boolean;
    switcher?: boolean;
    /** Where to ship or drop off; defaults to the shop's contact line. */
    shipTo?: string;
    bookingUrl: string;
  };
  'status-changed': {
    name: string;
    reference: string;
    /** The new state: pedals_received, on_bench, testing, ready, delivered (others get a plain line). */
    state: string;
    note?: string;
    /** For delivered: the outbound carrier and tracking number, if shipped. */
    tracking?: string;
    bookingUrl: string;
  };
  'balance-requested': Money & { name: string; reference: string; payUrl: string };
  'deposit-refunded': Money & { name: string; reference: string };
  'booking-declined': { name: string; reference: string; reason: string; depositRefunded?: boolean };
  'shop-new-paid-request': Money & {
    reference: string;
    customerName: string;
    customerEmail: string;
    /** The estimate range, if known. */
    totalLow?: string;
    totalHigh?: string;
    backofficeUrl: string;
  };
}
