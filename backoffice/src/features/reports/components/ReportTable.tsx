import Box from '@mui/joy/Box';
import Table from '@mui/joy/Table';
import type { ReactNode } from 'react';

export interface ReportColumn<Row> {
  header: string;
  /** Figures right-aligned in tabular numerals, so a column of money lines up. */
  figure?: boolean;
  render: (row: Row) => ReactNode;
}

/**
 * A plain table of report figures with an optional total row. On a narrow screen the table keeps a readable width
 * (about 6 rem a column) and scrolls sideways inside its box instead of squeezing names and figures over each other.
 */
export function ReportTable<Row>({
  label,
  columns,
  rows,
  rowKey,
  footer,
  empty,
}: {
  label: string;
  columns: ReportColumn<Row>[];
  rows: Row[];
  rowKey: (row: Row) => string;
  footer?: ReactNode[];
  empty: string;
}) {
  return (
    <Box sx={{ overflowX: 'auto' }}>
      <Table
        aria-label={label}
        size="sm"
        stripe="odd"
        sx={{
          minWidth: `${columns.length * 6}rem`,
          '& td, & th': { fontVariantNumeric: 'tabular-nums' },
          '& .figure': { textAlign: 'right', whiteSpace: 'nowrap' },
        }}
      >
        <thead>
          <tr>
            {columns.map((c) => (
              <th key={c.header} className={c.figure ? 'figure' : undefined} scope="col">
                {c.header}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.length === 0 && (
            <tr>
              <td colSpan={columns.length}>{empty}</td>
            </tr>
          )}
          {rows.map((row) => (
            <tr key={rowKey(row)}>
              {columns.map((c) => (
                <td key={c.header} className={c.figure ? 'figure' : undefined}>
                  {c.render(row)}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
        {footer && rows.length > 0 && (
          <tfoot>
            <tr>
              {footer.map((cell, i) => (
                <th key={i} className={columns[i]?.figure ? 'figure' : undefined} scope={i === 0 ? 'row' : undefined}>
                  {cell}
                </th>
              ))}
            </tr>
          </tfoot>
        )}
      </Table>
    </Box>
  );
}
