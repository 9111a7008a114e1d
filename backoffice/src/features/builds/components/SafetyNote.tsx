import Alert from '@mui/joy/Alert';
import Typography from '@mui/joy/Typography';

/** The usual bench cautions; local codes and licensed practice always come first. */
export function SafetyNote() {
  return (
    <Alert variant="outlined" color="warning" sx={{ alignItems: 'flex-start' }}>
      <div>
        <Typography level="title-sm">Bench safety</Typography>
        <Typography level="body-xs">
          The supply carries mains power: any mains wiring or power inlet only by a qualified person under local electrical codes. Match
          each pedal's voltage and polarity before powering up. Solder in a ventilated place (fumes, lead) and wash hands after. A loaded
          road case is a two-person lift. Where local codes or licensed practice say otherwise, they win.
        </Typography>
      </div>
    </Alert>
  );
}
