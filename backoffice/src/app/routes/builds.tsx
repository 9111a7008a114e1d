import Chip from '@mui/joy/Chip';
import Tab from '@mui/joy/Tab';
import TabList from '@mui/joy/TabList';
import Tabs from '@mui/joy/Tabs';
import Typography from '@mui/joy/Typography';
import { benchStates, type BenchState, type BookingSummary } from '@loomwright/shared';
import { useQueries } from '@tanstack/react-query';
import { useNavigate } from 'react-router';
import { UnreadMessagesBadge } from '@loomwright/shared/ui';
import { DataTable, queryRows, type Column } from 'src/components/DataTable';
import { FilterBar } from 'src/components/FilterBar';
import { PageHeader } from 'src/components/PageHeader';
import { ExportCsvButton } from 'src/features/exports/components/ExportCsvButton';
import { SearchField } from 'src/components/SearchField';
import { shortStateLabels } from 'src/components/StateChip';
import { bookingsQueryOptions, useBookings, type BookingSort } from 'src/features/bookings/api/list-bookings';
import { bookingColumns } from 'src/features/bookings/components/booking-columns';
import { formatDay } from 'src/lib/format';
import { pageQuery, useListParams } from 'src/lib/use-list-params';

const columns: Column<BookingSummary>[] = [
  {
    id: 'reference',
    header: 'Reference',
    sortKey: 'reference',
    width: 100,
    render: (b) => (
      <>
        <strong>{b.reference}</strong>
        <UnreadMessagesBadge bookingId={b.id} />
      </>
    ),
  },
  { id: 'customer', header: 'Customer', width: 160, render: (b) => b.customer.name },
  {
    id: 'builder',
    header: 'Builder',
    width: 160,
    render: (b) =>
      b.builder ? (
        <>
          {b.builder.name}
          <Typography level="body-xs" sx={{ display: 'block' }}>
            {b.builder.level}
          </Typography>
        </>
      ) : (
        '—'
      ),
  },
  bookingColumns.rig,
  bookingColumns.benchDate(110),
  { id: 'done', header: 'Expected done', width: 120, render: (b) => formatDay(b.expectedCompletion) },
  bookingColumns.labor(70),
  bookingColumns.price('total', 'Total', 110),
  bookingColumns.state,
  {
    id: 'updated',
    header: 'Last change',
    sortKey: 'updated_at',
    firstOrder: 'desc',
    width: 110,
    wideOnly: true,
    render: (b) => formatDay(b.updatedAt.slice(0, 10)),
  },
];

export function Component() {
  const navigate = useNavigate();
  const { params, update, paging, filter } = useListParams({
    sort: 'bench_date',
    order: 'asc',
    filters: { state: 'scheduled', q: '' },
  });
  const state = (benchStates as readonly string[]).includes(params.filters.state) ? (params.filters.state as BenchState) : 'scheduled';
  const list = useBookings({
    ...pageQuery<BookingSort>(params),
    state,
    q: params.filters.q || undefined,
  });
  // One count per state for the tabs: a one-row page of each answers "how many" from the server.
  const counts = useQueries({
    queries: benchStates.map((s) => bookingsQueryOptions({ page: 1, pageSize: 1, sort: 'created_at', order: 'desc', state: s })),
  });

  return (
    <>
      <PageHeader
        title="Builds"
        hint="Every accepted build by where it stands. Open one to move it on, record intake and hours, and read its history."
        actions={<ExportCsvButton kinds={['bookings', 'hours']} />}
      />
      <Tabs
        value={state}
        onChange={(_, value) => value && update({ filters: { state: String(value) } })}
        sx={{ bgcolor: 'transparent', mb: 1.5 }}
      >
        {/* On a phone the six states do not fit across: the list scrolls sideways instead of squeezing the labels. */}
        <TabList sx={{ overflowX: 'auto', scrollSnapType: 'x mandatory' }}>
          {benchStates.map((s, index) => (
            <Tab key={s} value={s} indicatorInset sx={{ flex: 'none', whiteSpace: 'nowrap', scrollSnapAlign: 'start' }}>
              {shortStateLabels[s]}
              <Chip size="sm" variant="soft" sx={{ ml: 1 }}>
                {counts[index].data?.total ?? '…'}
              </Chip>
            </Tab>
          ))}
        </TabList>
      </Tabs>
      <FilterBar label="Filter builds">
        <SearchField label="Search" placeholder="Customer name, e-mail or reference" {...filter('q')} />
      </FilterBar>
      <DataTable
        label={`Builds: ${shortStateLabels[state]}`}
        columns={columns}
        {...queryRows(list)}
        {...paging}
        getRowId={(b) => b.id}
        onOpen={(b) => navigate(`/builds/${b.id}`)}
        emptyText={`No builds are ${shortStateLabels[state].toLowerCase()} right now.`}
      />
    </>
  );
}
