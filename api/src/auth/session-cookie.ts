import type { CookieOptions } from 'express';

export const SESSION_COOKIE = 'lw_session';

/** httpOnly and SameSite=Lax always; Secure outside development and tests (plain http on localhost). */
export function sessionCookieOptions(nodeEnv: string, maxAgeMs: number): CookieOptions {
  return { httpOnly: true, sameSite: 'lax', secure: nodeEnv === 'production', path: '/', maxAge: maxAgeMs };
}
