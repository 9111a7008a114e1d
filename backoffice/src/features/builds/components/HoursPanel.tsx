import Button from '@mui/joy/Button';
import FormControl from '@mui/joy/FormControl';
import FormHelperText from '@mui/joy/FormHelperText';
import FormLabel from '@mui/joy/FormLabel';
import Input from '@mui/joy/Input';
import Stack from '@mui/joy/Stack';
import Table from '@mui/joy/Table';
import Typography from '@mui/joy/Typography';
import {
  timeEntryFormSchema,
  type BookingDetail,
  type TimeEntriesResponse,
  type TimeEntryFormInput,
  type TimeEntryFormOutput,
} from '@loomwright/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { hasErrorCode } from '@loomwright/shared';
import { setServerFieldErrors } from '@loomwright/shared/ui';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { ErrorNote } from 'src/components/ErrorNote';
import { formatDay, formatHours, today } from 'src/lib/format';
import { useAddTimeEntry } from '../api/add-time-entry';
import { useDeleteTimeEntry, useEditTimeEntry } from '../api/correct-time-entry';

/** The fields of a day's hours, as the API names them: a refusal of one stands under it. */
const HOUR_FIELDS = ['workedOn', 'hours', 'note'] as const;

/** Hours as they are spent, against the hours the firm quote planned. */
export function HoursPanel({
  booking,
  entries,
  meId,
  isOwner,
}: {
  booking: BookingDetail;
  entries: TimeEntriesResponse | undefined;
  meId: string | undefined;
  isOwner: boolean;
}) {
  const add = useAddTimeEntry(booking.id);
  const edit = useEditTimeEntry(booking.id);
  const remove = useDeleteTimeEntry(booking.id);
  const [editing, setEditing] = useState<{ id: string; hours: string; note: string; problem?: string } | null>(null);
  // Only the person who recorded an entry, or the owner, may correct it (the API says the same).
  const mayCorrect = (e: TimeEntriesResponse['entries'][number]) => isOwner || (!!meId && e.recordedBy?.id === meId);
  const saveEdit = (workedOn: string) => {
    if (!editing) return;
    const parsed = timeEntryFormSchema.safeParse({ workedOn, hours: editing.hours, note: editing.note });
    if (!parsed.success) return setEditing({ ...editing, problem: parsed.error.issues[0]?.message });
    edit.mutate(
      { entryId: editing.id, body: { hours: parsed.data.hours, note: parsed.data.note } },
      {
        onSuccess: () => setEditing(null),
        // The corrected row's own words, as the form's own check would give them.
        onError: (error) =>
          hasErrorCode(error, 'validation_failed') && setEditing({ ...editing, problem: error.issues.map((i) => i.message).join(' ') }),
      },
    );
  };
  const form = useForm<TimeEntryFormInput, unknown, TimeEntryFormOutput>({
    resolver: zodResolver(timeEntryFormSchema),
    defaultValues: { workedOn: today(), hours: '', note: '' },
  });
  const canRecord = ['pedals_received', 'on_bench', 'testing', 'ready'].includes(booking.state);
  const submit = form.handleSubmit((values) =>
    add.mutate(
      { workedOn: values.workedOn, hours: values.hours, ...(values.note ? { note: values.note } : {}) },
      {
        onSuccess: () => form.reset({ workedOn: values.workedOn, hours: '', note: '' }),
        onError: (error) => setServerFieldErrors(error, form.setError, HOUR_FIELDS),
      },
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
              {canRecord && <th aria-label="Corrections" />}
            </tr>
          </thead>
          <tbody>
            {entries.entries.map((e) => (
              <tr key={e.id}>
                <td>{formatDay(e.workedOn)}</td>
                <td>{e.builder.name}</td>
                {editing?.id === e.id ? (
                  <>
                    <td style={{ textAlign: 'right' }}>
                      <Input
                        size="sm"
                        value={editing.hours}
                        onChange={(ev) => setEditing({ ...editing, hours: ev.target.value })}
                        slotProps={{ input: { 'aria-label': 'Corrected hours', inputMode: 'decimal' } }}
                      />
                    </td>
                    <td>
                      <Input
                        size="sm"
                        value={editing.note}
                        onChange={(ev) => setEditing({ ...editing, note: ev.target.value })}
                        slotProps={{ input: { 'aria-label': 'Corrected note' } }}
                      />
                      {editing.problem && (
                        <Typography level="body-xs" color="danger" role="alert">
                          {editing.problem}
                        </Typography>
                      )}
                    </td>
                    <td>
                      <Button size="sm" loading={edit.isPending} onClick={() => saveEdit(e.workedOn)}>
                        Save
                      </Button>
                      <Button size="sm" variant="plain" color="neutral" onClick={() => setEditing(null)}>
                        Cancel
                      </Button>
                    </td>
                  </>
                ) : (
                  <>
                    <td style={{ textAlign: 'right' }}>{formatHours(e.hours)}</td>
                    <td>
                      {e.note || '—'}
                      {e.updatedAt && <Typography level="body-xs"> (corrected)</Typography>}
                    </td>
                    {canRecord && (
                      <td>
                        {mayCorrect(e) && (
                          <>
                            <Button
                              size="sm"
                              variant="plain"
                              onClick={() => setEditing({ id: e.id, hours: String(e.hours), note: e.note })}
                            >
                              Correct
                            </Button>
                            <Button
                              size="sm"
                              variant="plain"
                              color="danger"
                              loading={remove.isPending && remove.variables === e.id}
                              onClick={() => remove.mutate(e.id)}
                            >
                              Delete
                            </Button>
                          </>
                        )}
                      </td>
                    )}
                  </>
                )}
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
            {errors.workedOn && <FormHelperText>{errors.workedOn.message}</FormHelperText>}
          </FormControl>
          <FormControl size="sm" error={Boolean(errors.hours)} sx={{ width: 110 }}>
            <FormLabel>Hours</FormLabel>
            <Input inputMode="decimal" {...form.register('hours')} placeholder="1.5" />
            {errors.hours && <FormHelperText>{errors.hours.message}</FormHelperText>}
          </FormControl>
          <FormControl size="sm" error={Boolean(errors.note)} sx={{ flex: 1, minWidth: 200 }}>
            <FormLabel>Note</FormLabel>
            <Input {...form.register('note')} placeholder="What was done" />
            {errors.note && <FormHelperText>{errors.note.message}</FormHelperText>}
          </FormControl>
          <Button size="sm" type="submit" loading={add.isPending} sx={{ mt: 2.75 }}>
            Record hours
          </Button>
        </Stack>
      ) : (
        <Typography level="body-xs">Hours are recorded once the pedals are in.</Typography>
      )}
      <ErrorNote error={add.error ?? edit.error ?? remove.error} fields={HOUR_FIELDS} />
    </Stack>
  );
}
