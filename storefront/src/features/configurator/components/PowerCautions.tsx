import Alert from '@mui/joy/Alert';
import List from '@mui/joy/List';
import ListItem from '@mui/joy/ListItem';
import Typography from '@mui/joy/Typography';
import { BoltIcon } from './icons';

/**
 * The power cautions every board carries: the supply sits on mains power. We say the usual words
 * and defer to local electrical codes and licensed practice.
 */
export function PowerCautions() {
  return (
    <Alert
      color="warning"
      variant="outlined"
      startDecorator={<BoltIcon />}
      sx={{ alignItems: 'flex-start' }}
      role="note"
      aria-label="Power safety"
    >
      <div>
        <Typography level="title-sm" component="h3">
          Power safety
        </Typography>
        <List size="sm" marker="disc" sx={{ '--ListItem-minHeight': '1.5rem', '--List-padding': '0', pl: 2 }}>
          <ListItem>
            Mains wiring, and any power inlet built into the board or case, only by a qualified person under your local electrical codes. We
            do not open or modify mains-side equipment.
          </ListItem>
          <ListItem>
            Match each pedal’s voltage and polarity to its output. Most pedals take 9 V DC centre-negative; some need 12 V or 18 V, a few
            run on AC. The wrong supply can destroy a pedal.
          </ListItem>
          <ListItem>Keep each output within its current rating, and unplug the supply before moving or re-patching the board.</ListItem>
        </List>
      </div>
    </Alert>
  );
}
