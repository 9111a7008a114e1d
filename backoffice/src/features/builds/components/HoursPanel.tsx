import Button from '@mui/joy/Button';
import FormControl from '@mui/joy/FormControl';
import FormLabel from '@mui/joy/FormLabel';
import Input from '@mui/joy/Input';
import Stack from '@mui/joy/Stack';
import Table from '@mui/joy/Table';
import Typography from '@mui/joy/Typography';
import { timeEntryFormSchema, type BookingDetail, type TimeEntriesResponse, type TimeEntryFormInput, type TimeEntryFormOutput } from '@loomwright/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { ErrorNote } from 'src/components/ErrorNote';
import { formatDay, formatHours, today } from 'src/lib/format';
import { useAddTimeEntry } from '../api/add-time-entry';

/** Hours as they are spent, against the hours the firm quote planned. */
export function HoursPanel({ booking, entries }: { booking: BookingDetail; entries: TimeEntriesResponse | undefined }) {
  const add = useAddTimeEntry(booking.id);
  const form = useForm<TimeEntryFormInput, unknown, TimeEntryFormOutput>({
    resolver: zodResolver(timeEntryFormSchema),
    defaultValues: { workedOn: today(), hours: '', note: '' },
  });
  const canRecord = ['pedals_received', 'on_bench', 'testing', 'ready'].includes(booking.state);
  const submit = form.handleSubmit((values) =>
    add.mutate(
      { workedOn: values.workedOn, hours: values.hours, ...(values.note ? { note: values.note } : {}) },
      { onSuccess: () => form.reset({ workedOn: values.workedOn, hours: '', note: '' }) },
    ),
  );
  const errors = form.formState.errors;
  return (
    <Stack gap={1}>
      {entries && (
        <Typography level="body-sm" sx={{ fontVariantNumeric: 'tabular-nums' }}>
          Spent {formatHours(entries.totalHours)}
          {entries.plannedHours !== null ? ` of ${formatHours(entries.plannedHours)} planned` : ''}.
        </Typography>
      )}
      {entries && entries.entries.length > 0 && (
        <Table size="sm" aria-label="Hours recorded" sx={{ '--TableCell-height': '28px', fontVariantNumeric: 'tabular-nums' }}>
          <thead>
            <tr>
              <th>Day</th>
              <th>Builder</th>
              <th style={{ textAlign: 'right' }}>Hours</th>
              <th>Note</th>
            </tr>
          </thead>
          <tbody>
            {entries.entries.map((e) => (
              <tr key={e.id}>
                <td>{formatDay(e.workedOn)}</td>
                <td>{e.builder.name}</td>
                <td style={{ textAlign: 'right' }}>{formatHours(e.hours)}</td>
                <td>{e.note || '—'}</td>
              </tr>
            ))}
          </tbody>
        </Table>
      )}
      {canRecord ? (
        <Stack component="form" direction="row" gap={1} alignItems="flex-start" flexWrap="wrap" onSubmit={submit} noValidate>
          <FormControl size="sm" error={Boolean(errors.workedOn)}>
            <FormLabel>Day</FormLabel>
            <Input type="date" {...form.register('workedOn')} slotProps={{ input: { max: today() } }} />
          </FormControl>
          <FormControl size="sm" error={Boolean(errors.hours)} sx={{ width: 110 }}>
            <FormLabel>Hours</FormLabel>
            <Input inputMode="decimal" {...form.register('hours')} placeholder="1.5" />
          </FormControl>
          <FormControl size="sm" sx={{ flex: 1, minWidth: 200 }}>
            <FormLabel>Note</FormLabel>
            <Input {...form.register('note')} placeholder="What was done" />
          </FormControl>
          <Button size="sm" type="submit" loading={add.isPending} sx={{ mt: 2.75 }}>
            Record hours
          </Button>
        </Stack>
      ) : (
        <Typography level="body-xs">Hours are recorded once the pedals are in.</Typography>
      )}
      {(errors.workedOn || errors.hours) && (
        <Typography level="body-sm" color="danger" role="alert">
          {errors.workedOn?.message ?? errors.hours?.message}
        </Typography>
      )}
      <ErrorNote error={add.error} />
    </Stack>
  );
}
