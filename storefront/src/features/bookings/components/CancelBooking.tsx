import { useState } from 'react';
import Button from '@mui/joy/Button';
import Stack from '@mui/joy/Stack';
import Textarea from '@mui/joy/Textarea';
import Typography from '@mui/joy/Typography';
import { useCancelBooking } from 'src/features/bookings/api/cancel-booking';
import { ApiErrorAlert } from '@loomwright/shared/ui';

/** Cancel before a bench date is set; a paid deposit goes back to the card it came from. */
export function CancelBooking({ bookingId, depositPaid }: { bookingId: string; depositPaid: boolean }) {
  const cancel = useCancelBooking();
  const [confirming, setConfirming] = useState(false);
  const [reason, setReason] = useState('');
  if (!confirming) {
    return (
      <Button variant="plain" color="danger" onClick={() => setConfirming(true)} sx={{ alignSelf: 'flex-start' }}>
        Cancel this request
      </Button>
    );
  }
  return (
    <Stack gap={1}>
      <Typography level="body-sm">
        {depositPaid ? 'Your deposit will be refunded to the card you paid with.' : 'No payment has been taken, so nothing is charged.'}
      </Typography>
      <Textarea
        minRows={2}
        placeholder="Why are you cancelling? (optional)"
        value={reason}
        onChange={(e) => setReason(e.target.value)}
        slotProps={{ textarea: { 'aria-label': 'Reason for cancelling', maxLength: 1000 } }}
      />
      <Stack direction="row" gap={1}>
        <Button
          color="danger"
          loading={cancel.isPending}
          onClick={() => cancel.mutate({ id: bookingId, reason: reason.trim() || undefined })}
        >
          Yes, cancel the request
        </Button>
        <Button variant="plain" onClick={() => setConfirming(false)}>
          Keep it
        </Button>
      </Stack>
      <ApiErrorAlert error={cancel.error} />
    </Stack>
  );
}
