import { z } from 'zod';
import { requestObject, text } from './request-fields';

/**
 * Messages on a build: the player who owns the booking and the shop write to each other on the
 * build page. Internal staff notes are a different thing (the build's history) and never appear here.
 */
export const MESSAGE_MAX_CHARS = 4000;
/** Photos one message may carry (each checked like a booking photo: JPEG, PNG or WebP, 8 MB at most). */
export const MESSAGE_MAX_PHOTOS = 4;
/**
 * Messages written within this many minutes of the first one the other side has not been told
 * about go out as one e-mail.
 */
export const MESSAGE_MAIL_WINDOW_MINUTES = 5;

export const messageSides = ['player', 'shop'] as const;
export type MessageSide = (typeof messageSides)[number];

/**
 * POST /api/bookings/:id/messages: the text field beside the multipart `photos` (a multipart form, as the photo upload).
 * The text may be empty only when photos travel with it; the API says so in words otherwise.
 */
export const postMessageSchema = requestObject({
  body: text('body', { max: MESSAGE_MAX_CHARS }).default(''),
});
export type PostMessageInput = z.infer<typeof postMessageSchema>;

export interface MessagePhotoView {
  id: string;
  /** GET /api/bookings/:id/photos/:photoId and its /thumbnail: the booking's player and staff only. */
  url: string;
  thumbnailUrl: string;
  width: number | null;
  height: number | null;
}

export interface BuildMessageView {
  id: string;
  side: MessageSide;
  authorName: string;
  body: string;
  createdAt: string;
  /** Written by the one reading the thread. */
  mine: boolean;
  photos: MessagePhotoView[];
}

/** GET /api/bookings/:id/messages: the whole thread, oldest first; reading it marks it read for the reader's side. */
export interface MessageThreadView {
  bookingId: string;
  reference: string;
  /** The reader's side. */
  side: MessageSide;
  messages: BuildMessageView[];
  /** Messages from the other side the reader's side had not seen before this read. */
  unreadBefore: number;
}

/** GET /api/messages/unread: how many messages from the other side wait unread, per booking. */
export interface UnreadMessagesView {
  total: number;
  bookings: { bookingId: string; reference: string; unread: number }[];
}
