/** Shapes the API answers with, shared so both apps read them with the same names. */

export interface HealthStatus {
  status: 'ok' | 'degraded';
  db: 'up' | 'down';
}

export interface ShopProfile {
  name: string;
  tagline: string;
  currency: string;
  countryCode: string;
  timezone: string;
  contactEmail: string;
}

/** Every 4xx/5xx body the API sends: Nest's own error shape. `message` is meant for people. */
export interface ApiErrorBody {
  statusCode: number;
  message: string | string[];
  error?: string;
}
