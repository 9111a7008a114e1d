import type { ComponentProps } from 'react';
import { ApiErrorAlert } from '@loomwright/shared/ui';

/**
 * An API error in words: what happened (the server's own sentence) and what to do next, picked by
 * the answer's code (sign in again, wait and retry, pick another date); `action` adds this screen's own advice.
 */
export function ErrorNote(props: Omit<ComponentProps<typeof ApiErrorAlert>, 'signInHref' | 'newLink'>) {
  return <ApiErrorAlert {...props} signInHref="/sign-in" />;
}
