import Button from '@mui/joy/Button';
import Stack from '@mui/joy/Stack';
import { useStartCheckout } from 'src/features/payments/api/start-checkout';
import { ApiErrorAlert } from '@loomwright/shared/ui';

/** Sends the player to the payment provider's hosted page; the server makes one session per payment. */
export function PayButton({ bookingId, label }: { bookingId: string; label: string }) {
  const checkout = useStartCheckout();
  const busy = checkout.isPending || checkout.isSuccess;
  return (
    <Stack gap={1}>
      <Button
        color="accent"
        size="lg"
        loading={busy}
        onClick={() => checkout.mutate(bookingId, { onSuccess: ({ url }) => window.location.assign(url) })}
        sx={{ alignSelf: 'flex-start' }}
      >
        {label}
      </Button>
      <ApiErrorAlert error={checkout.error} />
    </Stack>
  );
}
