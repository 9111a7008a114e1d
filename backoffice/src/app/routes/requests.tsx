import Button from '@mui/joy/Button';
import Link from '@mui/joy/Link';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { bookingStates, type BookingState, type BookingSummary, type DepositStatus } from '@loomwright/shared';
import { useState } from 'react';
import { Link as RouterLink } from 'react-router';
import { DataTable, queryRows, type Column } from 'src/components/DataTable';
import { ErrorNote } from 'src/components/ErrorNote';
import { FilterBar } from 'src/components/FilterBar';
import { Notice } from 'src/components/Notice';
import { PageHeader } from 'src/components/PageHeader';
import { ExportCsvButton } from 'src/features/exports/components/ExportCsvButton';
import { PageLoading } from 'src/components/PageLoading';
import { SearchField } from 'src/components/SearchField';
import { SelectFilter } from 'src/components/SelectFilter';
import { SidePanel } from 'src/components/SidePanel';
import { shortStateLabels, StateChip } from 'src/components/StateChip';
import { useBooking } from 'src/features/bookings/api/get-booking';
import { useBookings, type BookingSort } from 'src/features/bookings/api/list-bookings';
import { BookingDetails } from 'src/features/bookings/components/BookingDetails';
import { bookingColumns } from 'src/features/bookings/components/booking-columns';
import { AcceptDialog } from 'src/features/requests/components/AcceptDialog';
import { DeclineDialog } from 'src/features/requests/components/DeclineDialog';
import { useMe } from 'src/features/auth/api/get-me';
import { formatMoney, formatStamp } from 'src/lib/format';
import { pageQuery, useListParams } from 'src/lib/use-list-params';

const depositWords: Record<DepositStatus, string> = {
  unpaid: 'Not paid',
  pending: 'Checkout open',
  processing: 'Bank debit settling',
  paid: 'Paid',
  disputed: 'Disputed',
  refunded: 'Refunded',
};

const columns: Column<BookingSummary>[] = [
  { id: 'reference', header: 'Reference', sortKey: 'reference', width: 96, render: (b) => <strong>{b.reference}</strong> },
  {
    id: 'created',
    header: 'Requested',
    sortKey: 'created_at',
    firstOrder: 'desc',
    width: 128,
    wideOnly: true,
    render: (b) => formatStamp(b.createdAt),
  },
  {
    id: 'customer',
    header: 'Customer',
    width: 200,
    render: (b) => (
      <>
        {b.customer.name}
        {b.customer.email && (
          <Typography level="body-xs" sx={{ display: 'block', minWidth: 150, overflowWrap: 'anywhere' }}>
            {b.customer.email}
          </Typography>
        )}
      </>
    ),
  },
  bookingColumns.rig,
  bookingColumns.labor(64),
  bookingColumns.price('estimate', 'Estimate', 140),
  {
    id: 'deposit',
    header: 'Deposit',
    width: 110,
    render: (b) => (
      <>
        {depositWords[b.depositStatus]}
        <Typography level="body-xs" sx={{ display: 'block' }}>
          {formatMoney(b.deposit, b.currency)}
        </Typography>
      </>
    ),
  },
  bookingColumns.state,
  bookingColumns.benchDate(104),
];

const stateOptions = [
  { value: '', label: 'Every state' },
  ...bookingStates.filter((s) => s !== 'draft').map((s) => ({ value: s, label: shortStateLabels[s as BookingState] })),
];
const depositOptions = [
  { value: '', label: 'Any deposit' },
  ...(['paid', 'processing', 'pending', 'unpaid', 'disputed', 'refunded'] as const).map((d) => ({ value: d, label: depositWords[d] })),
];

