import { zodResolver } from '@hookform/resolvers/zod';
import Button from '@mui/joy/Button';
import Stack from '@mui/joy/Stack';
import type { ReactNode } from 'react';
import { useForm, type FieldError, type UseFormRegisterReturn } from 'react-hook-form';
import { newPasswordFormSchema, PASSWORD_MIN_LENGTH, signInSchema } from '../auth-schemas';
import type { AuthUser } from '../domain';
import { ApiErrorAlert } from './ApiErrorAlert';
import { setServerFieldErrors } from './error-advice';
import { FormTextField } from './FormTextField';
import { useSignIn } from './sign-in-out';

interface EmailFieldProps {
  registration: UseFormRegisterReturn;
  error?: FieldError;
  hint?: string;
  autoFocus?: boolean;
  /** `email` on the storefront; `username` where the address is the sign-in name a password manager keys on. */
  autoComplete?: 'email' | 'username';
}

/** The e-mail field every account form has (sign in, sign up, forgot password), labelled and typed the same. */
export function EmailField({ autoComplete = 'email', ...rest }: EmailFieldProps) {
  return <FormTextField label="E-mail" type="email" autoComplete={autoComplete} {...rest} />;
}

interface PasswordFieldProps {
  label?: string;
  registration: UseFormRegisterReturn;
  error?: FieldError;
  hint?: string;
  autoFocus?: boolean;
  /** `current-password` to sign in; `new-password` where one is chosen (a password manager offers to make one). */
  autoComplete: 'current-password' | 'new-password';
}

/** A password field, its characters hidden. */
export function PasswordField({ label = 'Password', ...rest }: PasswordFieldProps) {
  return <FormTextField label={label} type="password" {...rest} />;
}

const SIGN_IN_FIELDS = ['email', 'password'] as const;

interface SignInFormProps {
  /** The form's accessible name ("Sign in", "Staff sign in"). */
  label: string;
  emailAutoComplete?: EmailFieldProps['autoComplete'];
  onSignedIn: (user: AuthUser) => void;
  /** What follows the button (the storefront's links to reset a password and to sign up). */
  children?: ReactNode;
}

/** E-mail and password, checked by the shared schema, sent to the one sign-in route both apps use. */
export function SignInForm({ label, emailAutoComplete, onSignedIn, children }: SignInFormProps) {
  const signIn = useSignIn();
  const { register, handleSubmit, formState, setError } = useForm({
    resolver: zodResolver(signInSchema),
    defaultValues: { email: '', password: '' },
  });
  const onSubmit = handleSubmit((values) =>
    signIn.mutate(values, {
      onSuccess: ({ user }) => onSignedIn(user),
      onError: (error) => setServerFieldErrors(error, setError, SIGN_IN_FIELDS),
    }),
  );
  return (
    <form onSubmit={onSubmit} noValidate aria-label={label}>
      <Stack gap={2}>
        <ApiErrorAlert error={signIn.error} fields={SIGN_IN_FIELDS} />
        <EmailField autoComplete={emailAutoComplete} autoFocus registration={register('email')} error={formState.errors.email} />
        <PasswordField autoComplete="current-password" registration={register('password')} error={formState.errors.password} />
        <Button type="submit" loading={signIn.isPending}>
          Sign in
        </Button>
        {children}
      </Stack>
    </form>
  );
}

const NEW_PASSWORD_FIELDS = ['password'] as const;

interface NewPasswordFormProps {
  /** The form's accessible name. */
  label: string;
  passwordLabel: string;
  repeatLabel: string;
  submitLabel: string;
  /** The call that sends the password: busy while it runs, and what it answered if it failed. */
  mutation: { isPending: boolean; error: Error | null };
  /** Sends the password; `onError` puts a `validation_failed` answer's words under the field (pass it on to `mutate`). */
  onSubmit: (password: string, options: { onError: (error: unknown) => void }) => void;
  /** Passed to the alert: this screen's own advice, and where to ask for a new link when this one has expired. */
  action?: string;
  newLink?: { href: string; label: string };
}

/** Choose a password, typed twice (the shared schema checks both): a reset link's page and an invitation's. */
export function NewPasswordForm({
  label,
  passwordLabel,
  repeatLabel,
  submitLabel,
  mutation,
  onSubmit,
  action,
  newLink,
}: NewPasswordFormProps) {
  const { register, handleSubmit, formState, setError } = useForm({
    resolver: zodResolver(newPasswordFormSchema),
    defaultValues: { password: '', repeatPassword: '' },
  });
  const submit = handleSubmit((values) =>
    onSubmit(values.password, { onError: (failure) => setServerFieldErrors(failure, setError, NEW_PASSWORD_FIELDS) }),
  );
  return (
    <form onSubmit={submit} noValidate aria-label={label}>
      <Stack gap={2}>
        <ApiErrorAlert error={mutation.error} fields={NEW_PASSWORD_FIELDS} action={action} newLink={newLink} />
        <PasswordField
          label={passwordLabel}
          autoComplete="new-password"
          autoFocus
          registration={register('password')}
          error={formState.errors.password}
          hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        />
        <PasswordField
          label={repeatLabel}
          autoComplete="new-password"
          registration={register('repeatPassword')}
          error={formState.errors.repeatPassword}
        />
        <Button type="submit" loading={mutation.isPending}>
          {submitLabel}
        </Button>
      </Stack>
    </form>
  );
}
