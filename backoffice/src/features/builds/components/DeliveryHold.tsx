import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { releaseDisputeSchema, type BookingDetail } from '@loomwright/shared';
import { useState } from 'react';
import { useReleaseDispute } from '../api/release-dispute';
import { NoteDialog } from './NoteDialog';

/**
 * A disputed payment holds delivery until the owner decides. Everyone sees why; the owner can
 * release it with a reason that goes on the timeline.
 */
export function DeliveryHold({
  booking,
  isOwner,
  onDone,
}: {
  booking: BookingDetail;
  isOwner: boolean;
  onDone: (message: string) => void;
}) {
  const [open, setOpen] = useState(false);
  const [invalid, setInvalid] = useState<Error | null>(null);
  const release = useReleaseDispute(booking.id);
  if (!booking.deliveryHold) return null;
  return (
    <Alert color="warning" variant="soft" role="alert">
      <Stack gap={1}>
        <Typography level="title-sm" component="h2">
          Delivery on hold: payment disputed
        </Typography>
        <Typography level="body-sm">{booking.deliveryHold}</Typography>
        {isOwner ? (
          <div>
            <Button size="sm" variant="outlined" color="warning" onClick={() => setOpen(true)}>
              Release delivery…
            </Button>
          </div>
        ) : (
          <Typography level="body-xs">Only the owner can release it.</Typography>
        )}
      </Stack>
      <NoteDialog
        open={open}
        title={`Release delivery — ${booking.reference}`}
        label="Why the build may be delivered (kept in the history)"
        required
        rule={releaseDisputeSchema.shape.note}
        confirm="Release delivery"
        pending={release.isPending}
        error={invalid ?? release.error}
        onClose={() => setOpen(false)}
        onConfirm={(note) => {
          const parsed = releaseDisputeSchema.safeParse({ note });
          if (!parsed.success) return setInvalid(new Error(parsed.error.issues[0]?.message ?? 'Say why.'));
          setInvalid(null);
          release.mutate(parsed.data.note, {
            onSuccess: () => {
              onDone(`${booking.reference}: delivery released.`);
              setOpen(false);
            },
          });
        }}
      >
        <Typography level="body-sm">
          Check the dispute in the payment provider's dashboard first: a lost dispute means the money was taken back.
        </Typography>
      </NoteDialog>
    </Alert>
  );
}
