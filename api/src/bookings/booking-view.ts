import type {
  BookingDetail,
  BookingEventView,
  BookingState,
  BookingSummary,
  BuilderLevel,
  DecisionView,
  ExtraView,
  LayoutApprovalView,
  MoneyFacts,
  PaymentView,
  PhotoView,
  QuoteView,
  RigConfiguration,
} from '@loomwright/shared';
import { firmQuoteLines, formatMoney, fromProviderAmount } from '@loomwright/shared';
import type {
  BookingEventRow,
  BookingListRow,
  ExtraRow,
  LayoutApprovalRow,
  PaymentRow,
  PhotoRow,
  QuoteRow,
  QuoteSummaryRow,
} from './bookings.repository';

/** A numeric column (always two decimals in the database) in the currency's own digits: "181.00" JPY → "181". */
function amountIn(value: string, currency: string): string;
function amountIn(value: string | null, currency: string): string | null;
function amountIn(value: string | null, currency: string): string | null {
  return value === null || !currency ? value : formatMoney(value, currency);
}

// Timestamps arrive as Date from pg; the Generated<ColumnType> wrapper hides that from the type.
const iso = (d: unknown) => (d instanceof Date ? d : new Date(String(d))).toISOString();

export function pedalCountOf(config: RigConfiguration): number {
  return config.pedals?.length ?? config.pedalCount ?? 0;
}

/** One line for tables: "12 pedals · switcher (8 loops) · stereo output". */
export function summaryLine(config: RigConfiguration): string {
  const count = pedalCountOf(config);
  const parts = [`${count} ${count === 1 ? 'pedal' : 'pedals'}`];
  if (config.routing?.mode === 'switcher') {
    const loops = (config.pedals ?? []).filter((p) => p.inLoop).length;
    parts.push(`switcher (${loops} ${loops === 1 ? 'loop' : 'loops'})`);
  } else {
    parts.push('serial');
  }
  for (const code of config.functions ?? []) parts.push(code.replace(/[_-]+/g, ' '));
  return parts.join(' · ');
}

export function quoteView(row: QuoteRow): QuoteView {
  const currency = row.currency.trim();
  const firm = row.kind === 'firm' && row.hourly_rate !== null && row.labor_total !== null;
  return {
    id: row.id,
    kind: row.kind,
    priceBookVersion: row.price_book_version,
    currency,
    estimate: row.estimate,
    lines: firm ? firmQuoteLines(row.estimate.lines, row.hourly_rate!, row.labor_total!, currency) : row.estimate.lines,
    laborHours: row.labor_hours,
    totalLow: amountIn(row.total_low, currency),
    totalHigh: amountIn(row.total_high, currency),
    deposit: amountIn(row.deposit, currency),
    hourlyRate: amountIn(row.hourly_rate, currency),
    laborTotal: amountIn(row.labor_total, currency),
    total: amountIn(row.total, currency),
    expiresAt: iso(row.expires_at),
    createdAt: iso(row.created_at),
  };
}

export function paymentView(row: PaymentRow): PaymentView {
  return {
    id: row.id,
    kind: row.kind,
    amount: amountIn(row.amount, row.currency.trim()),
    currency: row.currency.trim(),
    status: row.status,
    failureMessage: row.failure_message,
    paidAt: row.paid_at ? iso(row.paid_at) : null,
    refundedAt: row.refunded_at ? iso(row.refunded_at) : null,
    createdAt: iso(row.created_at),
    refundStatus: row.refund_status,
    refundFailure: row.refund_failure,
    dispute: row.dispute_id
      ? {
          status: row.dispute_status ?? 'needs_response',
          reason: row.dispute_reason ?? '',
          amount: row.dispute_amount_minor ? fromProviderAmount(row.dispute_amount_minor, row.currency.trim()) : row.amount,
          openedAt: iso(row.dispute_opened_at ?? row.created_at),
          releasedAt: row.dispute_released_at ? iso(row.dispute_released_at) : null,
          releasedBy: row.dispute_released_by,
        }
      : null,
  };
}

/** Delivery waits while a payment of the booking is disputed and the owner has not decided; the words say why. */
export function deliveryHold(payments: PaymentRow[]): string | null {
  const held = payments.find((p) => p.dispute_id && !p.dispute_released_at);
  if (!held) return null;
  const what = held.kind === 'deposit' ? 'deposit' : 'balance';
  const state = held.dispute_status ?? 'needs_response';
  const outcome =
    state === 'won'
      ? 'the bank decided for the shop'
      : state === 'lost'
        ? 'the bank decided for the player and the money was taken back'
        : 'the bank has not decided yet';
  return `The player's bank disputed the ${what} (${(held.dispute_reason ?? 'no reason given').replace(/_/g, ' ')}); ${outcome}. Delivery waits until the owner decides.`;
}

export function eventView(row: BookingEventRow): BookingEventView {
  return {
    id: String(row.id),
    fromState: row.from_state as BookingState | null,
    toState: row.to_state as BookingState,
    visibility: row.visibility,
    actor: row.actor_label,
    note: row.note,
    at: iso(row.created_at),
  };
}

