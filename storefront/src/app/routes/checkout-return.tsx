import { ApiErrorAlert } from '@loomwright/shared/ui';
import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import Card from '@mui/joy/Card';
import CircularProgress from '@mui/joy/CircularProgress';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { Link as RouterLink, useSearchParams } from 'react-router';
import type { BookingDetail } from '@loomwright/shared';
import { useBooking } from 'src/features/bookings/api/get-booking';
import { PayButton } from 'src/features/payments/components/PayButton';
import { formatAmount } from 'src/lib/format';

const isUuid = (v: string) => /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(v);
const depositSettled = (b: BookingDetail) =>
  b.depositStatus === 'paid' || b.depositStatus === 'refunded' || b.depositStatus === 'processing';
const latestDeposit = (b: BookingDetail) => [...b.payments].reverse().find((p) => p.kind === 'deposit');

/**
 * Where the provider sends the player back. The redirect proves nothing: the page asks the API,
 * and keeps asking until the signed webhook has landed and the booking says paid.
 */
export function Component() {
  const [params] = useSearchParams();
  const bookingId = params.get('booking') ?? '';
  const result = params.get('result') === 'paid' ? 'paid' : 'cancelled';
  const valid = isUuid(bookingId);
  const booking = useBooking(valid ? bookingId : 'missing', result === 'paid' ? depositSettled : undefined);

  if (!valid)
    return (
      <Alert color="warning" role="alert">
        This return link is missing its booking. Open My builds to see where things stand.
      </Alert>
    );
  if (booking.isPending)
    return (
      <Stack alignItems="center" sx={{ py: 6 }}>
        <CircularProgress aria-label="Loading your booking" />
      </Stack>
    );
  if (booking.error) return <ApiErrorAlert error={booking.error} />;
  const b = booking.data;
  const last = latestDeposit(b);

  let title: string;
  let body: string;
  if (b.depositStatus === 'paid') {
    title = 'Deposit paid';
    body = `Thank you. ${formatAmount(last?.amount ?? b.deposit, b.currency)} is paid and build ${b.reference} holds its place in the queue. The shop will set a bench date and e-mail you what to ship and when.`;
  } else if (b.depositStatus === 'processing') {
    title = 'Bank payment started';
    body = `Thank you. Your bank payment of ${formatAmount(last?.amount ?? b.deposit, b.currency)} for build ${b.reference} is on its way; bank debits take a few working days to settle. We e-mail you as soon as it has, and the shop then sets a bench date. If your bank does not complete it, we tell you and you can pay again.`;
  } else if (result === 'paid') {
    title = 'Confirming your payment…';
    body =
      'The payment provider is telling the shop about your payment; this usually takes a few seconds. You can leave this page: the e-mail confirmation follows.';
  } else if (last?.status === 'failed') {
    title = 'Payment failed';
    body = `The payment did not go through: ${(last.failureMessage ?? 'no reason given').replace(/\.$/, '')}. Nothing was charged; try again with another card or account.`;
  } else {
    title = 'Payment cancelled';
    body = `You left the payment page before paying, so nothing was charged. Build ${b.reference} is saved; pay the deposit whenever you are ready.`;
  }

  return (
    <Card variant="outlined" sx={{ maxWidth: 640, mx: 'auto' }} role="status" aria-live="polite">
      <Typography level="h1" sx={{ fontSize: 'xl2' }}>
        {title}
      </Typography>
      {result === 'paid' && !depositSettled(b) && <CircularProgress size="sm" aria-label="Waiting for the payment to be confirmed" />}
      <Typography>{body}</Typography>
      <Stack direction="row" gap={1} flexWrap="wrap">
        {b.state === 'requested' && b.depositStatus !== 'paid' && result !== 'paid' && (
          <PayButton bookingId={b.id} label="Pay the deposit" />
        )}
        <Button component={RouterLink} to={`/builds/${b.id}`} variant="outlined">
          Open build {b.reference}
        </Button>
        <Button component={RouterLink} to="/builds" variant="plain">
          My builds
        </Button>
      </Stack>
    </Card>
  );
}
