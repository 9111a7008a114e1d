import Link from '@mui/joy/Link';
import { safeNextPath, staffRoles } from '@loomwright/shared';
import { SignInForm } from '@loomwright/shared/ui';
import { Navigate, useNavigate, useSearchParams } from 'react-router';
import { PageLoading } from 'src/components/PageLoading';
import { useMe } from 'src/features/auth/api/get-me';
import { AuthCard } from 'src/features/auth/components/AuthCard';
import { StaffOnly } from 'src/features/auth/components/StaffOnly';

export function Component() {
  const me = useMe();
  const navigate = useNavigate();
  const [params] = useSearchParams();
  // With no page asked for, a builder lands on their today; the owner on the overview.
  const landing = (role: string) => safeNextPath(params.get('next'), role === 'builder' ? '/today' : '/');
  if (me.isPending) return <PageLoading />;
  if (me.data && staffRoles.includes(me.data.role)) return <Navigate to={landing(me.data.role)} replace />;
  if (me.data) return <StaffOnly user={me.data} />;
  return (
    <AuthCard title="Staff sign in" intro="For the shop’s builders and owner. Players sign in on the shop’s own pages.">
      <SignInForm
        label="Staff sign in"
        emailAutoComplete="username"
        onSignedIn={(user) => staffRoles.includes(user.role) && navigate(landing(user.role), { replace: true })}
      />
      {/* Password resets go through the storefront's page; the e-mailed link works for staff too. */}
      <Link href="/forgot-password" level="body-sm">
        Forgot your password?
      </Link>
    </AuthCard>
  );
}
