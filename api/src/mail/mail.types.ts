/**
 * Every message Loomwright sends, by template name. Callers enqueue by name with the data the
 * template needs; the mail module renders and delivers from the outbox.
 */
export const mailTemplates = [
  'welcome',
  'password-reset',
  'password-changed',
  'staff-invite',
  'booking-requested',
  'deposit-received',
  'booking-scheduled',
  'booking-rescheduled',
  'booking-cancelled',
  'status-changed',
  'balance-requested',
  'deposit-refunded',
  'booking-declined',
  'shop-new-paid-request',
  'approval-requested',
  'shop-note',
  'payment-failed',
  'shop-payment-alert',
  'configuration-quote',
  'build-messages',
  'ship-by-reminder',
  'shop-ship-by-reminder',
  'balance-reminder',
  'checkout-reminder',
  'request-expired',
] as const;
export type MailTemplate = (typeof mailTemplates)[number];

export const isMailTemplate = (name: string): name is MailTemplate => (mailTemplates as readonly string[]).includes(name);

/**
 * One message for the outbox, typed by its template: `data` is exactly what that template reads
 * (MailTemplateData below), so a missing or misspelt key fails to compile at the caller.
 * `OutgoingMail` alone is the union over every template, discriminated by `template`.
 */
export type OutgoingMail<T extends MailTemplate = MailTemplate> = {
  [K in T]: {
    template: K;
    to: string;
    /** What the template reads: names, dates, amounts as decimal strings, links. */
    data: MailTemplateData[K];
    bookingId?: string | null;
    userId?: string | null;
    /** Makes "send this once" idempotent: a second enqueue with the same key is ignored. */
    dedupeKey?: string;
  };
}[T];

/*
 * What each template reads from `data`, one key name per datum. Amounts are decimal strings
 * ("1120.00") in `currency` (ISO 4217); calendar days are 'YYYY-MM-DD'; instants are ISO 8601
 * strings; links are absolute URLs. The recipient is `name`. Where a booking page link
 * (`bookingUrl`) is not given, the message links to PUBLIC_URL/builds/<the outbox row's bookingId>.
 * Rows already in the outbox under the older key names are read through `upgradeMailData`
 * (templates/upgrade-data.ts). A stored row whose data lacks a required key is not sent: the mail
 * log shows it as failed, naming the key.
 */
type Recipient = { name: string };
/** One line item as a quote e-mail lists it; amounts are decimal strings, a labor line a range. */
export type QuoteMailLine = { label: string; quantity?: string; amount: string; amountHigh?: string };
type BookingLink = { bookingUrl?: string };

