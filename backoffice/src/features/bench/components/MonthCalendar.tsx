import Box from '@mui/joy/Box';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import type { BenchView } from '@loomwright/shared';
import { formatHours, parseDay, today } from 'src/lib/format';
import { BuildTag } from './BuildTag';
import { HoursBar } from './HoursBar';

const weekdayNames = ['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun'];

/** One calendar per builder (own first): weeks down, Monday to Sunday across. */
export function MonthCalendar({ view, weeks, month }: { view: BenchView; weeks: string[][]; month: string }) {
  const now = today();
  return (
    <Stack gap={3}>
      {view.builders.map(({ builder, days }) => {
        const byDate = new Map(days.map((d) => [d.date, d]));
        const inMonth = days.filter((d) => d.date.startsWith(month));
        const booked = inMonth.reduce((sum, d) => sum + d.bookedHours, 0);
        const capacity = inMonth.reduce((sum, d) => sum + (d.off ? 0 : d.capacityHours), 0);
        return (
          <Box component="section" key={builder.id} aria-label={`${builder.name}'s bench this month`}>
            <Typography level="title-md" component="h2" sx={{ mb: 1 }}>
              {builder.name}
              {builder.isMe ? ' (you)' : ''} · {builder.level}
              <Typography level="body-sm" sx={{ ml: 1, fontVariantNumeric: 'tabular-nums' }}>
                {`${Math.round(booked * 100) / 100} of ${formatHours(capacity)} booked this month`}
              </Typography>
            </Typography>
            <Box
              role="grid"
              sx={{
                display: 'grid',
                gridTemplateColumns: 'repeat(7, minmax(110px, 1fr))',
                border: '1px solid',
                borderColor: 'divider',
                borderRadius: 'md',
                overflow: 'hidden',
                bgcolor: 'background.surface',
                '& > div': { p: 0.75, borderRight: '1px solid', borderBottom: '1px solid', borderColor: 'divider', minWidth: 0 },
              }}
            >
              {weekdayNames.map((name) => (
                <Box key={name} role="columnheader" sx={{ bgcolor: 'background.level1' }}>
                  <Typography level="title-sm">{name}</Typography>
                </Box>
              ))}
              {weeks.flat().map((date) => {
                const day = byDate.get(date);
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
                    {day && (
                      <Stack gap={0.5} sx={{ mt: 0.25 }}>
                        <HoursBar day={day} compact />
                        {day.builds.map((build) => (
                          <BuildTag key={build.bookingId} build={build} />
                        ))}
                      </Stack>
                    )}
                  </Box>
                );
              })}
            </Box>
          </Box>
        );
      })}
    </Stack>
  );
}
