import { Navigate, useNavigate, useSearchParams } from 'react-router';
import { PageLoading } from 'src/components/PageLoading';
import { useMe } from 'src/features/auth/api/get-me';
import { AuthCard } from 'src/features/auth/components/AuthCard';
import { SignUpForm } from 'src/features/auth/components/SignUpForm';
import { useNextPath, withNext } from 'src/features/auth/hooks/use-next-path';

export function Component() {
  const me = useMe();
  const navigate = useNavigate();
  const next = useNextPath();
  const [params] = useSearchParams();
  if (me.isPending) return <PageLoading />;
  if (me.data) return <Navigate to={next} replace />;
  return (
    <AuthCard
      title="Create your account"
      intro="An account keeps your quote, your deposit and your build's progress in one place. Your configuration comes with you."
    >
      <SignUpForm onSignedUp={() => navigate(next, { replace: true })} signInHref={withNext('/sign-in', params.get('next'))} />
    </AuthCard>
  );
}
