import { z } from 'zod';
import { builderLevels } from './domain';
import { positiveAmount, requestObject } from './request-fields';
import { authWords } from './words';

/**
 * Account forms, shared by the API's DTOs and both apps' forms, so a bad value is refused with the
 * same words everywhere. The words come from the words file and say what to do.
 */
export const PASSWORD_MIN_LENGTH = 10;
export const PASSWORD_MAX_LENGTH = 200;

export const authMessages = {
  email: authWords.email,
  passwordEmpty: authWords.passwordEmpty,
  passwordShort: authWords.passwordShort(PASSWORD_MIN_LENGTH),
  passwordLong: authWords.passwordLong(PASSWORD_MAX_LENGTH),
  passwordsDiffer: authWords.passwordsDiffer,
  passwordUnchanged: authWords.passwordUnchanged,
  currentPasswordWrong: authWords.currentPasswordWrong,
  passwordChanged: 'Your password is changed. Every other device where you were signed in is now signed out.',
  nameEmpty: authWords.nameEmpty,
  nameLong: authWords.nameLong,
  token: authWords.token,
  level: authWords.level,
  hourlyRate: authWords.hourlyRate,
  /** The one answer to a reset request, whether or not the e-mail has an account. */
  resetRequested:
    'If an account uses that e-mail, a link to choose a new password is on its way. It works once and expires within an hour.',
  resetTokenInvalid: 'This reset link has expired or was already used. Ask for a new one from the sign-in page.',
  inviteTokenInvalid: 'This invitation link has expired or was already used. Ask the shop owner to send a new one.',
  throttled: 'Too many attempts in a short time. Wait a minute, then try again.',
} as const;

const email = z
  .string({ message: authMessages.email })
  .trim()
  .toLowerCase()
  .max(254, { message: authMessages.email })
  .pipe(z.email({ message: authMessages.email }));

const newPassword = z
  .string({ message: authMessages.passwordShort })
  .min(PASSWORD_MIN_LENGTH, { message: authMessages.passwordShort })
  .max(PASSWORD_MAX_LENGTH, { message: authMessages.passwordLong });

const name = z
  .string({ message: authMessages.nameEmpty })
  .trim()
  .min(1, { message: authMessages.nameEmpty })
  .max(120, { message: authMessages.nameLong });

// Reset and invitation tokens are 32 random bytes, base64url: 43 characters.
const token = z.string({ message: authMessages.token }).regex(/^[A-Za-z0-9_-]{43}$/, { message: authMessages.token });

/** A password as typed to prove who one is (sign-in, or the current one when changing it): any length up to the maximum. */
const typedPassword = z
  .string({ message: authMessages.passwordEmpty })
  .min(1, { message: authMessages.passwordEmpty })
  .max(PASSWORD_MAX_LENGTH, { message: authMessages.passwordLong });

export const signInSchema = requestObject({ email, password: typedPassword });
export type SignInInput = z.infer<typeof signInSchema>;

export const signUpSchema = requestObject({ name, email, password: newPassword });
export type SignUpInput = z.infer<typeof signUpSchema>;

export const passwordResetRequestSchema = requestObject({ email });
export type PasswordResetRequestInput = z.infer<typeof passwordResetRequestSchema>;

export const passwordResetConfirmSchema = requestObject({ token, password: newPassword });
export type PasswordResetConfirmInput = z.infer<typeof passwordResetConfirmSchema>;

/**
 * POST /api/auth/password: a signed-in person changes their password. The current one proves it is
 * them (a session left open on a shared computer is not enough); the new one follows the sign-up rule.
 */
export const passwordChangeSchema = requestObject({ currentPassword: typedPassword, password: newPassword }).refine(
  (body) => body.password !== body.currentPassword,
  { path: ['password'], message: authMessages.passwordUnchanged },
);
export type PasswordChangeInput = z.infer<typeof passwordChangeSchema>;

export const acceptInvitationSchema = requestObject({ token, password: newPassword });
export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;

/** A builder's hourly labor rate: a decimal string above 0 with at most two decimals (the invitation and the team page). */
export const hourlyRateField = positiveAmount('hourlyRate', 6, '85.00', authMessages.hourlyRate);

export const inviteStaffSchema = requestObject({
  email,
  name,
  level: z.enum(builderLevels, { message: authMessages.level }),
  hourlyRate: hourlyRateField,
});
export type InviteStaffInput = z.infer<typeof inviteStaffSchema>;

/** The form that asks for the new password twice (the API takes it once). */
export const newPasswordFormSchema = z
  .object({ password: newPassword, repeatPassword: z.string() })
  .refine((v) => v.password === v.repeatPassword, { message: authMessages.passwordsDiffer, path: ['repeatPassword'] });
export type NewPasswordFormInput = z.infer<typeof newPasswordFormSchema>;

/** The account page's form: the current password, then the new one twice (the API takes it once). */
export const changePasswordFormSchema = z
  .object({ currentPassword: typedPassword, password: newPassword, repeatPassword: z.string() })
  .refine((v) => v.password === v.repeatPassword, { message: authMessages.passwordsDiffer, path: ['repeatPassword'] })
  .refine((v) => v.password !== v.currentPassword, { message: authMessages.passwordUnchanged, path: ['password'] });
export type ChangePasswordFormInput = z.infer<typeof changePasswordFormSchema>;

/**
 * Where to go after signing in: only a path inside this app (starts with one "/"), never another
 * site, so a crafted link cannot send a player elsewhere after they sign in.
 */
export function safeNextPath(next: string | null | undefined, fallback = '/'): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.includes('\\')) return fallback;
  return next;
}

export interface AuthSessionResponse {
  user: import('./domain').AuthUser;
}

/** GET /api/auth/session: the signed-in person, or null for a visitor. */
export interface CurrentSessionResponse {
  user: import('./domain').AuthUser | null;
}

/** POST /api/auth/sign-out. */
export interface SignOutResponse {
  signedOut: true;
}

/** POST /api/auth/password-reset: the same words whether or not the address has an account. */
export interface PasswordResetRequested {
  message: string;
}

export interface InvitationCreated {
  user: import('./domain').AuthUser;
  builderId: string;
  expiresAt: string;
  resent: boolean;
}
