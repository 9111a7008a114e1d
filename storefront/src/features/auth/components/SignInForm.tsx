import Link from '@mui/joy/Link';
import Typography from '@mui/joy/Typography';
import { SignInForm as AccountSignInForm } from '@loomwright/shared/ui';
import { Link as RouterLink } from 'react-router';

interface Props {
  onSignedIn: () => void;
  signUpHref: string;
  forgotHref: string;
}

/** The shared sign-in form, with the player's ways on: reset a forgotten password, or create an account. */
export function SignInForm({ onSignedIn, signUpHref, forgotHref }: Props) {
  return (
    <AccountSignInForm label="Sign in" onSignedIn={onSignedIn}>
      <Typography level="body-sm">
        <Link component={RouterLink} to={forgotHref}>
          Forgot your password?
        </Link>
      </Typography>
      <Typography level="body-sm">
        New here?{' '}
        <Link component={RouterLink} to={signUpHref}>
          Create an account
        </Link>
      </Typography>
    </AccountSignInForm>
  );
}
