import Box from '@mui/joy/Box';
import Typography from '@mui/joy/Typography';
import type { BenchDay } from '@loomwright/shared';
import { formatHours } from 'src/lib/format';

const offWords = { holiday: 'Holiday', closure: 'Shop closed', day_off: 'Day off', absence: 'Away' } as const;

/** One builder's day in words, then as a bar: "5 of 7 h", "Full, 7 of 7 h", "Holiday: …". */
export function dayInWords(day: BenchDay): string {
  if (day.off) {
    if (day.off.kind === 'day_off') return offWords.day_off;
    // A builder's absence already reads "Away: ill".
    return day.off.kind === 'absence' ? day.off.label : `${offWords[day.off.kind]}: ${day.off.label}`;
  }
  if (day.capacityHours <= 0) return offWords.day_off;
  const numbers = `${trim(day.bookedHours)} of ${formatHours(day.capacityHours)}`;
  if (day.freeHours <= 0) return `Full, ${numbers}`;
  return numbers;
}

const trim = (n: number) => String(Math.round(n * 100) / 100);

/**
 * Booked hours against capacity as a plain bar (our own drawing). The words beside it carry the
 * numbers; the bar only lets a row of days be read at a glance.
 */
export function HoursBar({ day, compact = false }: { day: BenchDay; compact?: boolean }) {
  const off = Boolean(day.off) || day.capacityHours <= 0;
  const share = off ? 0 : Math.min(1, day.bookedHours / day.capacityHours);
  const full = !off && day.freeHours <= 0;
  return (
    <Box>
      <Box
        aria-hidden
        sx={{
          height: compact ? 6 : 10,
          borderRadius: 'xs',
          bgcolor: off ? 'transparent' : 'neutral.100',
          border: '1px solid',
          borderColor: off ? 'neutral.300' : 'neutral.300',
          backgroundImage: off ? 'repeating-linear-gradient(135deg, var(--joy-palette-neutral-200) 0 4px, transparent 4px 8px)' : undefined,
          overflow: 'hidden',
        }}
      >
        {!off && <Box sx={{ width: `${share * 100}%`, height: '100%', bgcolor: full ? 'accent.500' : 'primary.500' }} />}
      </Box>
      <Typography
        level="body-xs"
        sx={{
          mt: 0.25,
          fontVariantNumeric: 'tabular-nums',
          color: off ? 'text.tertiary' : 'text.secondary',
          fontWeight: full ? 'lg' : undefined,
        }}
      >
        {dayInWords(day)}
      </Typography>
    </Box>
  );
}
