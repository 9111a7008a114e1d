import { AuthCard } from 'src/features/auth/components/AuthCard';
import { SignUpForm } from 'src/features/auth/components/SignUpForm';
import { useVisitorPage } from 'src/features/auth/hooks/use-visitor-page';

export function Component() {
  const { instead, goNext, linkTo } = useVisitorPage();
  if (instead) return instead;
  return (
    <AuthCard
      title="Create your account"
      intro="An account keeps your quote, your deposit and your build's progress in one place. Your configuration comes with you."
    >
      <SignUpForm onSignedUp={goNext} signInHref={linkTo('/sign-in')} />
    </AuthCard>
  );
}
