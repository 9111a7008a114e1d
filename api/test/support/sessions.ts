import type { AuthUser } from '@loomwright/shared';
import type { TestApp } from './test-app';

/** The demo people the API tests act as (seeded by seed-people.ts). */
export const demoEmails = {
  customerA: 'player@mail.example',
  customerB: 'cass@mail.example',
  builder: 'builder@shop.example',
  apprentice: 'junior@shop.example',
  owner: 'owner@shop.example',
} as const;
export type DemoPerson = keyof typeof demoEmails;

/**
 * A session cookie for a seeded person, opened by the app's own SessionsService (the same code
 * sign-in uses: a row in `sessions` and its signed token), so tests that act as many people do
 * not spend the sign-in throttle.
 */
export async function sessionCookieFor(t: TestApp, person: DemoPerson): Promise<string> {
  const { SessionsService } = await import('../../src/auth/sessions.service');
  const row = await t.db
    .selectFrom('users')
    .select(['id', 'email', 'name', 'role'])
    .where('email', '=', demoEmails[person])
    .executeTakeFirstOrThrow();
  const user: AuthUser = { id: row.id, email: row.email, name: row.name, role: row.role };
  return `lw_session=${await t.app.get(SessionsService).open(user)}`;
}

export const setCookies = (res: { headers: Record<string, unknown> }): string[] =>
  (res.headers['set-cookie'] as string[] | undefined) ?? [];

export const sessionCookieOf = (res: { headers: Record<string, unknown> }) => setCookies(res).find((c) => c.startsWith('lw_session='));

/** The cookie as a browser would send it back: name=value only. */
export const asRequestCookie = (setCookie: string) => setCookie.split(';')[0]!;
