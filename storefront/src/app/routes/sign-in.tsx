import { AuthCard } from 'src/features/auth/components/AuthCard';
import { SignInForm } from 'src/features/auth/components/SignInForm';
import { useVisitorPage } from 'src/features/auth/hooks/use-visitor-page';

export function Component() {
  const { instead, goNext, linkTo } = useVisitorPage();
  if (instead) return instead;
  return (
    <AuthCard title="Sign in" intro="Sign in to request a build, pay your deposit and follow your board through the bench.">
      <SignInForm onSignedIn={goNext} signUpHref={linkTo('/sign-up')} forgotHref="/forgot-password" />
    </AuthCard>
  );
}