function decisionView(
  row: {
    decided_at: unknown;
    decided_via: DecisionView['via'] | null;
    decided_by_name: string | null;
    decision_comment: string;
    recorded_by_name: string | null;
  },
  approved: boolean,
): DecisionView | null {
  if (!row.decided_at || !row.decided_via) return null;
  return {
    approved,
    via: row.decided_via,
    givenBy: row.decided_by_name ?? '',
    recordedBy: row.recorded_by_name,
    comment: row.decision_comment,
    at: iso(row.decided_at),
  };
}

export function extraView(row: ExtraRow): ExtraView {
  return {
    id: row.id,
    description: row.description,
    amount: row.amount,
    reason: row.reason,
    status: row.status,
    decidedAt: row.decided_at ? iso(row.decided_at) : null,
    decision: decisionView(row, row.status === 'approved'),
    createdAt: iso(row.created_at),
  };
}

export function layoutApprovalView(row: LayoutApprovalRow): LayoutApprovalView {
  return {
    id: row.id,
    status: row.status,
    message: row.message,
    requestedBy: row.requested_by_name,
    decision: decisionView(row, row.status === 'approved'),
    createdAt: iso(row.created_at),
  };
}

export function photoView(row: PhotoRow): PhotoView {
  return {
    id: row.id,
    kind: row.kind,
    caption: row.caption,
    contentType: row.content_type,
    url: `/api/bookings/${row.booking_id}/photos/${row.id}`,
    thumbnailUrl: `/api/bookings/${row.booking_id}/photos/${row.id}/thumbnail`,
    width: row.width,
    height: row.height,
    createdAt: iso(row.created_at),
  };
}

/** The first estimate is the booking's quote; the newest firm quote (if any) is the firm one. */
export function pickQuotes<Q extends Pick<QuoteRow, 'kind'>>(quotes: Q[]): { estimate: Q | undefined; firm: Q | undefined } {
  return {
    estimate: quotes.find((q) => q.kind === 'estimate'),
    firm: [...quotes].reverse().find((q) => q.kind === 'firm'),
  };
}

export function summaryView(row: BookingListRow, quotes: QuoteSummaryRow[]): BookingSummary {
  const { estimate, firm } = pickQuotes(quotes);
  const config = row.configuration;
  const currency = (firm ?? estimate)?.currency.trim() ?? '';
  return {
    id: row.id,
    reference: row.reference,
    state: row.state,
    customer: { id: row.customer_id, name: row.customer_name, email: row.customer_email },
    builder:
      row.builder_id && row.builder_user_id
        ? { id: row.builder_id, userId: row.builder_user_id, name: row.builder_name ?? '', level: row.builder_level as BuilderLevel }
        : null,
    benchDate: row.bench_date,
    expectedCompletion: row.expected_completion,
    currency,
    laborHours: (firm ?? estimate)?.labor_hours ?? '0',
    totalLow: amountIn(estimate?.total_low ?? '0', currency),
    totalHigh: amountIn(estimate?.total_high ?? '0', currency),
    firmTotal: amountIn(firm?.total ?? null, currency),
    deposit: amountIn(estimate?.deposit ?? '0', currency),
    depositStatus: row.deposit_status,
    pedalCount: pedalCountOf(config),
    routingMode: config.routing?.mode === 'switcher' ? 'switcher' : 'serial',
    summary: summaryLine(config),
    createdAt: iso(row.created_at),
    updatedAt: iso(row.updated_at),
  };
}

export function detailView(
  row: BookingListRow,
  parts: {
    quotes: QuoteRow[];
    payments: PaymentRow[];
    events: BookingEventRow[];
    photos: PhotoRow[];
    extras: ExtraRow[];
    layoutApprovals: LayoutApprovalRow[];
    money: MoneyFacts;
  },
): BookingDetail {
  const { estimate, firm } = pickQuotes(parts.quotes);
  if (!estimate) throw new Error(`booking ${row.id} has no estimate quote`);
  return {
    ...summaryView(row, parts.quotes),
    configuration: row.configuration,
    customerNotes: row.customer_notes,
    quote: quoteView(estimate),
    firmQuote: firm ? quoteView(firm) : null,
    payments: parts.payments.map(paymentView),
    events: parts.events.map(eventView),
    photos: parts.photos.map(photoView),
    inbound:
      row.inbound_carrier || row.inbound_tracking ? { carrier: row.inbound_carrier ?? '', tracking: row.inbound_tracking ?? '' } : null,
    awaitingLayoutApproval: row.awaiting_layout_approval,
    declineReason: row.decline_reason,
    cancelReason: row.cancel_reason,
    levelOverrideReason: row.level_override_reason,
    priceConsent: row.price_consent,
    balanceDue: parts.money.balanceDue,
    extras: parts.extras.map(extraView),
    layoutApprovals: parts.layoutApprovals.map(layoutApprovalView),
    money: parts.money,
    deliveryHold: deliveryHold(parts.payments),
  };
}

/** What the player's own answer holds: the same booking without the shop's internal history lines. */
export function playerView(detail: BookingDetail): BookingDetail {
  return { ...detail, events: detail.events.filter((e) => e.visibility === 'player') };
}
