import { z } from 'zod';
import { rules } from './words';
import type { Page } from './booking-types';

/**
 * Where an outgoing message stands. 'unknown': the sender stopped while the mail server had the
 * message, before its answer was recorded, so it may or may not have arrived. It is never sent
 * again by itself; only the owner can, after a warning.
 */
export const mailStates = ['queued', 'sending', 'sent', 'failed', 'unknown'] as const;
export type MailState = (typeof mailStates)[number];

/** Plain words for each state, shown in the mail log (words first; colour only supports them). */
export const mailStateLabels: Record<MailState, string> = {
  queued: 'Waiting to go out',
  sending: 'Being handed to the mail server',
  sent: 'Sent',
  failed: 'Not sent',
  unknown: 'May have arrived (outcome unknown)',
};

/**
 * The data keys that carry a single-use link (a password reset, a staff invitation), by template.
 * The link's token is removed from the outbox once the message is sent or given up on, so a copy
 * of the database holds no usable link; a resend of such a message makes a fresh link instead.
 */
export const singleUseLinkKeys: Readonly<Record<string, readonly string[]>> = {
  'password-reset': ['resetUrl'],
  // `acceptUrl` is the name rows written before one key per datum carry.
  'staff-invite': ['inviteUrl', 'acceptUrl'],
};

/** POST /api/mail/:id/resend. */
export const resendMailSchema = z
  .object({
    /**
     * Required (true) to resend a message whose outcome is unknown: the recipient may already have
     * it, and this sends a second copy.
     */
    confirmPossibleDuplicate: z.boolean({ message: rules.yesNo('Confirm a second copy') }).optional(),
  })
  .strict()
  // No body at all is the same as {}: an ordinary resend.
  .optional();
export type ResendMailInput = z.infer<typeof resendMailSchema>;

export const mailMessages = {
  unknownNeedsConfirmation:
    'This message may already have arrived: the mail server had it when the sender stopped, and its answer was never recorded. ' +
    'Ask the recipient before sending it again; to send a second copy anyway, confirm the resend.',
} as const;

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
  /** The previous page's `nextCursor`. */
  cursor?: string;
}
