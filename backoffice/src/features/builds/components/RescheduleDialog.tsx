import Checkbox from '@mui/joy/Checkbox';
import DialogContent from '@mui/joy/DialogContent';
import DialogTitle from '@mui/joy/DialogTitle';
import FormControl from '@mui/joy/FormControl';
import FormHelperText from '@mui/joy/FormHelperText';
import FormLabel from '@mui/joy/FormLabel';
import Input from '@mui/joy/Input';
import Modal from '@mui/joy/Modal';
import ModalDialog from '@mui/joy/ModalDialog';
import Option from '@mui/joy/Option';
import Select from '@mui/joy/Select';
import Textarea from '@mui/joy/Textarea';
import Typography from '@mui/joy/Typography';
import { dateShiftWords, isCalendarDay, rescheduleSchema } from '@loomwright/shared';
import { useEffect, useState } from 'react';
import { BenchDatePreview } from 'src/components/BenchDatePreview';
import { useBenchPreview } from 'src/features/bench/api/get-bench-preview';
import { useBenchSuggestion } from 'src/features/bench/api/get-bench-suggestion';
import { ErrorNote } from 'src/components/ErrorNote';
import { formatDay } from 'src/lib/format';
import { useRescheduleBooking } from '../api/reschedule-booking';
import { DialogButtons } from 'src/components/DialogButtons';
import { FormProblems } from 'src/components/FormProblems';

/** The build being moved, as the Bench or the build page knows it. */
export interface MovableBuild {
  bookingId: string;
  reference: string;
  builderId: string | null;
  benchDate: string | null;
}

/**
 * Move a scheduled build to another day or builder. The preview shows the chosen builder's load
 * and why a day is refused before anything is sent; the server checks again in one transaction.
 */
export function RescheduleDialog({
  build,
  isOwner,
  onClose,
  onMoved,
}: {
  build: MovableBuild | null;
  isOwner: boolean;
  onClose: () => void;
  onMoved?: (message: string) => void;
}) {
  const options = useBenchSuggestion(build?.bookingId ?? null);
  const move = useRescheduleBooking();
  const [builderId, setBuilderId] = useState<string | null>(null);
  const [benchDate, setBenchDate] = useState('');
  const [reason, setReason] = useState('');
  const [reprice, setReprice] = useState(false);
  const [overrideReason, setOverrideReason] = useState('');
  const [formErrors, setFormErrors] = useState<string[]>([]);

  // A mutation's reset is stable across renders (TanStack Query keeps one observer per hook).
  const resetMove = move.reset;
  useEffect(() => {
    setBuilderId(build?.builderId ?? null);
    setBenchDate(build?.benchDate ?? '');
    setReason('');
    setReprice(false);
    setOverrideReason('');
    setFormErrors([]);
    resetMove();
  }, [build, resetMove]);

  const preview = useBenchPreview(build?.bookingId ?? null, builderId, benchDate);
  const option = preview.data?.options.find((o) => o.builder.id === builderId);
  const data = options.data;
  const builders = [...(data?.suggestions ?? [])];
  const reassigned = Boolean(build && builderId && builderId !== build.builderId);
  const chosen = builders.find((s) => s.builder.id === builderId);
  const belowChosen = reassigned && chosen ? !chosen.meetsChosenLevel : false;

  const submit = () => {
    if (!build || !builderId) return;
    const parsed = rescheduleSchema.safeParse({
      builderId,
      benchDate,
      reason,
      ...(reassigned && reprice ? { reprice: true } : {}),
      ...(belowChosen ? { levelOverrideReason: overrideReason } : {}),
    });
    // The same schema and words as the API.
    if (!parsed.success) return setFormErrors(parsed.error.issues.map((i) => i.message));
    setFormErrors([]);
    move.mutate(
      { id: build.bookingId, body: parsed.data },
      {
        onSuccess: (result) => {
          onMoved?.(
            `${build.reference} moved to ${formatDay(result.benchDate)} (${result.shift}); the player has been e-mailed the new date.`,
          );
          onClose();
        },
      },
    );
  };

  return (
    <Modal open={Boolean(build)} onClose={onClose}>
      <ModalDialog sx={{ width: 'min(640px, 96vw)', overflow: 'auto' }} aria-labelledby="move-title">
        <DialogTitle id="move-title" component="h2">
          Move {build?.reference}
        </DialogTitle>
        <DialogContent sx={{ gap: 2 }}>
          <ErrorNote error={options.error} action="Close this and try again in a moment." />
          {build?.benchDate && (
            <Typography level="body-sm">
              Now on the bench from {formatDay(build.benchDate)}. The player gets an e-mail with the new date and an updated calendar file.
            </Typography>
          )}
          <FormControl>
            <FormLabel id="move-builder-label">Builder</FormLabel>
            <Select aria-labelledby="move-builder-label" value={builderId} onChange={(_, value) => value && setBuilderId(value)}>
              {builders.map((s) => (
                <Option
                  key={s.builder.id}
                  value={s.builder.id}
                  disabled={!s.meetsChosenLevel && !isOwner && s.builder.id !== build?.builderId}
                >
                  {s.builder.name} · {s.builder.level}
                  {s.builder.id === build?.builderId ? ' (now)' : ''}
                  {s.meetsChosenLevel ? '' : ' · below the level the player chose'}
                </Option>
              ))}
            </Select>
            {chosen && (
              <FormHelperText>
                Earliest day {chosen.builder.name} can start it: {formatDay(chosen.benchDate)}.
              </FormHelperText>
            )}
          </FormControl>
          <FormControl>
            <FormLabel>New bench date</FormLabel>
            <Input
              type="date"
              value={benchDate}
              onChange={(event) => setBenchDate(event.target.value)}
              slotProps={{ input: { 'aria-label': 'New bench date' } }}
            />
            {build?.benchDate && isCalendarDay(benchDate) && (
              <FormHelperText>
                {benchDate === build.benchDate
                  ? 'The same day as now.'
                  : `${dateShiftWords(build.benchDate, benchDate)} than now (${formatDay(build.benchDate)}).`}
              </FormHelperText>
            )}
          </FormControl>
          <ErrorNote error={preview.error} />
          <BenchDatePreview option={option} currency={data?.currency ?? 'USD'} onPickNext={setBenchDate} />
          <FormControl required>
            <FormLabel>Why it moves (the player reads this)</FormLabel>
            <Textarea minRows={2} value={reason} onChange={(event) => setReason(event.target.value)} />
          </FormControl>
          {reassigned && isOwner && (
            <Checkbox
              checked={reprice}
              onChange={(event) => setReprice(event.target.checked)}
              label={`Re-price the firm quote at ${chosen?.builder.name ?? 'the new builder'}'s rate (the player sees the new price)`}
            />
          )}
          {belowChosen && isOwner && (
            <FormControl required>
              <FormLabel>Why this builder may take it (the player reads this)</FormLabel>
              <Textarea minRows={2} value={overrideReason} onChange={(event) => setOverrideReason(event.target.value)} />
            </FormControl>
          )}
          <FormProblems problems={formErrors} />
          <ErrorNote error={move.error} />
        </DialogContent>
        <DialogButtons
          onConfirm={submit}
          pending={move.isPending}
          disabled={!builderId || (option ? !option.ok : false)}
          cancelLabel="Keep it where it is"
          onCancel={onClose}
        >
          Move the build
        </DialogButtons>
      </ModalDialog>
    </Modal>
  );
}
