import Button from '@mui/joy/Button';
import FormControl from '@mui/joy/FormControl';
import FormHelperText from '@mui/joy/FormHelperText';
import FormLabel from '@mui/joy/FormLabel';
import Input from '@mui/joy/Input';
import Stack from '@mui/joy/Stack';
import { dateRangeQuerySchema, describeIssues, type DateRangeQuery } from '@loomwright/shared';
import { useMemo, useState } from 'react';
import { presetRanges, shopToday } from './date-ranges';

export interface DateRangeState {
  from: string;
  to: string;
  setRange: (range: DateRangeQuery) => void;
  setFrom: (from: string) => void;
  setTo: (to: string) => void;
  /** The range when the shared schema takes it, else null. */
  valid: DateRangeQuery | null;
  problems: string[];
  presets: ReturnType<typeof presetRanges>;
}

/** A from … to range of shop days, checked by the same schema the API uses; this month to begin with. */
export function useDateRange(timeZone: string | undefined, initial?: DateRangeQuery): DateRangeState {
  const presets = useMemo(() => presetRanges(shopToday(timeZone)), [timeZone]);
  const [range, setRange] = useState<DateRangeQuery | null>(initial ?? null);
  const current = range ?? presets[0].range;
  const parsed = dateRangeQuerySchema.safeParse(current);
  return {
    from: current.from,
    to: current.to,
    setRange,
    setFrom: (from) => setRange({ ...current, from }),
    setTo: (to) => setRange({ ...current, to }),
    valid: parsed.success ? parsed.data : null,
    problems: parsed.success ? [] : describeIssues(parsed.error),
    presets,
  };
}

export function DateRangeFields({ state }: { state: DateRangeState }) {
  return (
    <Stack gap={1}>
      <Stack direction="row" gap={1} flexWrap="wrap" role="group" aria-label="Quick ranges">
        {state.presets.map((p) => {
          const chosen = p.range.from === state.from && p.range.to === state.to;
          return (
            <Button
              key={p.label}
              size="sm"
              variant={chosen ? 'solid' : 'outlined'}
              color={chosen ? 'primary' : 'neutral'}
              aria-pressed={chosen}
              onClick={() => state.setRange(p.range)}
            >
              {p.label}
            </Button>
          );
        })}
      </Stack>
      <Stack direction="row" gap={1.5} flexWrap="wrap" alignItems="flex-start">
        <FormControl error={state.problems.some((m) => m.startsWith('from'))}>
          <FormLabel>From</FormLabel>
          <Input
            type="date"
            value={state.from}
            onChange={(e) => state.setFrom(e.target.value)}
            slotProps={{ input: { 'aria-label': 'From (first day)' } }}
          />
        </FormControl>
        <FormControl error={state.problems.length > 0}>
          <FormLabel>To</FormLabel>
          <Input
            type="date"
            value={state.to}
            onChange={(e) => state.setTo(e.target.value)}
            slotProps={{ input: { 'aria-label': 'To (last day)' } }}
          />
        </FormControl>
      </Stack>
      {state.problems.map((p) => (
        <FormHelperText key={p} sx={{ color: 'danger.plainColor' }}>
          {p.charAt(0).toUpperCase() + p.slice(1)}.
        </FormHelperText>
      ))}
    </Stack>
  );
}
