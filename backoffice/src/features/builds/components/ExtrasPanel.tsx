import Button from '@mui/joy/Button';
import FormControl from '@mui/joy/FormControl';
import FormLabel from '@mui/joy/FormLabel';
import Input from '@mui/joy/Input';
import Stack from '@mui/joy/Stack';
import Table from '@mui/joy/Table';
import Typography from '@mui/joy/Typography';
import { decidedViaWords, proposeExtraSchema, type BookingDetail, type ExtraView, type ProposeExtraInput } from '@loomwright/shared';
import { useState } from 'react';
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { ErrorNote } from 'src/components/ErrorNote';
import { formatMoney, formatStamp } from 'src/lib/format';
import { useProposeExtra } from '../api/propose-extra';
import { RecordDecisionDialog } from './RecordDecisionDialog';

const statusWords: Record<ExtraView['status'], string> = {
  proposed: 'Waiting for the player (e-mailed)',
  approved: 'Approved',
  declined: 'Declined',
};

/** Extra materials need the player's yes, with a price, before they go on the board. */
export function ExtrasPanel({ booking, extras, isOwner }: { booking: BookingDetail; extras: ExtraView[] | undefined; isOwner: boolean }) {
  const propose = useProposeExtra(booking.id);
  const form = useForm<ProposeExtraInput>({
    resolver: zodResolver(proposeExtraSchema),
    defaultValues: { description: '', amount: '', reason: '' },
  });
  const canPropose = isOwner && ['scheduled', 'pedals_received', 'on_bench', 'testing'].includes(booking.state);
  // Any staff member may record an answer the player gave by phone or in person.
  const canRecord = ['scheduled', 'pedals_received', 'on_bench', 'testing'].includes(booking.state);
  const [recording, setRecording] = useState<ExtraView | null>(null);
  const errors = form.formState.errors;
  const firstError = errors.description?.message ?? errors.amount?.message ?? errors.reason?.message;
  return (
    <Stack gap={1}>
      {extras && extras.length === 0 && <Typography level="body-sm">No extras.</Typography>}
      {extras && extras.length > 0 && (
        <Table size="sm" aria-label="Extras" sx={{ '--TableCell-height': '28px', fontVariantNumeric: 'tabular-nums' }}>
          <thead>
            <tr>
              <th>Extra</th>
              <th style={{ textAlign: 'right' }}>Price</th>
              <th>Status</th>
              <th>Proposed</th>
            </tr>
          </thead>
          <tbody>
            {extras.map((x) => (
              <tr key={x.id}>
                <td>
                  {x.description}
                  <Typography level="body-xs" sx={{ display: 'block' }}>
                    {x.reason}
                  </Typography>
                </td>
                <td style={{ textAlign: 'right' }}>{formatMoney(x.amount, booking.currency)}</td>
                <td>
                  {statusWords[x.status]}
                  {x.decision && (
                    <Typography level="body-xs" sx={{ display: 'block' }}>
                      {x.decision.givenBy} {decidedViaWords[x.decision.via]}
                      {x.decision.recordedBy ? `, recorded by ${x.decision.recordedBy}` : ''}
                      {x.decision.comment ? `: “${x.decision.comment}”` : ''}
                    </Typography>
                  )}
                  {x.status === 'proposed' && canRecord && (
                    <Button size="sm" variant="plain" onClick={() => setRecording(x)}>
                      Record an answer…
                    </Button>
                  )}
                </td>
                <td>{formatStamp(x.createdAt)}</td>
              </tr>
            ))}
          </tbody>
        </Table>
      )}
      {canPropose && (
        <Stack
          component="form"
          direction="row"
          gap={1}
          alignItems="flex-start"
          flexWrap="wrap"
          noValidate
          onSubmit={form.handleSubmit((values) => propose.mutate(values, { onSuccess: () => form.reset() }))}
        >
          <FormControl size="sm" error={Boolean(errors.description)} sx={{ flex: 2, minWidth: 180 }}>
            <FormLabel>Extra</FormLabel>
            <Input {...form.register('description')} placeholder="A longer road case" />
          </FormControl>
          <FormControl size="sm" error={Boolean(errors.amount)} sx={{ width: 110 }}>
            <FormLabel>Price ({booking.currency})</FormLabel>
            <Input inputMode="decimal" {...form.register('amount')} placeholder="45.00" />
          </FormControl>
          <FormControl size="sm" error={Boolean(errors.reason)} sx={{ flex: 2, minWidth: 180 }}>
            <FormLabel>Why</FormLabel>
            <Input {...form.register('reason')} placeholder="The rig no longer fits the first case" />
          </FormControl>
          <Button size="sm" type="submit" loading={propose.isPending} sx={{ mt: 2.75 }}>
            Ask the player
          </Button>
        </Stack>
      )}
      {!isOwner && <Typography level="body-xs">The owner proposes extras to the player.</Typography>}
      {firstError && (
        <Typography level="body-sm" color="danger" role="alert">
          {firstError}
        </Typography>
      )}
      <ErrorNote error={propose.error} />
      <RecordDecisionDialog
        bookingId={booking.id}
        target={recording ? { extraId: recording.id } : null}
        what={recording?.description ?? ''}
        playerName={booking.customer.name}
        onClose={() => setRecording(null)}
        onDone={() => setRecording(null)}
      />
    </Stack>
  );
}
