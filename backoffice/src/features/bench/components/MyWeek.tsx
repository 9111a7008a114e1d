import Card from '@mui/joy/Card';
import Link from '@mui/joy/Link';
import List from '@mui/joy/List';
import ListItem from '@mui/joy/ListItem';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { Link as RouterLink } from 'react-router';
import { shortStateLabels } from 'src/components/StateChip';
import { ErrorNote } from 'src/components/ErrorNote';
import { addDays, formatDay, formatHours, startOfWeek, today } from 'src/lib/format';
import { useBench } from '../api/get-bench';
import { dayInWords } from './HoursBar';

/**
 * A builder's own week, day by day: what is on their bench, how many hours each build takes that
 * day, and the hours they have recorded; their landing page in the backoffice.
 */
export function MyWeek() {
  const from = startOfWeek(today());
  const to = addDays(from, 6);
  const bench = useBench({ from, to });
  const mine = bench.data?.builders.find((b) => b.builder.isMe);
  return (
    <Card variant="outlined" component="section" aria-label="My bench this week">
      <Typography level="title-lg" component="h2">
        My bench this week
      </Typography>
      <ErrorNote error={bench.error} action="Reload the page to try again." />
      {bench.data && !mine && <Typography level="body-sm">You have no bench of your own on the team.</Typography>}
      {mine && (
        <List sx={{ '--ListItem-paddingX': 0 }}>
          {mine.days.map((day) => (
            <ListItem
              key={day.date}
              sx={{ alignItems: 'flex-start', flexDirection: 'column', borderBottom: '1px solid', borderColor: 'divider' }}
            >
              <Stack direction="row" gap={1} flexWrap="wrap" sx={{ width: '100%' }}>
                <Typography level="title-sm" sx={{ minWidth: 96 }}>
                  {formatDay(day.date)}
                  {day.date === today() ? ' · today' : ''}
                </Typography>
                <Typography level="body-sm" sx={{ fontVariantNumeric: 'tabular-nums' }}>
                  {dayInWords(day)}
                  {day.recordedHours > 0 ? ` · ${formatHours(day.recordedHours)} recorded` : ''}
                </Typography>
              </Stack>
              {day.builds.map((build) => (
                <Link key={build.bookingId} component={RouterLink} to={`/builds/${build.bookingId}`} level="body-sm" sx={{ pl: 12 }}>
                  {build.reference} · {build.customerName} · {formatHours(build.hours)} · {shortStateLabels[build.state]}
                </Link>
              ))}
            </ListItem>
          ))}
        </List>
      )}
      <Link component={RouterLink} to="/bench" level="body-sm">
        The whole bench
      </Link>
    </Card>
  );
}
