import Alert from '@mui/joy/Alert';
import DialogContent from '@mui/joy/DialogContent';
import DialogTitle from '@mui/joy/DialogTitle';
import FormControl from '@mui/joy/FormControl';
import FormHelperText from '@mui/joy/FormHelperText';
import FormLabel from '@mui/joy/FormLabel';
import Modal from '@mui/joy/Modal';
import ModalDialog from '@mui/joy/ModalDialog';
import Textarea from '@mui/joy/Textarea';
import { declineBookingSchema, type BookingSummary, type DeclineBookingInput } from '@loomwright/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect } from 'react';
import { useForm } from 'react-hook-form';
import { ErrorNote } from 'src/components/ErrorNote';
import { formatMoney } from 'src/lib/format';
import { useDeclineBooking } from '../api/decline-booking';
import { DialogButtons } from 'src/components/DialogButtons';

export function DeclineDialog({
  booking,
  isOwner,
  onClose,
  onDeclined,
}: {
  booking: BookingSummary | null;
  isOwner: boolean;
  onClose: () => void;
  onDeclined?: (message: string) => void;
}) {
  const decline = useDeclineBooking();
  const form = useForm<DeclineBookingInput>({ resolver: zodResolver(declineBookingSchema), defaultValues: { reason: '' } });
  const { reset: resetForm } = form;
  const resetDecline = decline.reset;
  useEffect(() => {
    if (!booking) {
      resetForm({ reason: '' });
      resetDecline();
    }
  }, [booking, resetForm, resetDecline]);

  const paid = booking?.depositStatus === 'paid';
  const submit = form.handleSubmit(({ reason }) => {
    if (!booking) return;
    decline.mutate(
      { id: booking.id, reason },
      {
        onSuccess: () => {
          onDeclined?.(
            `${booking.reference} is declined${paid ? `; the deposit of ${formatMoney(booking.deposit, booking.currency)} is being refunded` : ''}.`,
          );
          onClose();
        },
      },
    );
  });

  return (
    <Modal open={Boolean(booking)} onClose={onClose}>
      <ModalDialog sx={{ width: 'min(520px, 96vw)' }} aria-labelledby="decline-title">
        <form onSubmit={submit} noValidate>
          <DialogTitle id="decline-title" component="h2" sx={{ mb: 1.5 }}>
            Decline {booking?.reference}
          </DialogTitle>
          <DialogContent sx={{ gap: 1.5 }}>
            {paid && isOwner && (
              <Alert color="warning" variant="soft">
                This request is paid. Declining it refunds the deposit of {booking && formatMoney(booking.deposit, booking.currency)} to the
                player through the payment provider.
              </Alert>
            )}
            {paid && !isOwner && (
              <Alert color="warning" variant="soft">
                This request is paid; declining it refunds the deposit, which only the owner can do. Ask the owner to decline it.
              </Alert>
            )}
            <FormControl error={Boolean(form.formState.errors.reason)} required>
              <FormLabel>Reason (the player reads it)</FormLabel>
              <Textarea minRows={3} {...form.register('reason')} />
              <FormHelperText>{form.formState.errors.reason?.message ?? 'For example: the queue is full until spring.'}</FormHelperText>
            </FormControl>
            <ErrorNote error={decline.error} />
          </DialogContent>
          <DialogButtons color="danger" pending={decline.isPending} disabled={paid && !isOwner} onCancel={onClose} spaced>
            Decline{paid && isOwner ? ' and refund' : ''}
          </DialogButtons>
        </form>
      </ModalDialog>
    </Modal>
  );
}
