/** Shapes the API answers with, shared so both apps read them with the same names. */

export interface HealthStatus {
  status: 'ok' | 'degraded';
  db: 'up' | 'down';
}

/** GET /api/health/live: the process runs and answers (depends on nothing outside it). */
export interface HealthLiveness {
  status: 'ok';
  uptimeSeconds: number;
}

/** GET /api/health/ready: whether to send this process work (503 with the same body when not). */
export interface HealthReadiness {
  status: 'ready' | 'not ready';
  db: 'up' | 'down';
  storage: 'up' | 'down';
  /** Present only when not ready: what is missing, in words. */
  reasons?: string[];
}

/** POST /api/payments/webhook: the event was taken; `duplicate` when it had been taken before (nothing done twice). */
export interface PaymentEventReceived {
  received: true;
  duplicate: boolean;
}

/** Who the shop is and how it speaks (its money, country, time zone and locale): the public profile and the owner's settings both begin with it. */
export interface ShopIdentity {
  name: string;
  tagline: string;
  currency: string;
  countryCode: string;
  timezone: string;
  /** BCP 47 tag (en-US, de-DE): with currency and timezone, how every amount, date and time is written (`shopFormat`). */
  locale: string;
  contactEmail: string;
}

export interface ShopProfile extends ShopIdentity {
  /** The postal address players ship or bring their pedals to, on one line (`postalAddressLine`); null until the owner sets it. */
  postalAddress: string | null;
}

/** One device a person is signed in on (the owner's view of their sessions). */
export interface SessionView {
  id: string;
  startedAt: string;
  lastRenewedAt: string;
  expiresAt: string;
  device: string | null;
}

export interface PersonSessions {
  userId: string;
  sessions: SessionView[];
}

/** The answer to signing a person out of every device. */
export interface SessionsEnded {
  userId: string;
  ended: number;
}

/** The words every app shows while the API answers 503: the shop's database is not answering. */
export const shopUnavailableMessage =
  'The shop is briefly unavailable: its database is not answering. Nothing is lost and nobody is signed out; please try again in a minute.';
