import Alert from '@mui/joy/Alert';
import DialogContent from '@mui/joy/DialogContent';
import DialogTitle from '@mui/joy/DialogTitle';
import FormControl from '@mui/joy/FormControl';
import FormHelperText from '@mui/joy/FormHelperText';
import FormLabel from '@mui/joy/FormLabel';
import Input from '@mui/joy/Input';
import Modal from '@mui/joy/Modal';
import ModalDialog from '@mui/joy/ModalDialog';
import Radio from '@mui/joy/Radio';
import RadioGroup from '@mui/joy/RadioGroup';
import Sheet from '@mui/joy/Sheet';
import Stack from '@mui/joy/Stack';
import Textarea from '@mui/joy/Textarea';
import Typography from '@mui/joy/Typography';
import {
  acceptBookingSchema,
  bookingWords,
  dateShiftWords,
  isCalendarDay,
  type BenchSuggestion,
  type BookingSummary,
} from '@loomwright/shared';
import { BenchDatePreview } from 'src/components/BenchDatePreview';
import { useBenchPreview } from 'src/features/bench/api/get-bench-preview';
import { useBenchSuggestion } from 'src/features/bench/api/get-bench-suggestion';
import { useEffect, useMemo, useState } from 'react';
import { ErrorNote } from 'src/components/ErrorNote';
import { PageLoading } from 'src/components/PageLoading';
import { formatDay, formatHours, formatMoney, formatRate } from 'src/lib/format';
import { useAcceptBooking } from '../api/accept-booking';
import { DialogButtons } from 'src/components/DialogButtons';
import { FormProblems } from 'src/components/FormProblems';

/**
 * Accepting a paid request: who builds it and from which day. Each builder's earliest bench date
 * comes from the server's schedule (capacity, closures, holidays); the server checks the chosen
 * date again when the build is accepted, so two people accepting at once can never overbook.
 */
