import Alert from '@mui/joy/Alert';
import Box from '@mui/joy/Box';
import Button from '@mui/joy/Button';
import LinearProgress from '@mui/joy/LinearProgress';
import Option from '@mui/joy/Option';
import Select from '@mui/joy/Select';
import Sheet from '@mui/joy/Sheet';
import Stack from '@mui/joy/Stack';
import Table from '@mui/joy/Table';
import Typography from '@mui/joy/Typography';
import type { KeyboardEvent, ReactNode } from 'react';
import { pageSizes, type SortOrder } from 'src/lib/use-list-params';

export interface Column<T> {
  id: string;
  header: string;
  /** The API's sort key for this column; without one the column does not sort. */
  sortKey?: string;
  /** The order a first click sorts in (dates and money read best newest/largest first). */
  firstOrder?: SortOrder;
  align?: 'left' | 'right';
  width?: number | string;
  /** Left out below the lg breakpoint (a tablet at the bench), where the table has no room for it. */
  wideOnly?: boolean;
  render: (row: T) => ReactNode;
}

export interface DataTableProps<T> {
  /** Names the table for screen readers, e.g. "Booking requests". */
  label: string;
  columns: Column<T>[];
  rows: T[] | undefined;
  total: number | undefined;
  page: number;
  pageSize: number;
  sort: string;
  order: SortOrder;
  onSort: (sortKey: string, firstOrder?: SortOrder) => void;
  onPage: (page: number) => void;
  onPageSize: (pageSize: number) => void;
  getRowId: (row: T) => string;
  onOpen?: (row: T) => void;
  selectedId?: string | null;
  isFetching?: boolean;
  error?: Error | null;
  emptyText: string;
}

/** A server-side list query's page of rows, as the table takes them. */
export function queryRows<T>(list: { data?: { items: T[]; total: number }; isFetching: boolean; error: Error | null }) {
  return { rows: list.data?.items, total: list.data?.total, isFetching: list.isFetching, error: list.error };
}

/**
 * The backoffice's one table: the server pages, sorts and filters (hundreds of rows never travel
 * at once); this draws a page of them, the sort headers and the pager. A row opens with a click,
 * Enter or Space, so every row is reachable from the keyboard.
 */

