import Link from '@mui/joy/Link';
import Typography from '@mui/joy/Typography';
import { Link as RouterLink } from 'react-router';
import { AuthCard } from 'src/features/auth/components/AuthCard';
import { ForgotPasswordForm } from 'src/features/auth/components/ForgotPasswordForm';

export function Component() {
  return (
    <AuthCard title="Forgot your password?" intro="Tell us the e-mail you signed up with and we will send a link to choose a new password.">
      <ForgotPasswordForm />
      <Typography level="body-sm">
        Remembered it?{' '}
        <Link component={RouterLink} to="/sign-in">
          Back to sign in
        </Link>
      </Typography>
    </AuthCard>
  );
}
