import Stripe from 'stripe';
import { fakeId } from './store';

/**
 * Whole provider objects, typed with the SDK's generated types (`Stripe.Checkout.Session`,
 * `Stripe.PaymentIntent`, `Stripe.Charge`, `Stripe.Refund`, `Stripe.Dispute`, `Stripe.Event`):
 * every field the contract marks required is present, so leaving one out fails to compile.
 * Nullable fields the fake has no use for are null, as the provider sends them.
 */

/** The API version the SDK pins; the fake speaks it and stamps it on every event. */
export const FAKE_API_VERSION: string = Stripe.API_VERSION;

export function newSession(fields: {
  id: string;
  created: number;
  expiresAt: number;
  amount: number;
  currency: string;
  metadata: Stripe.Metadata;
  clientReferenceId: string | null;
  customerEmail: string | null;
  successUrl: string;
  cancelUrl: string | null;
  url: string;
  paymentMethodTypes: string[];
}): Stripe.Checkout.Session {
  return {
    id: fields.id,
    object: 'checkout.session',
    adaptive_pricing: null,
    after_expiration: null,
    allow_promotion_codes: null,
    amount_subtotal: fields.amount,
    amount_total: fields.amount,
    automatic_tax: { enabled: false, liability: null, provider: null, status: null },
    billing_address_collection: null,
    cancel_url: fields.cancelUrl,
    client_reference_id: fields.clientReferenceId,
    client_secret: null,
    collected_information: null,
    consent: null,
    consent_collection: null,
    created: fields.created,
    currency: fields.currency,
    currency_conversion: null,
    custom_fields: [],
    custom_text: { after_submit: null, shipping_address: null, submit: null, terms_of_service_acceptance: null },
    customer: null,
    customer_account: null,
    customer_creation: 'if_required',
    customer_details: null,
    customer_email: fields.customerEmail,
    discounts: [],
    expires_at: fields.expiresAt,
    integration_identifier: null,
    invoice: null,
    invoice_creation: null,
    livemode: false,
    locale: null,
    managed_payments: null,
    metadata: fields.metadata,
    mode: 'payment',
    origin_context: null,
    payment_intent: null,
    payment_link: null,
    payment_method_collection: 'if_required',
    payment_method_configuration_details: null,
    payment_method_options: {},
    payment_method_types: fields.paymentMethodTypes,
    payment_status: 'unpaid',
    permissions: null,
    recovered_from: null,
    saved_payment_method_options: null,
    setup_intent: null,
    shipping_address_collection: null,
    shipping_cost: null,
    shipping_options: [],
    status: 'open',
    submit_type: null,
    subscription: null,
    success_url: fields.successUrl,
    total_details: { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
    ui_mode: 'hosted',
    url: fields.url,
    wallet_options: null,
  };
}

export function newIntent(fields: {
  created: number;
  amount: number;
  currency: string;
  metadata: Stripe.Metadata;
  paymentMethodTypes: string[];
  receiptEmail: string | null;
}): Stripe.PaymentIntent {
  const id = fakeId('pi');
  return {
    id,
    object: 'payment_intent',
    allowed_payment_method_types: null,
    amount: fields.amount,
    amount_capturable: 0,
    amount_received: 0,
    application: null,
    application_fee_amount: null,
    automatic_payment_methods: null,
    canceled_at: null,
    cancellation_reason: null,
    capture_method: 'automatic',
    client_secret: `${id}_secret_${fakeId('s').slice(-12)}`,
    confirmation_method: 'automatic',
    created: fields.created,
    currency: fields.currency,
    customer: null,
    customer_account: null,
    description: null,
    excluded_payment_method_types: null,
    last_payment_error: null,
    latest_charge: null,
    livemode: false,
    managed_payments: null,
    metadata: fields.metadata,
    next_action: null,
    on_behalf_of: null,
    payment_method: null,
    payment_method_configuration_details: null,
    payment_method_options: {},
    payment_method_types: fields.paymentMethodTypes,
    processing: null,
    receipt_email: fields.receiptEmail,
    review: null,
    setup_future_usage: null,
    shipping: null,
    source: null,
    statement_descriptor: null,
    statement_descriptor_suffix: null,
    status: 'requires_payment_method',
    transfer_group: null,
  };
}

export function newCharge(
  intent: Stripe.PaymentIntent,
  fields: { created: number; method: string; status: Stripe.Charge.Status },
): Stripe.Charge {
  const succeeded = fields.status === 'succeeded';
  return {
    id: fakeId('ch'),
    object: 'charge',
    amount: intent.amount,
    amount_captured: succeeded ? intent.amount : 0,
    amount_refunded: 0,
    application: null,
    application_fee: null,
    application_fee_amount: null,
    balance_transaction: null,
    billing_details: { address: null, email: intent.receipt_email, name: null, phone: null, tax_id: null },
    calculated_statement_descriptor: 'LOOMWRIGHT TEST',
    captured: succeeded,
    created: fields.created,
    currency: intent.currency,
    customer: null,
    description: null,
    disputed: false,
    failure_balance_transaction: null,
    failure_code: null,
    failure_message: null,
    fraud_details: {},
    livemode: false,
    metadata: { ...intent.metadata },
    on_behalf_of: null,
    outcome: null,
    paid: succeeded,
    payment_intent: intent.id,
    payment_method: fakeId('pm'),
    payment_method_details: { type: fields.method } as Stripe.Charge.PaymentMethodDetails,
    receipt_email: intent.receipt_email,
    receipt_number: null,
    receipt_url: null,
    refunded: false,
    review: null,
    shipping: null,
    source: null,
    source_transfer: null,
    statement_descriptor: null,
    statement_descriptor_suffix: null,
    status: fields.status,
    transfer_data: null,
    transfer_group: null,
  };
}

export function newRefund(
  charge: Stripe.Charge,
  fields: {
    created: number;
    amount: number;
    reason: Stripe.Refund.Reason | null;
    metadata: Stripe.Metadata;
    status: 'pending' | 'succeeded' | 'failed';
  },
): Stripe.Refund {
  return {
    id: fakeId('re'),
    object: 'refund',
    amount: fields.amount,
    balance_transaction: null,
    charge: charge.id,
    created: fields.created,
    currency: charge.currency,
    customer: null,
    customer_account: null,
    metadata: fields.metadata,
    payment_intent: typeof charge.payment_intent === 'string' ? charge.payment_intent : null,
    payment_method: charge.payment_method,
    reason: fields.reason,
    receipt_number: null,
    source_transfer_reversal: null,
    status: fields.status,
    transfer_reversal: null,
  };
}

export function newDispute(charge: Stripe.Charge, fields: { created: number; reason: string }): Stripe.Dispute {
  return {
    id: fakeId('dp'),
    object: 'dispute',
    amount: charge.amount,
    balance_transactions: [],
    charge: charge.id,
    created: fields.created,
    currency: charge.currency,
    enhanced_eligibility_types: [],
    evidence: {
      access_activity_log: null,
      billing_address: null,
      cancellation_policy: null,
      cancellation_policy_disclosure: null,
      cancellation_rebuttal: null,
      customer_communication: null,
      customer_email_address: null,
      customer_name: null,
      customer_purchase_ip: null,
      customer_signature: null,
      duplicate_charge_documentation: null,
      duplicate_charge_explanation: null,
      duplicate_charge_id: null,
      enhanced_evidence: {},
      product_description: null,
      receipt: null,
      refund_policy: null,
      refund_policy_disclosure: null,
      refund_refusal_explanation: null,
      service_date: null,
      service_documentation: null,
      shipping_address: null,
      shipping_carrier: null,
      shipping_date: null,
      shipping_documentation: null,
      shipping_tracking_number: null,
      uncategorized_file: null,
      uncategorized_text: null,
    },
    evidence_details: {
      due_by: fields.created + 7 * 24 * 3600,
      enhanced_eligibility: {},
      has_evidence: false,
      past_due: false,
      submission_count: 0,
    },
    is_charge_refundable: false,
    livemode: false,
    metadata: {},
    payment_intent: typeof charge.payment_intent === 'string' ? charge.payment_intent : null,
    reason: fields.reason,
    status: 'needs_response',
  };
}

/** An event of one type, with the object that type carries (the SDK's discriminated union). */
export type EventOf<T extends Stripe.Event['type']> = Extract<Stripe.Event, { type: T }>;

export function newEvent<T extends Stripe.Event['type']>(type: T, object: EventOf<T>['data']['object'], created: number): EventOf<T> {
  const event = {
    id: fakeId('evt'),
    object: 'event',
    api_version: FAKE_API_VERSION,
    created,
    type,
    livemode: false,
    pending_webhooks: 1,
    request: { id: null, idempotency_key: null },
    data: { object: structuredClone(object) },
  } satisfies Omit<Stripe.EventBase, 'type' | 'data'> & { type: T; data: { object: EventOf<T>['data']['object'] } };
  return event as unknown as EventOf<T>;
}
