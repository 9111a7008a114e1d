import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import Link from '@mui/joy/Link';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { Link as RouterLink } from 'react-router';
import { errorAdvice, fieldsCoverError } from './error-advice';

interface Props {
  error: Error | null | undefined;
  /** Words of the caller's own, after the server's sentence (what this screen suggests next). */
  action?: string;
  /** Where "Sign in again" leads (a signed-out answer); the app's sign-in page by default. */
  signInHref?: string;
  /** Where to ask for a new single-use link (an expired one), and the words of that link. */
  newLink?: { href: string; label: string };
  /** Offered as "Try again" when the shop was busy or away. */
  onRetry?: () => void;
  /**
   * The form's own fields: when every problem of a `validation_failed` answer found one of them
   * (`setServerFieldErrors` put it there), the alert is left out; the words stand under the fields.
   */
  fields?: readonly string[];
  /** Where those fields sit in the request body (`setServerFieldErrors`' `from`). */
  fieldsFrom?: string;
}

/**
 * A refused or failed call in words: the server's own sentence, then what to do about it, picked by
 * the answer's code (`errorAdvice`): sign in again, wait and retry, pick another date, ask for a new link.
 */
export function ApiErrorAlert({ error, action, signInHref = '/sign-in', newLink, onRetry, fields, fieldsFrom }: Props) {
  if (!error || (fields && fieldsCoverError(error, fields, { from: fieldsFrom }))) return null;
  const advice = errorAdvice(error);
  return (
    <Alert color={advice === 'other' || advice === 'fields' ? 'danger' : 'warning'} variant="soft" role="alert" data-advice={advice}>
      <Stack gap={0.5}>
        <Typography level="body-sm">
          {error.message}
          {action ? ` ${action}` : ''}
        </Typography>
        {advice === 'sign-in-again' && (
          <Link component={RouterLink} to={signInHref} level="body-sm">
            Sign in again
          </Link>
        )}
        {advice === 'wait-and-retry' && (
          <Stack direction="row" gap={1} alignItems="center">
            <Typography level="body-sm">Wait a moment, then try again.</Typography>
            {onRetry && (
              <Button size="sm" variant="outlined" color="neutral" onClick={onRetry}>
                Try again
              </Button>
            )}
          </Stack>
        )}
        {advice === 'pick-another-date' && (
          <Typography level="body-sm" fontWeight="lg">
            Pick another date: the bench shown now is the one as it stands.
          </Typography>
        )}
        {advice === 'link-expired' &&
          (newLink ? (
            <Link component={RouterLink} to={newLink.href} level="body-sm">
              {newLink.label}
            </Link>
          ) : (
            <Typography level="body-sm">This link has expired or was used already; ask for a new one.</Typography>
          ))}
      </Stack>
    </Alert>
  );
}
