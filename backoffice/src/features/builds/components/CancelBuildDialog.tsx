import Alert from '@mui/joy/Alert';
import DialogContent from '@mui/joy/DialogContent';
import DialogTitle from '@mui/joy/DialogTitle';
import FormControl from '@mui/joy/FormControl';
import FormLabel from '@mui/joy/FormLabel';
import Modal from '@mui/joy/Modal';
import ModalDialog from '@mui/joy/ModalDialog';
import Radio from '@mui/joy/Radio';
import RadioGroup from '@mui/joy/RadioGroup';
import Textarea from '@mui/joy/Textarea';
import Typography from '@mui/joy/Typography';
import { cancelScheduledSchema, type CancellationCause } from '@loomwright/shared';
import { useEffect, useState } from 'react';
import { ErrorNote } from 'src/components/ErrorNote';
import { PageLoading } from 'src/components/PageLoading';
import { formatHours, formatMoney } from 'src/lib/format';
import { useCancelScheduled, useCancellation } from '../api/cancel-scheduled';
import { DialogButtons } from 'src/components/DialogButtons';
import { FormProblems } from 'src/components/FormProblems';

/**
 * The owner cancels a build that already holds bench time. The refund each cause brings, per the
 * shop's deposit policy, is shown before confirming; the server applies the same rule.
 */
export function CancelBuildDialog({
  booking,
  onClose,
  onCancelled,
}: {
  booking: { id: string; reference: string } | null;
  onClose: () => void;
  onCancelled?: (message: string) => void;
}) {
  const preview = useCancellation(booking?.id ?? null);
  const cancel = useCancelScheduled(booking?.id ?? '');
  const [cause, setCause] = useState<CancellationCause>('player');
  const [reason, setReason] = useState('');
  const [formErrors, setFormErrors] = useState<string[]>([]);

  const resetCancel = cancel.reset;
  useEffect(() => {
    setCause('player');
    setReason('');
    setFormErrors([]);
    resetCancel();
  }, [booking, resetCancel]);

  const p = preview.data;
  const refund = p ? (cause === 'shop' ? p.refundIfShopCancels : p.refundIfPlayerAsked) : null;

  const submit = () => {
    const parsed = cancelScheduledSchema.safeParse({ cause, reason });
    if (!parsed.success) return setFormErrors(parsed.error.issues.map((i) => i.message));
    setFormErrors([]);
    cancel.mutate(parsed.data, {
      onSuccess: () => {
        onCancelled?.(`${booking?.reference} is cancelled; its bench time is free again and the player has been e-mailed.`);
        onClose();
      },
    });
  };

  return (
    <Modal open={Boolean(booking)} onClose={onClose}>
      <ModalDialog sx={{ width: 'min(560px, 96vw)' }} aria-labelledby="cancel-build-title">
        <DialogTitle id="cancel-build-title" component="h2">
          Cancel {booking?.reference}
        </DialogTitle>
        <DialogContent sx={{ gap: 2 }}>
          {preview.isPending && <PageLoading label="Reading the deposit policy…" />}
          <ErrorNote error={preview.error} />
          {p && (
            <>
              <Typography level="body-sm">
                This releases {formatHours(p.benchHours)} of bench time. {p.policy}
              </Typography>
              <FormControl>
                <FormLabel id="cancel-cause-label">Who asked for it</FormLabel>
                <RadioGroup
                  aria-labelledby="cancel-cause-label"
                  value={cause}
                  onChange={(event) => setCause(event.target.value as CancellationCause)}
                >
                  <Radio
                    value="player"
                    label={`The player asked: refund ${formatMoney(p.refundIfPlayerAsked, p.currency)} of the ${formatMoney(p.depositPaid, p.currency)} deposit`}
                  />
                  <Radio value="shop" label={`The shop cannot build it: refund ${formatMoney(p.refundIfShopCancels, p.currency)}`} />
                </RadioGroup>
              </FormControl>
              <Alert color="neutral" variant="soft">
                Refund on confirming: {formatMoney(refund, p.currency)}.
              </Alert>
            </>
          )}
          <FormControl required>
            <FormLabel>Why (the player reads this)</FormLabel>
            <Textarea minRows={2} value={reason} onChange={(event) => setReason(event.target.value)} />
          </FormControl>
          <FormProblems problems={formErrors} />
          <ErrorNote error={cancel.error} />
        </DialogContent>
        <DialogButtons
          onConfirm={submit}
          color="danger"
          pending={cancel.isPending}
          disabled={!p}
          cancelLabel="Keep the build"
          onCancel={onClose}
        >
          Cancel the build
        </DialogButtons>
      </ModalDialog>
    </Modal>
  );
}
