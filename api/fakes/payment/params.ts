import type Stripe from 'stripe';

/**
 * What the provider refuses, checked before the fake does anything. Parameter names come from the
 * SDK's generated request types (themselves generated from the provider's OpenAPI specification):
 * each table below must name every key of its type (`satisfies Record<keyof …>`), so a name the
 * SDK does not know fails to compile and a name the SDK adds shows up as a compile error too.
 * `true` marks what the fake implements; a known name it does not implement is refused in words
 * that say so, never silently ignored.
 */
type Known<T> = Record<keyof T, boolean>;

export const sessionParams = {
  adaptive_pricing: false,
  after_expiration: false,
  allow_promotion_codes: false,
  automatic_tax: false,
  billing_address_collection: false,
  branding_settings: false,
  cancel_url: true,
  client_reference_id: true,
  consent_collection: false,
  currency: false,
  custom_fields: false,
  custom_text: false,
  customer: false,
  customer_account: false,
  customer_creation: false,
  customer_email: true,
  customer_update: false,
  discounts: false,
  excluded_payment_method_types: false,
  expand: false,
  expires_at: true,
  integration_identifier: false,
  invoice_creation: false,
  line_items: true,
  locale: false,
  managed_payments: false,
  metadata: true,
  mode: true,
  name_collection: false,
  optional_items: false,
  origin_context: false,
  payment_intent_data: true,
  payment_method_collection: false,
  payment_method_configuration: false,
  payment_method_data: false,
  payment_method_options: false,
  payment_method_types: true,
  permissions: false,
  phone_number_collection: false,
  redirect_on_completion: false,
  return_url: false,
  saved_payment_method_options: false,
  setup_intent_data: false,
  shipping_address_collection: false,
  shipping_options: false,
  submit_type: false,
  subscription_data: false,
  success_url: true,
  tax_id_collection: false,
  ui_mode: false,
  wallet_options: false,
} satisfies Known<Stripe.Checkout.SessionCreateParams>;

export const lineItemParams = {
  adjustable_quantity: false,
  metadata: false,
  price: false,
  price_data: true,
  quantity: true,
  tax_rates: false,
} satisfies Known<Stripe.Checkout.SessionCreateParams.LineItem>;

export const priceDataParams = {
  currency: true,
  product: false,
  product_data: true,
  recurring: false,
  tax_behavior: false,
  unit_amount: true,
  unit_amount_decimal: false,
} satisfies Known<Stripe.Checkout.SessionCreateParams.LineItem.PriceData>;

export const productDataParams = {
  description: true,
  images: false,
  metadata: false,
  name: true,
  tax_code: false,
  unit_label: false,
} satisfies Known<Stripe.Checkout.SessionCreateParams.LineItem.PriceData.ProductData>;

export const paymentIntentDataParams = {
  application_fee_amount: false,
  capture_method: false,
  description: false,
  metadata: true,
  on_behalf_of: false,
  receipt_email: false,
  setup_future_usage: false,
  shipping: false,
  statement_descriptor: false,
  statement_descriptor_suffix: false,
  transfer_data: false,
  transfer_group: false,
} satisfies Known<Stripe.Checkout.SessionCreateParams.PaymentIntentData>;

export const refundParams = {
  amount: true,
  charge: true,
  currency: false,
  customer: false,
  expand: false,
  instructions_email: false,
  metadata: true,
  origin: false,
  payment_intent: true,
  reason: true,
  refund_application_fee: false,
  reverse_transfer: false,
} satisfies Known<Stripe.RefundCreateParams>;

export class RequestError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly param?: string,
    readonly type = 'invalid_request_error',
    readonly code?: string,
  ) {
    super(message);
  }
}

const asRecord = (v: unknown): Record<string, unknown> =>
  v && typeof v === 'object' && !Array.isArray(v) ? (v as Record<string, unknown>) : {};

/** Refuses a parameter the contract does not name (the provider's own words), or one the fake does not implement. */
export function checkNames(params: unknown, table: Record<string, boolean>, prefix = ''): Record<string, unknown> {
  const record = asRecord(params);
  for (const key of Object.keys(record)) {
    const name = prefix ? `${prefix}[${key}]` : key;
    if (!(key in table))
      throw new RequestError(400, `Received unknown parameter: ${name}`, name, 'invalid_request_error', 'parameter_unknown');
    if (!table[key])
      throw new RequestError(400, `This test service does not implement the parameter ${name}; Loomwright does not send it.`, name);
  }
  return record;
}

/**
 * Metadata limits (the provider's API reference, "Metadata"): at most 50 keys, key names up to 40
 * characters without square brackets, values up to 500 characters.
 */
