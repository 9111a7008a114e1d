import Box from '@mui/joy/Box';
import Typography from '@mui/joy/Typography';
import { bookingStateLabels, type BookingEventView } from '@loomwright/shared';
import { formatStamp } from 'src/lib/format';

/** Who did what when, oldest first; lines marked "internal" never reach the player's page or mail. */
export function EventTimeline({ events }: { events: BookingEventView[] }) {
  if (events.length === 0) return <Typography level="body-sm">Nothing recorded yet.</Typography>;
  return (
    <Box component="ol" sx={{ listStyle: 'none', m: 0, p: 0, borderLeft: '2px solid', borderColor: 'neutral.200' }}>
      {events.map((event) => (
        <Box component="li" key={event.id} sx={{ pl: 2, pb: 1.25, position: 'relative' }}>
          <Box
            aria-hidden
            sx={{ position: 'absolute', left: -6, top: 5, width: 10, height: 10, borderRadius: '50%', bgcolor: 'primary.500' }}
          />
          <Typography level="title-sm">
            {event.fromState === event.toState || event.fromState === null
              ? bookingStateLabels[event.toState]
              : `${bookingStateLabels[event.fromState]} → ${bookingStateLabels[event.toState]}`}
          </Typography>
          <Typography level="body-xs">
            {formatStamp(event.at)} · {event.actor}
            {event.visibility === 'internal' ? ' · internal (the player does not see this)' : ''}
          </Typography>
          {event.note && <Typography level="body-sm">{event.note}</Typography>}
        </Box>
      ))}
    </Box>
  );
}
