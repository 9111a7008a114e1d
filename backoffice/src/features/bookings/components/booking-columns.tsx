import Typography from '@mui/joy/Typography';
import type { BookingSummary } from '@loomwright/shared';
import type { Column } from 'src/components/DataTable';
import { StateChip } from 'src/components/StateChip';
import { formatDay, formatHours, formatMoney, formatMoneyRange } from 'src/lib/format';

/** The columns the Requests and Builds lists both show of a booking, each read the same way in both. */
export const bookingColumns = {
  labor: (width: number): Column<BookingSummary> => ({
    id: 'hours',
    header: 'Labor',
    align: 'right',
    width,
    wideOnly: true,
    render: (b) => formatHours(b.laborHours),
  }),
  /** The firm price once the shop has given one, else the estimate's range. */
  price: (id: string, header: string, width: number): Column<BookingSummary> => ({
    id,
    header,
    align: 'right',
    width,
    render: (b) => (b.firmTotal ? formatMoney(b.firmTotal, b.currency) : formatMoneyRange(b.totalLow, b.totalHigh, b.currency)),
  }),
  /** The rig in a line (its pedal count, surface and routing). */
  rig: {
    id: 'rig',
    header: 'Rig',
    render: (b) => (
      <Typography level="body-sm" sx={{ minWidth: 140 }}>
        {b.summary}
      </Typography>
    ),
  } as Column<BookingSummary>,
  state: {
    id: 'state',
    header: 'State',
    sortKey: 'state',
    width: 120,
    render: (b) => <StateChip state={b.state} />,
  } as Column<BookingSummary>,
  benchDate: (width: number): Column<BookingSummary> => ({
    id: 'bench',
    header: 'Bench date',
    sortKey: 'bench_date',
    width,
    render: (b) => formatDay(b.benchDate),
  }),
};
