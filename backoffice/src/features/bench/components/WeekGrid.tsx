import Box from '@mui/joy/Box';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import type { BenchBuild, BenchView } from '@loomwright/shared';
import { formatDay, formatHours, today } from 'src/lib/format';
import { BuildTag } from './BuildTag';
import { HoursBar } from './HoursBar';

/** Builders down, days across: each cell is one builder's day (bar, words, builds). */
export function WeekGrid({
  view,
  days,
  onMove,
}: {
  view: BenchView;
  days: string[];
  onMove?: (build: BenchBuild, builderId: string) => void;
}) {
  const now = today();
  return (
    <Box sx={{ overflowX: 'auto' }}>
      <Box
        role="table"
        aria-label="Bench time per builder and day"
        sx={{
          display: 'grid',
          gridTemplateColumns: `150px repeat(${days.length}, minmax(112px, 1fr))`,
          minWidth: 150 + days.length * 112,
          border: '1px solid',
          borderColor: 'divider',
          borderRadius: 'md',
          bgcolor: 'background.surface',
          '& > [role=row]': { display: 'contents' },
          '& [role=cell], & [role=columnheader], & [role=rowheader]': {
            p: 1,
            borderBottom: '1px solid',
            borderRight: '1px solid',
            borderColor: 'divider',
            minWidth: 0,
          },
        }}
      >
        <Box role="row">
          <Box role="columnheader" sx={{ bgcolor: 'background.level1' }}>
            <Typography level="title-sm">Builder</Typography>
          </Box>
          {days.map((day) => (
            <Box role="columnheader" key={day} sx={{ bgcolor: day === now ? 'primary.50' : 'background.level1' }}>
              <Typography level="title-sm">{formatDay(day)}</Typography>
              {day === now && <Typography level="body-xs">Today</Typography>}
            </Box>
          ))}
        </Box>
        {view.builders.map(({ builder, days: benchDays }) => {
          const byDate = new Map(benchDays.map((d) => [d.date, d]));
          const booked = benchDays.reduce((sum, d) => sum + d.bookedHours, 0);
          const capacity = benchDays.reduce((sum, d) => sum + (d.off ? 0 : d.capacityHours), 0);
          return (
            <Box role="row" key={builder.id}>
              <Box role="rowheader" sx={{ bgcolor: builder.isMe ? 'primary.50' : undefined }}>
                <Typography level="title-sm">
                  {builder.name}
                  {builder.isMe ? ' (you)' : ''}
                </Typography>
                <Typography level="body-xs">{builder.level}</Typography>
                <Typography level="body-xs" sx={{ fontVariantNumeric: 'tabular-nums' }}>
                  {`${Math.round(booked * 100) / 100} of ${formatHours(capacity)} this view`}
                </Typography>
              </Box>
              {days.map((date) => {
                const day = byDate.get(date);
                return (
                  <Box role="cell" key={date} sx={{ bgcolor: date === now ? 'primary.50' : undefined }}>
                    {day ? (
                      <Stack gap={0.75}>
                        <HoursBar day={day} />
                        {day.builds.map((build) => (
                          <BuildTag key={build.bookingId} build={build} onMove={onMove && ((b) => onMove(b, builder.id))} />
                        ))}
                      </Stack>
                    ) : (
                      <Typography level="body-xs">—</Typography>
                    )}
                  </Box>
                );
              })}
            </Box>
          );
        })}
      </Box>
    </Box>
  );
}
