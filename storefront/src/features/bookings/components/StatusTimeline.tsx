import List from '@mui/joy/List';
import ListItem from '@mui/joy/ListItem';
import Typography from '@mui/joy/Typography';
import { bookingStateLabels, type BookingEventView } from '@loomwright/shared';
import { formatMoment } from 'src/lib/format';

export function StatusTimeline({ events }: { events: BookingEventView[] }) {
  return (
    <List component="ol" aria-label="Status history" sx={{ '--ListItem-paddingX': 0 }}>
      {events.map((event) => (
        <ListItem key={event.id} sx={{ display: 'block', borderLeft: '3px solid', borderColor: 'primary.300', pl: 2, mb: 1 }}>
          <Typography level="title-sm">{event.fromState === event.toState ? 'Note' : bookingStateLabels[event.toState]}</Typography>
          <Typography level="body-sm">
            {formatMoment(event.at)} · {event.actor}
          </Typography>
          {event.note && <Typography level="body-sm">{event.note}</Typography>}
        </ListItem>
      ))}
    </List>
  );
}