export function checkMetadata(value: unknown, param: string): Stripe.Metadata {
  if (value === undefined || value === '') return {};
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw new RequestError(400, `Invalid object: ${param} must be a hash of keys and values.`, param);
  }
  const entries = Object.entries(value as Record<string, unknown>);
  if (entries.length > 50)
    throw new RequestError(400, `Invalid ${param}: metadata can have up to 50 keys, but you passed in ${entries.length} keys.`, param);
  for (const [key, val] of entries) {
    if (key.length > 40)
      throw new RequestError(
        400,
        `Invalid ${param}: metadata keys can be up to 40 characters long, but you passed in a key "${key}" of ${key.length}.`,
        `${param}[${key}]`,
      );
    if (/[[\]]/.test(key)) throw new RequestError(400, `Invalid ${param}: metadata keys may not contain "[" or "]".`, `${param}[${key}]`);
    if (typeof val !== 'string')
      throw new RequestError(400, `Invalid ${param}[${key}]: metadata values must be strings.`, `${param}[${key}]`);
    if (val.length > 500)
      throw new RequestError(
        400,
        `Invalid ${param}: metadata values can be up to 500 characters long, but the value of "${key}" has ${val.length}.`,
        `${param}[${key}]`,
      );
  }
  return Object.fromEntries(entries) as Stripe.Metadata;
}

/** ISO 4217 codes as the runtime's ICU data knows them (`Intl.supportedValuesOf('currency')`). */
const isoCurrencies = new Set(Intl.supportedValuesOf('currency').map((c) => c.toLowerCase()));

/** The provider takes lower-case ISO 4217 codes; "xyz" is no currency at all. */
export function checkCurrency(value: unknown, param: string): string {
  const currency = typeof value === 'string' ? value : '';
  if (!/^[a-z]{3}$/.test(currency) || !isoCurrencies.has(currency)) {
    throw new RequestError(
      400,
      `Invalid currency: ${currency || '(none)'}. Use a three-letter ISO currency code in lower case, such as usd.`,
      param,
    );
  }
  return currency;
}

/**
 * Payment method types the fake offers, with the currencies each takes (the provider's payment
 * method documentation: cards in any supported currency; US bank account debits (ACH) only in
 * usd; SEPA Direct Debit only in eur).
 */
export const methodCurrencies: Record<string, string[] | 'any'> = {
  card: 'any',
  us_bank_account: ['usd'],
  sepa_debit: ['eur'],
};

export function checkMethods(value: unknown, currency: string): string[] {
  if (value === undefined) return ['card'];
  const list = Array.isArray(value) ? value : typeof value === 'object' && value ? Object.values(value) : [value];
  if (list.length === 0)
    throw new RequestError(400, 'Invalid array: payment_method_types must name at least one type.', 'payment_method_types');
  return list.map((raw, i) => {
    const type = String(raw);
    const currencies = methodCurrencies[type];
    if (!currencies)
      throw new RequestError(
        400,
        `Invalid payment_method_types[${i}]: the payment method type "${type}" is invalid or this test service does not offer it (card, us_bank_account, sepa_debit).`,
        `payment_method_types[${i}]`,
      );
    if (currencies !== 'any' && !currencies.includes(currency)) {
      throw new RequestError(
        400,
        `The payment method type "${type}" does not support the currency "${currency}" (it takes ${currencies.join(', ')}).`,
        'payment_method_types',
      );
    }
    return type;
  });
}

/** `expires_at` must fall between 30 minutes and 24 hours after the session is created (API reference, Checkout Sessions). */
export function checkExpiresAt(value: unknown, now: number): number {
  if (value === undefined) return now + 24 * 3600;
  const at = Number(value);
  if (!Number.isInteger(at)) throw new RequestError(400, 'Invalid integer: expires_at', 'expires_at');
  if (at < now + 30 * 60)
    throw new RequestError(400, 'The `expires_at` timestamp must be at least 30 minutes from Checkout Session creation.', 'expires_at');
  if (at > now + 24 * 3600)
    throw new RequestError(400, 'The `expires_at` timestamp must be less than 24 hours from Checkout Session creation.', 'expires_at');
  return at;
}

export function positiveInt(v: unknown, param: string): number {
  const n = Number(v);
  if (typeof v === 'object' || !Number.isInteger(n) || n <= 0) throw new RequestError(400, `Invalid positive integer: ${param}`, param);
  return n;
}

export function url(v: unknown, param: string, required: boolean): string | null {
  if (v === undefined && !required) return null;
  if (typeof v !== 'string' || !/^https?:\/\/\S+$/.test(v)) {
    throw new RequestError(400, v === undefined ? `Missing required param: ${param}.` : `Not a valid URL: ${param}`, param);
  }
  if (v.length > 5000) throw new RequestError(400, `Invalid ${param}: must be at most 5000 characters.`, param);
  return v;
}

export const refundReasons = ['duplicate', 'fraudulent', 'requested_by_customer'] as const;
