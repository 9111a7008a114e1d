import { hasErrorCode } from '@loomwright/shared';
import { NewPasswordForm } from '@loomwright/shared/ui';
import { useAcceptInvitation } from 'src/features/auth/api/accept-invitation';

export function AcceptInviteForm({ token, onAccepted }: { token: string; onAccepted: () => void }) {
  const accept = useAcceptInvitation();
  return (
    <NewPasswordForm
      label="Accept the invitation"
      passwordLabel="Choose a password"
      repeatLabel="Password again"
      submitLabel="Join the bench"
      mutation={accept}
      action={hasErrorCode(accept.error, 'link_invalid') ? 'Ask the shop’s owner to send a fresh invitation.' : undefined}
      onSubmit={(password, { onError }) => accept.mutate({ token, password }, { onSuccess: onAccepted, onError })}
    />
  );
}
