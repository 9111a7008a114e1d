import { Navigate, useNavigate, useSearchParams } from 'react-router';
import { PageLoading } from 'src/components/PageLoading';
import { useMe } from 'src/features/auth/api/get-me';
import { AuthCard } from 'src/features/auth/components/AuthCard';
import { SignInForm } from 'src/features/auth/components/SignInForm';
import { useNextPath, withNext } from 'src/features/auth/hooks/use-next-path';

export function Component() {
  const me = useMe();
  const navigate = useNavigate();
  const next = useNextPath();
  const [params] = useSearchParams();
  if (me.isPending) return <PageLoading />;
  if (me.data) return <Navigate to={next} replace />;
  return (
    <AuthCard title="Sign in" intro="Sign in to request a build, pay your deposit and follow your board through the bench.">
      <SignInForm
        onSignedIn={() => navigate(next, { replace: true })}
        signUpHref={withNext('/sign-up', params.get('next'))}
        forgotHref="/forgot-password"
      />
    </AuthCard>
  );
}
