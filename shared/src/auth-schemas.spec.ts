import { describe, expect, it } from 'vitest';
import {
  authMessages,
  inviteStaffSchema,
  newPasswordFormSchema,
  passwordResetConfirmSchema,
  safeNextPath,
  signUpSchema,
} from './auth-schemas';

describe('safeNextPath', () => {
  // OWASP Unvalidated Redirects and Forwards Cheat Sheet: only allow local, relative targets.
  it.each([
    ['/configure/request?c=abc', '/configure/request?c=abc'],
    ['/account', '/account'],
    ['https://elsewhere.example/phish', '/'],
    ['//elsewhere.example/phish', '/'],
    ['/\\elsewhere.example', '/'],
    ['javascript:alert(1)', '/'],
    ['', '/'],
    [null, '/'],
  ])('%s → %s', (next, expected) => {
    expect(safeNextPath(next)).toBe(expected);
  });
});

describe('account schemas', () => {
  it('trims and lower-cases the e-mail, so the API and the apps agree on one address', () => {
    const parsed = signUpSchema.parse({ name: ' Ilse ', email: '  Ilse.B@Mail.Example ', password: 'a-long-password' });
    expect(parsed).toEqual({ name: 'Ilse', email: 'ilse.b@mail.example', password: 'a-long-password' });
  });

  it('refuses an address longer than 254 characters (RFC 5321 §4.5.3.1.3 path limit, less the brackets)', () => {
    const local = 'a'.repeat(64);
    const domain = `${'b'.repeat(60)}.${'c'.repeat(60)}.${'d'.repeat(59)}.example`; // 64 + 1 + (60 + 1 + 60 + 1 + 59 + 8) = 254
    expect(signUpSchema.safeParse({ name: 'x', email: `${local}@${domain}`, password: 'a-long-password' }).success).toBe(true);
    const tooLong = `${local}@x${domain}`;
    const result = signUpSchema.safeParse({ name: 'x', email: tooLong, password: 'a-long-password' });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.message).toBe(authMessages.email);
  });

  it('asks for at least 10 characters in a new password, in words', () => {
    const result = passwordResetConfirmSchema.safeParse({ token: 'A'.repeat(43), password: 'nine-char' });
    expect(result.success).toBe(false);
    expect(result.error?.issues.map((i) => i.message)).toEqual(['Choose a password of at least 10 characters']);
  });

  it('wants the new password twice, the same both times', () => {
    const result = newPasswordFormSchema.safeParse({ password: 'a-long-password', repeatPassword: 'a-long-passwort' });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.path).toEqual(['repeatPassword']);
  });

  it('takes a link token only in the shape the API issues (32 bytes, base64url = 43 characters, RFC 4648 §5)', () => {
    expect(passwordResetConfirmSchema.safeParse({ token: `${'A'.repeat(42)}_`, password: 'a-long-password' }).success).toBe(true);
    expect(passwordResetConfirmSchema.safeParse({ token: `${'A'.repeat(42)}+`, password: 'a-long-password' }).success).toBe(false);
    expect(passwordResetConfirmSchema.safeParse({ token: 'A'.repeat(44), password: 'a-long-password' }).success).toBe(false);
  });

  it('wants a positive hourly rate with at most two decimals', () => {
    const base = { email: 'x@shop.example', name: 'X', level: 'journeyman' };
    expect(inviteStaffSchema.safeParse({ ...base, hourlyRate: '85.50' }).success).toBe(true);
    for (const bad of ['0', '0.00', '-5', '85.505', 'eighty']) {
      expect(inviteStaffSchema.safeParse({ ...base, hourlyRate: bad }).success, bad).toBe(false);
    }
  });
});