export function AcceptDialog({
  booking,
  isOwner,
  onClose,
  onAccepted,
}: {
  booking: BookingSummary | null;
  isOwner: boolean;
  onClose: () => void;
  onAccepted?: (message: string) => void;
}) {
  const suggestion = useBenchSuggestion(booking?.id ?? null);
  const accept = useAcceptBooking();
  const [builderId, setBuilderId] = useState<string | null>(null);
  const [benchDate, setBenchDate] = useState('');
  const [overrideReason, setOverrideReason] = useState('');
  const [formError, setFormError] = useState<string | null>(null);

  const options = useMemo(() => suggestion.data?.suggestions ?? [], [suggestion.data]);
  const chosen: BenchSuggestion | undefined = useMemo(() => options.find((s) => s.builder.id === builderId), [options, builderId]);
  const resetAccept = accept.reset;

  // Prefill: the earliest start among builders of the level the player chose; never one below it.
  useEffect(() => {
    if (!suggestion.data || builderId) return;
    const first = suggestion.data.suggestions.find((s) => s.meetsChosenLevel);
    if (first) {
      setBuilderId(first.builder.id);
      setBenchDate(first.benchDate);
    }
  }, [suggestion.data, builderId]);

  useEffect(() => {
    if (!booking) {
      setBuilderId(null);
      setBenchDate('');
      setOverrideReason('');
      setFormError(null);
      resetAccept();
    }
  }, [booking, resetAccept]);

  const pick = (id: string) => {
    setBuilderId(id);
    const s = options.find((o) => o.builder.id === id);
    if (s) setBenchDate(s.benchDate);
    setFormError(null);
  };

  const needsOverride = chosen ? !chosen.meetsChosenLevel : false;
  const preview = useBenchPreview(booking?.id ?? null, chosen?.builder.id ?? null, benchDate);
  const previewed = preview.data?.options.find((o) => o.builder.id === chosen?.builder.id);

  const submit = () => {
    if (!booking || !chosen) return setFormError('Choose who builds it.');
    if (!benchDate) return setFormError('Choose a bench date.');
    if (previewed && !previewed.ok) return setFormError(previewed.message ?? 'That day cannot hold the build; pick another.');
    // The API's own rule for the reason (shared schema): any words, up to its length.
    const reason = acceptBookingSchema.shape.levelOverrideReason.safeParse(overrideReason.trim());
    if (needsOverride && (!overrideReason.trim() || !reason.success))
      return setFormError(
        reason.success ? bookingWords.levelOverrideReason : (reason.error.issues[0]?.message ?? bookingWords.levelOverrideReason),
      );
    setFormError(null);
    accept.mutate(
      {
        id: booking.id,
        body: {
          builderId: chosen.builder.id,
          benchDate,
          ...(needsOverride ? { levelOverrideReason: overrideReason.trim() } : {}),
        },
      },
      {
        onSuccess: (result) => {
          onAccepted?.(
            `${booking.reference} is scheduled with ${chosen.builder.name} from ${formatDay(result.benchDate)}, expected done ${formatDay(result.expectedCompletion)}.`,
          );
          onClose();
        },
      },
    );
  };

  const data = suggestion.data;
  return (
    <Modal open={Boolean(booking)} onClose={onClose}>
      <ModalDialog sx={{ width: 'min(640px, 96vw)', overflow: 'auto' }} aria-labelledby="accept-title">
        <DialogTitle id="accept-title" component="h2">
          Accept {booking?.reference} and set the bench date
        </DialogTitle>
        <DialogContent sx={{ gap: 2 }}>
          {suggestion.isPending && <PageLoading label="Reading the bench schedule…" />}
          <ErrorNote error={suggestion.error} action="Close this and try again in a moment." />
          {data && (
            <>
              <Typography level="body-sm">
                {booking?.customer.name} · {formatHours(data.laborHours)} of labor · this rig needs at least a{' '}
                <strong>{data.minimumLevel}</strong> builder.
              </Typography>
              <FormControl>
                <FormLabel id="accept-builder-label">Who builds it</FormLabel>
                <RadioGroup
                  aria-labelledby="accept-builder-label"
                  value={builderId ?? ''}
                  onChange={(event) => pick(event.target.value)}
                  sx={{ gap: 1 }}
                >
                  {options.map((s) => {
                    const blocked = !s.meetsChosenLevel && !isOwner;
                    return (
                      <Sheet
                        key={s.builder.id}
                        variant="outlined"
                        sx={{
                          p: 1.25,
                          borderRadius: 'sm',
                          ...(builderId === s.builder.id ? { borderColor: 'primary.500', bgcolor: 'primary.50' } : {}),
                        }}
                      >
                        <Radio
                          value={s.builder.id}
                          disabled={blocked}
                          overlay
                          label={
                            <Stack>
                              <Typography level="title-sm">
                                {s.builder.name}
                                {s.builder.isMe ? ' (you)' : ''} · {s.builder.level}
                              </Typography>
                              <Typography level="body-xs">
                                {s.meetsChosenLevel
                                  ? `Meets the ${data.chosenLevel} level the player chose.`
                                  : `Below the ${data.chosenLevel} level the player chose${isOwner ? '; you may assign with a reason the player reads.' : '; only the owner can assign this, with a reason.'}`}{' '}
                                Earliest start {formatDay(s.benchDate)}, done {formatDay(s.expectedCompletion)} ·{' '}
                                {s.builder.hourlyRate ? `${formatRate(s.builder.hourlyRate, data.currency)} → ` : ''}firm total{' '}
                                {formatMoney(s.firmTotal, data.currency)}
                                {s.aboveQuotedRange ? ' · above the quoted range: the player must agree to it' : ''}
                              </Typography>
                            </Stack>
                          }
                        />
                      </Sheet>
                    );
                  })}
                </RadioGroup>
                {data.ineligible.length > 0 && (
                  <FormHelperText sx={{ flexDirection: 'column', alignItems: 'flex-start' }}>
                    {data.ineligible.map((i) => (
                      <span key={i.builder.id}>
                        {i.builder.name} ({i.builder.level}): {i.reason}
                      </span>
                    ))}
                  </FormHelperText>
                )}
              </FormControl>
              {chosen && (
                <>
                  <FormControl>
                    <FormLabel>Bench date</FormLabel>
                    <Input type="date" value={benchDate} onChange={(event) => setBenchDate(event.target.value)} />
                    <FormHelperText>
                      {benchDate === chosen.benchDate
                        ? `Suggested: the earliest day ${chosen.builder.name}'s bench holds ${formatHours(data.laborHours)}. Expected completion ${formatDay(chosen.expectedCompletion)}; the player ships by ${formatDay(chosen.shipBy)}.`
                        : isCalendarDay(benchDate)
                          ? `${dateShiftWords(chosen.benchDate, benchDate)} than suggested (${formatDay(chosen.benchDate)}); see below what that day means.`
                          : 'Choose a day.'}
                    </FormHelperText>
                  </FormControl>
                  {benchDate === chosen.benchDate && chosen.plan.length > 0 && (
                    <Typography level="body-xs">
                      Plan: {chosen.plan.map((p) => `${formatDay(p.date)} ${formatHours(p.hours)}`).join(' · ')}
                    </Typography>
                  )}
                  <ErrorNote error={preview.error} />
                  <BenchDatePreview option={previewed} currency={data.currency} onPickNext={setBenchDate} />
                  {needsOverride && (
                    <FormControl required>
                      <FormLabel>Why this builder may take it (owner only; the player reads it beside the price)</FormLabel>
                      <Textarea minRows={2} value={overrideReason} onChange={(event) => setOverrideReason(event.target.value)} />
                    </FormControl>
                  )}
                </>
              )}
              {options.length === 0 && (
                <Alert color="warning" variant="soft">
                  No builder can take this rig right now. Check the team's levels and working hours.
                </Alert>
              )}
            </>
          )}
          <FormProblems problems={formError ? [formError] : []} />
          <ErrorNote error={accept.error} />
        </DialogContent>
        <DialogButtons onConfirm={submit} pending={accept.isPending} disabled={!chosen} onCancel={onClose}>
          Accept and schedule
        </DialogButtons>
      </ModalDialog>
    </Modal>
  );
}
