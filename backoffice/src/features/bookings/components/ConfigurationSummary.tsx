import Chip from '@mui/joy/Chip';
import Stack from '@mui/joy/Stack';
import Table from '@mui/joy/Table';
import Typography from '@mui/joy/Typography';
import type { BookingDetail } from '@loomwright/shared';

const kindWords: Record<string, string> = {
  mini: 'mini',
  compact: 'compact',
  large: 'large box',
  large_digital: 'large digital',
  tuner: 'tuner',
  treadle: 'treadle',
  buffer: 'buffer',
  switcher: 'loop switcher',
  other: 'other',
};

/** What the player asked for: the rig itself, pedal by pedal, and the functions on top. */
export function ConfigurationSummary({ booking }: { booking: BookingDetail }) {
  const config = booking.configuration;
  const estimate = booking.quote.estimate;
  const pedals = config.pedals ?? [];
  // The notes written for the shop; an estimate saved before they existed has only the player's.
  const shopNotes = estimate.staffNotes ?? estimate.notes;
  return (
    <Stack gap={1}>
      <Typography level="body-sm">{booking.summary}</Typography>
      <Stack direction="row" gap={0.75} flexWrap="wrap">
        <Chip size="sm" variant="outlined">
          {config.routing.mode === 'switcher' ? 'Through a loop switcher' : 'Serial chain'}
        </Chip>
        <Chip size="sm" variant="outlined">
          Level asked: {config.level}
        </Chip>
        <Chip size="sm" variant="outlined">
          Minimum level: {estimate.minimumLevel}
        </Chip>
        {config.functions.map((code) => (
          <Chip key={code} size="sm" variant="soft">
            {code.replace(/[_-]/g, ' ')}
          </Chip>
        ))}
      </Stack>
      {estimate.minimumLevelReasons.length > 0 && (
        <Typography level="body-xs">Why that level: {estimate.minimumLevelReasons.join('; ')}</Typography>
      )}
      {pedals.length > 0 ? (
        <Table size="sm" aria-label="Pedals in this rig" sx={{ '--TableCell-height': '28px' }}>
          <thead>
            <tr>
              <th style={{ width: '40%' }}>Pedal</th>
              <th>Type</th>
              <th>Power</th>
              <th>Loop</th>
            </tr>
          </thead>
          <tbody>
            {pedals.map((pedal, index) => (
              <tr key={`${pedal.name}-${index}`}>
                <td>{pedal.name}</td>
                <td>{pedal.kind ? (kindWords[pedal.kind] ?? pedal.kind) : '—'}</td>
                <td>
                  {pedal.powered
                    ? [
                        pedal.voltage ? `${pedal.voltage} V` : null,
                        pedal.currentMa ? `${pedal.currentMa} mA` : null,
                        pedal.supply === 'ac' ? 'AC' : null,
                      ]
                        .filter(Boolean)
                        .join(' · ') || 'powered'
                    : 'not powered'}
                </td>
                <td>{pedal.inLoop ? 'in a loop' : '—'}</td>
              </tr>
            ))}
          </tbody>
        </Table>
      ) : (
        <Typography level="body-sm">{config.pedalCount ?? 0} plain powered pedals in series (no pedal list given).</Typography>
      )}
      {shopNotes.length > 0 && (
        <Stack component="ul" sx={{ m: 0, pl: 2.5 }}>
          {shopNotes.map((note) => (
            <Typography key={note} component="li" level="body-xs">
              {note}
            </Typography>
          ))}
        </Stack>
      )}
    </Stack>
  );
}
