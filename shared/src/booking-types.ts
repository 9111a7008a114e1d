import type { BookingState, BuilderLevel } from './domain';
import type { ExtraView, LayoutApprovalView } from './bench-types';
import type { EstimateLine, EstimateResult, RigConfiguration } from './estimate/types';
import type { MoneyFacts } from './money/money-facts';

/** A page of a server-side paginated list: ?page=1&pageSize=25&sort=created_at&order=desc. */
export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
  /** Where a list with keyset paging (GET /api/bookings, GET /api/mail) goes on: pass it as `cursor`; null on the last page. */
  nextCursor?: string | null;
}

/**
 * A booking's deposit in one word: `processing` is a bank debit still settling; `disputed` is a
 * paid deposit the player's bank has disputed (a chargeback), until the bank decides for the shop.
 */
export const depositStatuses = ['unpaid', 'pending', 'processing', 'paid', 'disputed', 'refunded'] as const;
export type DepositStatus = (typeof depositStatuses)[number];

/** POST /api/bookings/:id/checkout: the hosted checkout to send the player to. */
export interface CheckoutOpened {
  url: string;
}

export interface PersonRef {
  id: string;
  name: string;
  /**
   * Null when the viewer may not see it: a builder looking at a customer none of whose builds is
   * theirs (see "Who may see and do what" in DEVELOPERS.md). The owner and the player always see it.
   */
  email: string | null;
}

export interface BuilderRef {
  id: string;
  userId: string;
  name: string;
  level: BuilderLevel;
}

/** One row of GET /api/bookings (players see their own, staff see all). */
export interface BookingSummary {
  id: string;
  reference: string;
  state: BookingState;
  customer: PersonRef;
  builder: BuilderRef | null;
  benchDate: string | null;
  expectedCompletion: string | null;
  currency: string;
  laborHours: string;
  totalLow: string;
  totalHigh: string;
  /** The firm total once a builder accepted (their rate × hours + materials), else null. */
  firmTotal: string | null;
  deposit: string;
  depositStatus: DepositStatus;
  pedalCount: number;
  routingMode: 'serial' | 'switcher';
  /** One line for tables: "12 pedals · switcher (8 loops) · stereo output". */
  summary: string;
  createdAt: string;
  updatedAt: string;
}

export interface QuoteView {
  id: string;
  kind: 'estimate' | 'firm';
  priceBookVersion: number;
  currency: string;
  estimate: EstimateResult;
  /**
   * The lines to show: an estimate's as priced (labor as a range); a firm quote's with labor at
   * the builder's one rate, so they add up to `total` to the cent.
   */
  lines: EstimateLine[];
  laborHours: string;
  totalLow: string;
  totalHigh: string;
  deposit: string;
  hourlyRate: string | null;
  laborTotal: string | null;
  total: string | null;
  expiresAt: string;
  createdAt: string;
}

export interface PaymentView {
  id: string;
  kind: 'deposit' | 'balance';
  amount: string;
  currency: string;
  /** `processing`: a bank debit that settles (or fails) in a few working days. */
  status: 'pending' | 'processing' | 'paid' | 'failed' | 'expired' | 'refunded';
  failureMessage: string | null;
  paidAt: string | null;
  refundedAt: string | null;
  createdAt: string;
  /** The provider's status of the latest refund, if one was asked for. */
  refundStatus: 'pending' | 'requires_action' | 'succeeded' | 'failed' | 'canceled' | null;
  refundFailure: string | null;
  dispute: PaymentDisputeView | null;
}

/** A chargeback the player's bank opened on a payment. */
export interface PaymentDisputeView {
  /** The provider's words: needs_response, under_review, won, lost, … */
  status: string;
  reason: string;
  amount: string;
  openedAt: string;
  /** When the owner decided the build may be delivered anyway (null: delivery waits). */
  releasedAt: string | null;
  releasedBy: string | null;
}

export interface BookingEventView {
  id: string;
  /** 'player': the player reads it; 'internal': staff only (never sent to the player's view). */
  visibility: 'player' | 'internal';
  fromState: BookingState | null;
  toState: BookingState;
  actor: string;
  note: string;
  at: string;
}

export interface PhotoView {
  id: string;
  kind: 'customer' | 'intake' | 'build';
  caption: string;
  contentType: string;
  /** GET this (with the session cookie) to see the image: re-encoded on upload, no camera metadata. */
  url: string;
  /** A copy at most 480 px on its long edge (WebP), for photo lists. */
  thumbnailUrl: string;
  /** Pixel size of `url`; null until a photo stored before re-encoding is first viewed. */
  width: number | null;
  height: number | null;
  createdAt: string;
}

export interface BookingDetail extends BookingSummary {
  configuration: RigConfiguration;
  customerNotes: string;
  quote: QuoteView;
  firmQuote: QuoteView | null;
  payments: PaymentView[];
  events: BookingEventView[];
  photos: PhotoView[];
  inbound: { carrier: string; tracking: string } | null;
  awaitingLayoutApproval: boolean;
  declineReason: string | null;
  cancelReason: string | null;
  /** Why a builder below the chosen level took the build (the player sees it beside the price). */
  levelOverrideReason: string | null;
  /** 'pending' while the player has not agreed to a firm total above the range they were quoted. */
  priceConsent: 'pending' | 'given' | null;
  /** Firm total + approved extras − net payments (never below zero), once a firm quote exists; `money.balanceDue`. */
  balanceDue: string | null;
  /** Extras the shop proposed, with the player's decision. */
  extras: ExtraView[];
  /** Layouts sent for the player's approval, newest last. */
  layoutApprovals: LayoutApprovalView[];
  /** Every money figure of the booking, from the one function both apps, the mails and the build sheet read. */
  money: MoneyFacts;
  /** Why delivery waits on the owner (a disputed payment), in words; null when nothing holds it. */
  deliveryHold: string | null;
}
