import type { BookingState, BuilderLevel } from './domain';
import type { EstimateResult, RigConfiguration } from './estimate/types';

/** A page of a server-side paginated list: ?page=1&pageSize=25&sort=created_at&order=desc. */
export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

export type DepositStatus = 'unpaid' | 'pending' | 'paid' | 'refunded';

export interface PersonRef {
  id: string;
  name: string;
  email: string;
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
  status: 'pending' | 'paid' | 'failed' | 'expired' | 'refunded';
  failureMessage: string | null;
  paidAt: string | null;
  refundedAt: string | null;
  createdAt: string;
}

export interface BookingEventView {
  id: string;
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
  /** Firm total + approved extras − deposit paid, once a firm quote exists. */
  balanceDue: string | null;
}
