import Button from '@mui/joy/Button';
import Divider from '@mui/joy/Divider';
import DialogContent from '@mui/joy/DialogContent';
import DialogTitle from '@mui/joy/DialogTitle';
import FormControl from '@mui/joy/FormControl';
import FormLabel from '@mui/joy/FormLabel';
import Input from '@mui/joy/Input';
import Modal from '@mui/joy/Modal';
import ModalDialog from '@mui/joy/ModalDialog';
import Option from '@mui/joy/Option';
import Select from '@mui/joy/Select';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { counterPaymentMethods, paymentMethodWords, type BookingDetail } from '@loomwright/shared';
import { useState } from 'react';
import { ErrorNote } from 'src/components/ErrorNote';
import { formatMoney } from 'src/lib/format';
import { useRecordBalance, useRequestBalance } from '../api/balance';

type Method = (typeof counterPaymentMethods)[number];

/** While a balance is due: ask the player again, or (the owner) record the balance taken at the counter. */
export function BalanceDialog({
  booking,
  open,
  isOwner,
  onClose,
  onDone,
}: {
  booking: BookingDetail;
  open: boolean;
  isOwner: boolean;
  onClose: () => void;
  onDone: (message: string) => void;
}) {
  const request = useRequestBalance(booking.id);
  const record = useRecordBalance(booking.id);
  const [method, setMethod] = useState<Method>('card_terminal');
  const [note, setNote] = useState('');
  const due = booking.money.balanceDue ?? '0';
  const money = formatMoney(due, booking.money.currency);
  return (
    <Modal open={open} onClose={onClose}>
      <ModalDialog sx={{ width: 'min(520px, 96vw)' }}>
        <DialogTitle component="h2">
          Balance of {money} — {booking.reference}
        </DialogTitle>
        <DialogContent sx={{ gap: 1.5 }}>
          <Typography level="body-sm">
            The player pays online from the link in the e-mail or on their build page. Send the request again if they have not seen it.
          </Typography>
          <Button
            variant="outlined"
            color="primary"
            loading={request.isPending}
            onClick={() =>
              request.mutate(undefined, { onSuccess: () => onDone(`${booking.reference}: balance of ${money} requested again by e-mail.`) })
            }
            sx={{ alignSelf: 'flex-start' }}
          >
            E-mail the payment request again
          </Button>
          <ErrorNote error={request.error} />
          {isOwner && (
            <>
              <Divider />
              <Typography level="title-sm" component="h3">
                Record a balance taken at the counter
              </Typography>
              <Stack direction={{ xs: 'column', sm: 'row' }} gap={1}>
                <FormControl sx={{ flex: 1 }}>
                  <FormLabel>How it was paid</FormLabel>
                  <Select value={method} onChange={(_, v) => v && setMethod(v)}>
                    {counterPaymentMethods.map((m) => (
                      <Option key={m} value={m}>
                        {paymentMethodWords[m]}
                      </Option>
                    ))}
                  </Select>
                </FormControl>
                <FormControl sx={{ flex: 2 }}>
                  <FormLabel>Note (optional)</FormLabel>
                  <Input value={note} onChange={(e) => setNote(e.target.value)} />
                </FormControl>
              </Stack>
              <Button
                color="accent"
                loading={record.isPending}
                onClick={() =>
                  record.mutate(
                    { amount: due, method, ...(note.trim() ? { note: note.trim() } : {}) },
                    { onSuccess: () => onDone(`${booking.reference}: balance of ${money} recorded (${paymentMethodWords[method]}).`) },
                  )
                }
                sx={{ alignSelf: 'flex-start' }}
              >
                Record {money} received
              </Button>
              <ErrorNote error={record.error} />
            </>
          )}
        </DialogContent>
      </ModalDialog>
    </Modal>
  );
}