export function Component() {
  const me = useMe();
  const isOwner = me.data?.role === 'owner';
  const { params, update, paging, filter } = useListParams({
    sort: 'created_at',
    order: 'desc',
    filters: { state: '', deposit: '', q: '', open: '' },
  });
  const list = useBookings({
    ...pageQuery<BookingSort>(params),
    state: params.filters.state || undefined,
    deposit: (params.filters.deposit || undefined) as DepositStatus | undefined,
    q: params.filters.q || undefined,
  });
  const openId = params.filters.open || null;
  const detail = useBooking(openId);
  const [accepting, setAccepting] = useState<BookingSummary | null>(null);
  const [declining, setDeclining] = useState<BookingSummary | null>(null);
  const [notice, setNotice] = useState<string | null>(null);

  const setOpen = (id: string) =>
    // Opening a row must not reset the page, so it goes around the filter patch.
    update({ filters: { open: id }, page: params.page });

  const booking = detail.data;
  return (
    <>
      <PageHeader
        title="Requests"
        hint="Every booking request, newest first. A paid request waits here until a builder accepts it and sets a bench date, or the shop declines it."
        actions={<ExportCsvButton kinds={['bookings', 'payments']} />}
      />
      <FilterBar label="Filter requests">
        <SearchField
          label="Search"
          placeholder={isOwner ? 'Customer name, e-mail or reference' : 'Customer name or reference'}
          {...filter('q')}
        />
        <SelectFilter label="State" {...filter('state')} options={stateOptions} />
        <SelectFilter label="Deposit" {...filter('deposit')} options={depositOptions} minWidth={150} />
        {(params.filters.q || params.filters.state || params.filters.deposit) && (
          <Button size="sm" variant="plain" color="neutral" onClick={() => update({ filters: { q: '', state: '', deposit: '' } })}>
            Clear filters
          </Button>
        )}
      </FilterBar>
      <DataTable
        label="Booking requests"
        columns={columns}
        {...queryRows(list)}
        {...paging}
        getRowId={(b) => b.id}
        onOpen={(b) => setOpen(b.id)}
        selectedId={openId}
        emptyText="No requests match these filters."
      />
      <SidePanel
        open={Boolean(openId)}
        onClose={() => update({ filters: { open: '' }, page: params.page })}
        title={booking ? `${booking.reference} · ${booking.customer.name}` : 'Request'}
      >
        {detail.isPending && <PageLoading />}
        <ErrorNote error={detail.error} action="Close the panel and pick the request again." />
        {booking && (
          <>
            <Stack direction="row" gap={1} flexWrap="wrap" alignItems="center">
              <StateChip state={booking.state} />
              <Stack sx={{ flex: 1 }} />
              {booking.state === 'deposit_paid' && (
                <Button color="accent" onClick={() => setAccepting(booking)}>
                  Accept…
                </Button>
              )}
              {/* A paid request is declined by the owner alone (it refunds the deposit): a builder is not offered it. */}
              {(booking.state === 'requested' || (booking.state === 'deposit_paid' && isOwner)) && (
                <Button color="danger" variant="outlined" onClick={() => setDeclining(booking)}>
                  Decline…
                </Button>
              )}
              {booking.builder && (
                <Link component={RouterLink} to={`/builds/${booking.id}`}>
                  Open the build page
                </Link>
              )}
            </Stack>
            {booking.state === 'requested' && (
              <Typography level="body-sm">The deposit is not paid yet; the request can be accepted once it is.</Typography>
            )}
            {booking.state === 'deposit_paid' && !isOwner && (
              <Typography level="body-sm">
                If this build cannot be taken on, tell the owner: declining a paid request refunds the deposit, which the owner does.
              </Typography>
            )}
            <BookingDetails booking={booking} show="all" />
          </>
        )}
      </SidePanel>
      <AcceptDialog booking={accepting} isOwner={isOwner} onClose={() => setAccepting(null)} onAccepted={setNotice} />
      <DeclineDialog booking={declining} isOwner={isOwner} onClose={() => setDeclining(null)} onDeclined={setNotice} />
      <Notice message={notice} onClose={() => setNotice(null)} />
    </>
  );
}
