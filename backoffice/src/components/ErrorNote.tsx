import { ApiErrorAlert } from '@loomwright/shared/ui';

/**
 * An API error in words: what happened (the server's own sentence) and what to do next, picked by
 * the answer's code (sign in again, wait and retry, pick another date); `action` adds this screen's own advice.
 */
export function ErrorNote({ error, action, onRetry }: { error: Error | null | undefined; action?: string; onRetry?: () => void }) {
  return <ApiErrorAlert error={error} action={action} onRetry={onRetry} signInHref="/sign-in" />;
}