export type MailTemplateData = {
  welcome: Recipient & { configureUrl?: string; signInUrl?: string; accountUrl?: string };
  'password-reset': Recipient & { resetUrl: string; expiresAt: string };
  /** Sent after every password change (signed in, or through a reset link): the owner of the address hears of it. */
  'password-changed': Recipient & { changedAt: string; how: 'signed-in' | 'reset-link'; forgotPasswordUrl: string };
  'staff-invite': Recipient & {
    /** The single-use link that sets the builder's first password. */
    inviteUrl: string;
    invitedBy?: string;
    level?: 'apprentice' | 'journeyman' | 'master';
    role?: 'builder' | 'owner';
    expiresAt?: string;
  };
  'booking-requested': Recipient &
    BookingLink & {
      reference: string;
      totalLow: string;
      totalHigh: string;
      deposit: string;
      currency: string;
      quoteExpiresAt?: string;
      /** The estimate's line items, in the quote's order. */
      lines?: QuoteMailLine[];
      /** GET /api/bookings/:id/quote.pdf, opened signed in. */
      quotePdfUrl?: string;
    };
  /** Any configuration's quote, sent on request to the signed-in person, with the PDF attached. */
  'configuration-quote': Recipient & {
    title?: string;
    currency: string;
    totalLow: string;
    totalHigh: string;
    deposit: string;
    priceBookVersion?: string;
    lines: QuoteMailLine[];
    /** The PDF, base64. */
    pdfBase64: string;
    pdfFilename?: string;
    /** The short link that reopens the configuration in the configurator. */
    openUrl?: string;
  };
  /** "What happens next" is the template's own text. */
  'deposit-received': Recipient & BookingLink & { reference: string; amount: string; currency: string; expectedBenchDate?: string };
  'booking-scheduled': Recipient &
    BookingLink & {
      reference: string;
      benchDate: string;
      /** The day the pedals must arrive at (or be dropped off at) the shop: the calendar file's day. */
      shipBy: string;
      builderLevel: 'apprentice' | 'journeyman' | 'master';
      builderName?: string;
      expectedCompletion: string;
      /** 'ship' (default) or 'drop-off'. */
      handover?: 'ship' | 'drop-off';
      /** What to send, line by line (pedals by name, supply, switcher). */
      whatToShip: string[];
      /** Where to ship or drop off; defaults to the shop's name and contact address. */
      shipTo?: string;
      /** Shown when `currency` is given. */
      firmTotal?: string;
      deposit?: string;
      balanceDue?: string;
      currency?: string;
      /** The estimate's high end; with `priceConsentNeeded` the letter asks the player to agree to the firm total. */
      quotedHigh?: string;
      priceConsentNeeded?: boolean;
      /** Why a builder below the chosen level builds it (the owner's words). */
      levelOverrideReason?: string;
      /** RFC 5545 SEQUENCE of the calendar file (0 first, then one more per revision). */
      calendarSequence?: number;
      /** True once the pedals are at the shop: no shipping day, no calendar file. */
      pedalsReceived?: boolean;
    };
  /** As booking-scheduled, plus where the build moved from and why; the calendar file keeps its UID with a higher SEQUENCE. */
  'booking-rescheduled': MailTemplateData['booking-scheduled'] & { previousBenchDate: string; shift: string; reason: string };
  'booking-cancelled': Recipient &
    BookingLink & {
      reference: string;
      reason: string;
      currency: string;
      refundAmount?: string | null;
      keptAmount?: string | null;
      /** The ship-by day of the calendar event to withdraw (omit when the pedals are already in). */
      shipBy?: string | null;
      calendarSequence?: number;
      pedalsAtShop?: boolean;
    };
  'status-changed': Recipient &
    BookingLink & {
      reference: string;
      /** The new state; pedals_received, on_bench, testing, ready and delivered have their own words. */
      state: string;
      fromState?: string;
      note?: string;
      /** For pedals_received: items found faulty at intake. */
      faultyItems?: { item: string; note?: string }[];
      /** For delivered: the outbound carrier and tracking number. */
      tracking?: string;
    };
  'balance-requested': Recipient &
    BookingLink & {
      reference: string;
      currency: string;
      /** The amount due. */
      balanceDue: string;
      firmTotal?: string;
      extras?: string;
      /** Net of refunds. */
      paidSoFar?: string;
      payUrl?: string;
    };
  'deposit-refunded': Recipient & { reference: string; amount: string; currency: string };
  'booking-declined': Recipient & {
    reference: string;
    reason: string;
    depositRefunded?: boolean;
    refundAmount?: string | null;
    refundPending?: boolean;
    currency?: string | null;
  };
  /** An extra (kind 'extra': description, amount, currency, reason) or a layout (kind 'layout': message) for the player to answer. */
  'approval-requested': Recipient &
    BookingLink & {
      reference: string;
      kind: 'extra' | 'layout';
      description?: string;
      amount?: string;
      currency?: string;
      reason?: string;
      message?: string;
      approveUrl?: string;
    };
  /**
   * New messages on a build's conversation, gathered over the mail window: to the player
   * (`audience` 'player', link to the storefront's build page) or to the shop (`audience` 'shop',
   * the assigned builder or the shop's address, with `playerName` and a link to the backoffice).
   * `at` is an instant; `photos` how many photos the message carries.
   */
  'build-messages': Recipient &
    BookingLink & {
      audience: 'player' | 'shop';
      reference: string;
      playerName?: string;
      messages: { author: string; body: string; at: string; photos?: number }[];
    };
  /** A staff note the writer chose to tell the player, word for word. */
  'shop-note': Recipient & BookingLink & { reference: string; note: string };
  /** A bank debit that failed after the checkout: the player is asked to pay again. */
  'payment-failed': Recipient &
    BookingLink & { reference: string; amount: string; currency: string; reason: string; kind?: 'deposit' | 'balance' };
  /**
   * To the shop's owner at once: something about money needs a decision. `alert` is
   * refund-failed, dispute-opened, dispute-won, dispute-lost or outside-refund.
   */
  'shop-payment-alert': Recipient & {
    alert: 'refund-failed' | 'dispute-opened' | 'dispute-won' | 'dispute-lost' | 'outside-refund';
    reference: string;
    amount: string;
    currency: string;
    detail: string;
    backofficeUrl: string;
  };
  /** Reminders (api/src/reminders/): the ship-by day is `daysLeft` away and no tracking number is recorded. */
  'ship-by-reminder': Recipient & BookingLink & { reference: string; shipBy: string; benchDate: string; daysLeft: number };
  /** The same, to the build's builder (or the shop's address when nobody is assigned). */
  'shop-ship-by-reminder': Recipient & { reference: string; playerName: string; shipBy: string; benchDate: string; backofficeUrl: string };
  /** A balance still unpaid some days after the board became ready (`readySince`, a calendar day). */
  'balance-reminder': Recipient &
    BookingLink & { reference: string; balanceDue: string; currency: string; readySince: string; payUrl?: string };
  /** A checkout opened and not finished. */
  'checkout-reminder': Recipient &
    BookingLink & { reference: string; kind: 'deposit' | 'balance'; amount: string; currency: string; payUrl?: string };
  /** An unpaid request closed after the shop's set number of days. */
  'request-expired': Recipient & { reference: string; days: number; configureUrl?: string };
  /** To the shop; the player is `name`. */
  'shop-new-paid-request': Recipient & {
    reference: string;
    customerEmail: string;
    amount: string;
    currency: string;
    totalLow?: string;
    totalHigh?: string;
    backofficeUrl: string;
  };
};
