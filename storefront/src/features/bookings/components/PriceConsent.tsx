import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import type { BookingDetail } from '@loomwright/shared';
import { formatAmount } from 'src/lib/format';
import { useDecidePrice } from '../api/decide-price';

/**
 * The firm total came out above the estimate the player was quoted (a builder of a higher level
 * or rate): the shop keeps the deposit only once the player agrees; saying no cancels the build
 * with the whole deposit back.
 */
export function PriceConsent({ booking }: { booking: BookingDetail }) {
  const decide = useDecidePrice();
  return (
    <Alert color="warning" variant="soft" role="region" aria-label="Your answer on the new price">
      <Stack gap={1}>
        <Typography level="title-sm">The firm price is above your estimate</Typography>
        <Typography level="body-sm">
          Your estimate was up to {formatAmount(booking.totalHigh, booking.currency)}; the firm total is{' '}
          <b>{formatAmount(booking.firmTotal ?? '0', booking.currency)}</b>.
          {booking.levelOverrideReason ? ` The shop says: ${booking.levelOverrideReason}` : ''} Do you want to keep the build at this price?
          If not, it is cancelled and your whole deposit is refunded.
        </Typography>
        <Stack direction="row" gap={1} flexWrap="wrap">
          <Button
            loading={decide.isPending && decide.variables?.accept === true}
            onClick={() => decide.mutate({ id: booking.id, accept: true })}
          >
            Keep the build at this price
          </Button>
          <Button
            variant="outlined"
            color="neutral"
            loading={decide.isPending && decide.variables?.accept === false}
            onClick={() => decide.mutate({ id: booking.id, accept: false })}
          >
            Cancel with a full refund
          </Button>
        </Stack>
        {decide.error && (
          <Typography role="alert" level="body-sm">
            {decide.error.message}
          </Typography>
        )}
      </Stack>
    </Alert>
  );
}
