import Box from '@mui/joy/Box';
import Link from '@mui/joy/Link';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import type { BenchView } from '@loomwright/shared';
import { Link as RouterLink } from 'react-router';
import { formatHours, formatQuantity, parseDay, today } from 'src/lib/format';
import { dayInWords } from './HoursBar';

const weekdayNames = ['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun'];

/** "Teodor Lind" → "Teodor": a month cell has room for a first name, the full name is in its label. */
const firstName = (name: string) => name.split(' ')[0] ?? name;

/**
 * Every builder on one month grid: weeks down, Monday to Sunday across, and in each day one line
 * per builder (booked of capacity, or why they are off) with the builds they hold that day.
 * Columns share the width evenly, so a tablet shows Sunday too.
 */
export function MonthCalendar({ view, weeks, month }: { view: BenchView; weeks: string[][]; month: string }) {
  const now = today();
  const byBuilder = view.builders.map(({ builder, days }) => ({ builder, byDate: new Map(days.map((d) => [d.date, d])) }));
  return (
    <Stack gap={1}>
      <Stack direction="row" gap={2} flexWrap="wrap" component="ul" sx={{ listStyle: 'none', p: 0, m: 0 }} aria-label="Booked this month">
        {view.builders.map(({ builder, days }) => {
          const inMonth = days.filter((d) => d.date.startsWith(month));
          const booked = inMonth.reduce((sum, d) => sum + d.bookedHours, 0);
          const capacity = inMonth.reduce((sum, d) => sum + (d.off ? 0 : d.capacityHours), 0);
          return (
            <Typography component="li" key={builder.id} level="body-sm" sx={{ fontVariantNumeric: 'tabular-nums' }}>
              <strong>
                {builder.name}
                {builder.isMe ? ' (you)' : ''}
              </strong>{' '}
              · {builder.level} · {`${Math.round(booked * 100) / 100} of ${formatHours(capacity)} booked`}
            </Typography>
          );
        })}
      </Stack>
      <Box
        role="grid"
        aria-label="Bench this month, every builder"
        sx={{
          display: 'grid',
          gridTemplateColumns: 'repeat(7, minmax(0, 1fr))',
          border: '1px solid',
          borderColor: 'divider',
          borderRadius: 'md',
          overflow: 'hidden',
          bgcolor: 'background.surface',
          '& > div': { p: 0.5, borderRight: '1px solid', borderBottom: '1px solid', borderColor: 'divider', minWidth: 0 },
        }}
      >
        {weekdayNames.map((name) => (
          <Box key={name} role="columnheader" sx={{ bgcolor: 'background.level1' }}>
            <Typography level="title-sm">{name}</Typography>
          </Box>
        ))}
        {weeks.flat().map((date) => {
          const outside = !date.startsWith(month);
          return (
            <Box
              key={date}
              role="gridcell"
              sx={{ minHeight: 84, opacity: outside ? 0.55 : 1, bgcolor: date === now ? 'primary.50' : undefined }}
            >
              <Typography level="body-xs" sx={{ fontWeight: 'lg', color: 'text.primary' }}>
                {parseDay(date).getUTCDate()}
                {date === now ? ' · today' : ''}
              </Typography>
              <Stack gap={0.25} sx={{ mt: 0.25 }}>
                {byBuilder.map(({ builder, byDate }) => {
                  const day = byDate.get(date);
                  if (!day) return null;
                  const words = dayInWords(day);
                  return (
                    <Box key={builder.id} aria-label={`${builder.name}: ${words}`} sx={{ minWidth: 0 }}>
                      <Typography
                        level="body-xs"
                        noWrap
                        sx={{ fontVariantNumeric: 'tabular-nums', color: day.off ? 'text.tertiary' : 'text.secondary' }}
                      >
                        {firstName(builder.name)}:{' '}
                        {day.off ? day.off.label : `${formatQuantity(day.bookedHours)}/${formatHours(day.capacityHours)}`}
                      </Typography>
                      {day.builds.map((build) => (
                        <Link
                          key={build.bookingId}
                          component={RouterLink}
                          to={`/builds/${build.bookingId}`}
                          level="body-xs"
                          sx={{ display: 'block', pl: 1, overflow: 'hidden', textOverflow: 'ellipsis', whiteSpace: 'nowrap' }}
                          aria-label={`${build.reference} · ${build.customerName}, ${formatHours(build.hours)} with ${builder.name}`}
                        >
                          {build.reference}
                        </Link>
                      ))}
                    </Box>
                  );
                })}
              </Stack>
            </Box>
          );
        })}
      </Box>
    </Stack>
  );
}
