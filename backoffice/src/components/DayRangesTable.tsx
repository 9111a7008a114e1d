import Table, { type TableProps } from '@mui/joy/Table';
import { formatDay } from 'src/lib/format';
import { RemoveButton } from './RemoveButton';

interface DayRange {
  id: string;
  startsOn: string;
  endsOn: string;
  reason: string;
}

interface Props<T extends DayRange> {
  label: string;
  rows: readonly T[];
  /** A first column naming whose days they are (the builder away), where they are someone's. */
  who?: { heading: string; of: (row: T) => string };
  reasonHeading: string;
  /** Given where the signed-in person may remove a range. */
  onRemove?: (row: T) => void;
  /** The range whose removal is under way, if any. */
  removingId?: string;
  sx?: TableProps['sx'];
}

/** Runs of days off the bench (shop closures, builders away): from, to, why, and a Remove for those who may. */
export function DayRangesTable<T extends DayRange>({ label, rows, who, reasonHeading, onRemove, removingId, sx }: Props<T>) {
  return (
    <Table size="sm" aria-label={label} sx={sx}>
      <thead>
        <tr>
          {who && <th>{who.heading}</th>}
          <th>From</th>
          <th>To</th>
          <th>{reasonHeading}</th>
          {onRemove && <th style={{ width: 90 }} />}
        </tr>
      </thead>
      <tbody>
        {rows.map((row) => (
          <tr key={row.id}>
            {who && <td>{who.of(row)}</td>}
            <td>{formatDay(row.startsOn)}</td>
            <td>{formatDay(row.endsOn)}</td>
            <td>{row.reason}</td>
            {onRemove && (
              <td>
                <RemoveButton loading={removingId === row.id} onClick={() => onRemove(row)} />
              </td>
            )}
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
