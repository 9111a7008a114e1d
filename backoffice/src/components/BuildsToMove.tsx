import Button from '@mui/joy/Button';
import List from '@mui/joy/List';
import ListItem from '@mui/joy/ListItem';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BenchPreview, BookingDetail, RescheduleResponse } from '@loomwright/shared';
import { useState } from 'react';
import { ErrorNote } from 'src/components/ErrorNote';
import { api } from 'src/lib/api-client';
import { formatDay } from 'src/lib/format';
import { benchKeys } from 'src/features/bench/api/query-keys';
import { bookingKeys } from 'src/features/bookings/api/query-keys';

export interface HitBuild {
  bookingId: string;
  reference: string;
  days: string[];
}

/**
 * Moves one build to the first day on or after its bench date that holds it with its own
 * builder, through the same reschedule route as the Move dialog (the player is e-mailed).
 */
async function moveToNextDate(bookingId: string, reason: string): Promise<RescheduleResponse> {
  const booking = await api.get<BookingDetail>(`/bookings/${encodeURIComponent(bookingId)}`);
  if (!booking.builder || !booking.benchDate) throw new Error(`${booking.reference} has no builder or bench date to move from.`);
  const preview = await api.get<BenchPreview>('/bench/preview', {
    query: { bookingId, benchDate: booking.benchDate, builderId: booking.builder.id },
  });
  const next = preview.options[0]?.nextPossibleDate;
  if (!next) throw new Error(`No later day holds ${booking.reference} with ${booking.builder.name}; move it by hand from the Bench.`);
  return api.post<RescheduleResponse>(`/bookings/${encodeURIComponent(bookingId)}/reschedule`, {
    builderId: booking.builder.id,
    benchDate: next,
    reason,
  });
}

/** The builds a closure or an absence hits, each with a one-click move (and one for all). */
export function BuildsToMove({ builds, reason, onDone }: { builds: HitBuild[]; reason: string; onDone: (message: string) => void }) {
  const queryClient = useQueryClient();
  const [moved, setMoved] = useState<Record<string, string>>({});
  const move = useMutation({
    mutationFn: async (ids: string[]) => {
      const results: Array<{ id: string; result: RescheduleResponse }> = [];
      // One after another: each move sees the bench the previous one left.
      for (const id of ids) results.push({ id, result: await moveToNextDate(id, reason) });
      return results;
    },
    onSuccess: (results) => {
      setMoved((m) => ({ ...m, ...Object.fromEntries(results.map((r) => [r.id, r.result.benchDate])) }));
      onDone(`Moved ${results.length === 1 ? 'the build' : `${results.length} builds`}; each player has been e-mailed the new date.`);
    },
    onSettled: () => Promise.all([benchKeys.all, bookingKeys.all].map((queryKey) => queryClient.invalidateQueries({ queryKey }))),
  });
  const waiting = builds.filter((b) => !moved[b.bookingId]);
  if (builds.length === 0) return null;
  return (
    <Stack gap={1} role="region" aria-label="Builds on the bench those days">
      <Typography level="title-sm">Already on the bench those days</Typography>
      <List size="sm">
        {builds.map((b) => (
          <ListItem
            key={b.bookingId}
            endAction={
              moved[b.bookingId] ? undefined : (
                <Button
                  size="sm"
                  variant="outlined"
                  color="neutral"
                  loading={move.isPending && move.variables?.includes(b.bookingId)}
                  onClick={() => move.mutate([b.bookingId])}
                >
                  Move to the next date that holds it
                </Button>
              )
            }
          >
            <Typography level="body-sm">
              {b.reference}: {b.days.map(formatDay).join(', ')}
              {moved[b.bookingId] ? ` → moved to ${formatDay(moved[b.bookingId])}` : ''}
            </Typography>
          </ListItem>
        ))}
      </List>
      {waiting.length > 1 && (
        <Button
          size="sm"
          color="accent"
          sx={{ alignSelf: 'flex-start' }}
          loading={move.isPending}
          onClick={() => move.mutate(waiting.map((b) => b.bookingId))}
        >
          Move all {waiting.length} to the next dates that hold them
        </Button>
      )}
      <ErrorNote error={move.error} action="Move the rest from the Bench." />
    </Stack>
  );
}
