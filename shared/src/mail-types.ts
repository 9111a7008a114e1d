import type { Page } from './booking-types';

/** Where an outgoing message stands. */
export const mailStates = ['queued', 'sending', 'sent', 'failed'] as const;
export type MailState = (typeof mailStates)[number];

/** Plain words for each state, shown in the mail log (words first; colour only supports them). */
export const mailStateLabels: Record<MailState, string> = {
  queued: 'Waiting to go out',
  sending: 'Being handed to the mail server',
  sent: 'Sent',
  failed: 'Not sent',
};

/** One row of GET /api/mail. */
export interface MailLogEntry {
  id: string;
  messageId: string;
  template: string;
  to: string;
  subject: string | null;
  state: MailState;
  attempts: number;
  lastError: string | null;
  bookingId: string | null;
  /** Set on a resend: the message this one repeats. */
  resentFromId: string | null;
  createdAt: string;
  sentAt: string | null;
}

/** GET /api/mail?page=1&pageSize=25&state=failed&q=player — newest first. */
export interface MailLogPage extends Page<MailLogEntry> {
  /** Whether the signed-in person may resend (the owner). */
  canResend: boolean;
}

export interface MailLogQuery {
  page?: number;
  pageSize?: number;
  state?: MailState;
  /** Part of the recipient's address. */
  q?: string;
}