export function DataTable<T>(props: DataTableProps<T>) {
  const { columns, rows, total, page, pageSize, sort, order } = props;
  const pages = total === undefined ? 1 : Math.max(1, Math.ceil(total / pageSize));
  const first = total ? (page - 1) * pageSize + 1 : 0;
  const last = total ? Math.min(total, page * pageSize) : 0;

  const openOnKey = (event: KeyboardEvent, row: T) => {
    if (event.key === 'Enter' || event.key === ' ') {
      event.preventDefault();
      props.onOpen?.(row);
    }
  };

  return (
    <Sheet variant="outlined" sx={{ borderRadius: 'md', overflow: 'hidden', bgcolor: 'background.surface' }}>
      <Box sx={{ height: 4 }}>{props.isFetching && <LinearProgress size="sm" thickness={4} aria-label="Loading rows" />}</Box>
      {props.error && (
        <Alert color="danger" variant="soft" sx={{ m: 1 }}>
          The list could not be loaded: {props.error.message}
        </Alert>
      )}
      <Box sx={{ overflowX: 'auto' }}>
        <Table
          aria-label={props.label}
          size="sm"
          hoverRow={Boolean(props.onOpen)}
          stickyHeader
          sx={{
            '--TableCell-paddingX': '10px',
            '--TableCell-height': '36px',
            '--TableRow-hoverBackground': 'var(--joy-palette-primary-50)',
            // Columns size to their content (widths are hints), so a long name never crushes its neighbour.
            tableLayout: 'auto',
            '& thead th': { bgcolor: 'background.level1', verticalAlign: 'bottom', whiteSpace: 'nowrap', fontSize: 'sm' },
            '& tbody tr[data-selected="true"]': { bgcolor: 'primary.100' },
            '& tbody tr[tabindex]': { cursor: 'pointer' },
            '& tbody tr:focus-visible': { outline: '3px solid', outlineColor: 'primary.500', outlineOffset: '-3px' },
            '& .lw-wide-only': { display: { xs: 'none', lg: 'table-cell' } },
          }}
        >
          <thead>
            <tr>
              {columns.map((column) => {
                const active = column.sortKey !== undefined && column.sortKey === sort;
                return (
                  <th
                    key={column.id}
                    className={column.wideOnly ? 'lw-wide-only' : undefined}
                    style={{ width: column.width, textAlign: column.align ?? 'left' }}
                    aria-sort={active ? (order === 'asc' ? 'ascending' : 'descending') : undefined}
                  >
                    {column.sortKey ? (
                      <Button
                        variant="plain"
                        color="neutral"
                        size="sm"
                        onClick={() => props.onSort(column.sortKey!, column.firstOrder)}
                        sx={{ px: 0.5, minHeight: 0, fontSize: 'sm', fontWeight: active ? 'lg' : 'md', ml: -0.5 }}
                        title={`Sort by ${column.header.toLowerCase()}`}
                      >
                        {column.header}
                        <Box component="span" aria-hidden sx={{ ml: 0.5, width: '1ch', display: 'inline-block' }}>
                          {active ? (order === 'asc' ? '↑' : '↓') : ''}
                        </Box>
                      </Button>
                    ) : (
                      column.header
                    )}
                  </th>
                );
              })}
            </tr>
          </thead>
          <tbody>
            {rows?.map((row) => {
              const id = props.getRowId(row);
              return (
                <tr
                  key={id}
                  data-selected={props.selectedId === id}
                  tabIndex={props.onOpen ? 0 : undefined}
                  onClick={props.onOpen ? () => props.onOpen!(row) : undefined}
                  onKeyDown={props.onOpen ? (event) => openOnKey(event, row) : undefined}
                  aria-selected={props.onOpen ? props.selectedId === id : undefined}
                >
                  {columns.map((column) => (
                    <td
                      key={column.id}
                      className={column.wideOnly ? 'lw-wide-only' : undefined}
                      // Right-aligned cells hold figures (hours, money): a figure never breaks across lines.
                      style={{ textAlign: column.align ?? 'left', whiteSpace: column.align === 'right' ? 'nowrap' : undefined }}
                    >
                      {column.render(row)}
                    </td>
                  ))}
                </tr>
              );
            })}
            {rows && rows.length === 0 && (
              <tr>
                <td colSpan={columns.length}>
                  <Typography level="body-sm" sx={{ py: 3, textAlign: 'center' }}>
                    {props.emptyText}
                  </Typography>
                </td>
              </tr>
            )}
            {!rows && !props.error && (
              <tr>
                <td colSpan={columns.length}>
                  <Typography level="body-sm" sx={{ py: 3, textAlign: 'center' }}>
                    Loading…
                  </Typography>
                </td>
              </tr>
            )}
          </tbody>
        </Table>
      </Box>
      <Stack
        direction="row"
        alignItems="center"
        gap={1.5}
        flexWrap="wrap"
        sx={{ px: 1.5, py: 1, borderTop: '1px solid', borderColor: 'divider', bgcolor: 'background.level1' }}
      >
        <Typography level="body-sm" role="status" sx={{ fontVariantNumeric: 'tabular-nums' }}>
          {total === undefined ? ' ' : total === 0 ? 'No rows' : `Rows ${first}–${last} of ${total}`}
        </Typography>
        <Box sx={{ flex: 1 }} />
        <Stack direction="row" alignItems="center" gap={1}>
          <Typography level="body-sm" component="label" id={`${props.label}-page-size`}>
            Rows per page
          </Typography>
          <Select
            size="sm"
            value={pageSize}
            onChange={(_, value) => value && props.onPageSize(value)}
            slotProps={{ button: { 'aria-labelledby': `${props.label}-page-size` } }}
            sx={{ minWidth: 72 }}
          >
            {pageSizes.map((size) => (
              <Option key={size} value={size}>
                {size}
              </Option>
            ))}
          </Select>
        </Stack>
        <Stack direction="row" alignItems="center" gap={1}>
          <Button size="sm" variant="outlined" color="neutral" disabled={page <= 1} onClick={() => props.onPage(page - 1)}>
            Previous
          </Button>
          <Typography level="body-sm" sx={{ fontVariantNumeric: 'tabular-nums', minWidth: 88, textAlign: 'center' }}>
            Page {Math.min(page, pages)} of {pages}
          </Typography>
          <Button size="sm" variant="outlined" color="neutral" disabled={page >= pages} onClick={() => props.onPage(page + 1)}>
            Next
          </Button>
        </Stack>
      </Stack>
    </Sheet>
  );
}
