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
