import Alert from '@mui/joy/Alert';
import Box from '@mui/joy/Box';
import Button from '@mui/joy/Button';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import type { BenchPreviewOption } from '@loomwright/shared';
import { formatDay, formatHours, formatMoney } from 'src/lib/format';

/**
 * What choosing a day means before submitting: the builder's load on each day the build would
 * take (hours already booked, this build's share, capacity), the ship-by day, and, when the day
 * cannot hold it, why in words with the next day that can.
 */
export function BenchDatePreview({
  option,
  currency,
  onPickNext,
}: {
  option: BenchPreviewOption | undefined;
  currency: string;
  onPickNext?: (day: string) => void;
}) {
  if (!option) return null;
  return (
    <Stack gap={1} aria-live="polite">
      {option.ok ? (
        <Typography level="body-sm">
          {option.builder.name} can start then and finish {formatDay(option.expectedCompletion)}. The pedals must arrive by{' '}
          <strong>{formatDay(option.shipBy)}</strong>. Firm total at {option.builder.name}'s rate: {formatMoney(option.firmTotal, currency)}
          {option.aboveQuotedRange ? ' (above the estimate the player was quoted: they will be asked to agree to it)' : ''}.
        </Typography>
      ) : (
        <Alert color="warning" variant="soft" role="status">
          <Stack gap={0.5}>
            <Typography level="body-sm">Not this day: {option.message}</Typography>
            {option.nextPossibleDate && onPickNext && (
              <Box>
                <Button size="sm" variant="outlined" color="neutral" onClick={() => onPickNext(option.nextPossibleDate!)}>
                  Use {formatDay(option.nextPossibleDate)}, the next day that holds it
                </Button>
              </Box>
            )}
          </Stack>
        </Alert>
      )}
      <Box
        component="table"
        sx={{
          borderCollapse: 'collapse',
          fontVariantNumeric: 'tabular-nums',
          '& td, & th': { px: 1, py: 0.25, textAlign: 'left', fontSize: 'sm' },
        }}
      >
        <caption style={{ textAlign: 'left', fontSize: 14 }}>{option.builder.name}'s load on those days</caption>
        <thead>
          <tr>
            <th scope="col">Day</th>
            <th scope="col">Booked</th>
            <th scope="col">This build</th>
            <th scope="col">Capacity</th>
          </tr>
        </thead>
        <tbody>
          {option.load.map((d) => (
            <tr key={d.date}>
              <td>{formatDay(d.date)}</td>
              <td>{formatHours(d.bookedHours)}</td>
              <td>{d.thisBuildHours ? formatHours(d.thisBuildHours) : '—'}</td>
              <td>{d.off ? d.off.label : formatHours(d.capacityHours)}</td>
            </tr>
          ))}
        </tbody>
      </Box>
    </Stack>
  );
}
