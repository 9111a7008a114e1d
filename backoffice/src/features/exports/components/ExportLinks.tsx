import Button from '@mui/joy/Button';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import type { DateRangeQuery, ExportKind } from '@loomwright/shared';
import { exportUrl } from '../api/export-url';

const what: Record<ExportKind, { title: string; hint: string }> = {
  bookings: {
    title: 'Bookings',
    hint: 'One row per request made in the range: state, customer, builder, quote, what was paid and what is due, hours.',
  },
  payments: {
    title: 'Payments',
    hint: 'Every deposit and balance on the day it arrived, every refund (negative) on the day it went back.',
  },
  hours: { title: 'Hours', hint: 'Every hour entry worked in the range, per build and builder.' },
};

/** One download link per export; disabled while the range is not a valid one. */
export function ExportLinks({ kinds, range }: { kinds: ExportKind[]; range: DateRangeQuery | null }) {
  return (
    <>
      {kinds.map((kind) => (
        <Stack key={kind} direction="row" gap={1.5} alignItems="center">
          <Button
            component="a"
            href={range ? exportUrl(kind, range) : undefined}
            download
            disabled={!range}
            size="sm"
            sx={{ minWidth: 150 }}
            aria-label={`Download ${what[kind].title.toLowerCase()} CSV`}
          >
            {what[kind].title} CSV
          </Button>
          <Typography level="body-xs">{what[kind].hint}</Typography>
        </Stack>
      ))}
    </>
  );
}
