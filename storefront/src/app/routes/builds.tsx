import Box from '@mui/joy/Box';
import Button from '@mui/joy/Button';
import Card from '@mui/joy/Card';
import Link from '@mui/joy/Link';
import Stack from '@mui/joy/Stack';
import Table from '@mui/joy/Table';
import Typography from '@mui/joy/Typography';
import type { BookingSummary, DepositStatus } from '@loomwright/shared';
import { useState } from 'react';
import { ApiErrorAlert, UnreadMessagesBadge } from '@loomwright/shared/ui';
import { Link as RouterLink, Navigate, useLocation } from 'react-router';
import { PageLoading } from 'src/components/PageLoading';
import { ShopUnavailable } from 'src/components/ShopUnavailable';
import { useMe } from 'src/features/auth/api/get-me';
import { useBookings } from 'src/features/bookings/api/get-bookings';
import { BookingStateChip } from 'src/features/bookings/components/BookingStateChip';
import { useWideScreen } from 'src/lib/use-wide-screen';
import { formatDay, formatRange } from 'src/lib/format';

const PAGE_SIZE = 20;
const depositWords: Record<DepositStatus, string> = {
  unpaid: 'Not paid',
  pending: 'Checkout open',
  processing: 'Bank payment settling',
  paid: 'Paid',
  disputed: 'Disputed with your bank',
  refunded: 'Refunded',
};

export function Component() {
  const me = useMe();
  const location = useLocation();
  const [page, setPage] = useState(1);
  const list = useBookings({ page, pageSize: PAGE_SIZE });
  const wide = useWideScreen();
  if (me.isPending) return <PageLoading />;
  // Not knowing who is here (the shop is down) is not the same as nobody signed in.
  if (me.isError && !me.data) return <ShopUnavailable error={me.error} />;
  if (!me.data) return <Navigate to={`/sign-in?next=${encodeURIComponent(location.pathname)}`} replace />;
  if (list.isPending) return <PageLoading label="Loading your builds…" />;
  if (list.error) return <ApiErrorAlert error={list.error} />;
  const { items, total } = list.data;
  const pages = Math.max(1, Math.ceil(total / PAGE_SIZE));

  return (
    <Stack gap={2} sx={{ maxWidth: 1080, mx: 'auto' }}>
      <Typography level="h1" sx={{ fontSize: 'xl2' }}>
        My builds
      </Typography>
      {items.length === 0 ? (
        <Stack gap={1} alignItems="flex-start">
          <Typography>You have not requested a build yet.</Typography>
          <Button component={RouterLink} to="/configure" color="accent">
            Configure a board
          </Button>
        </Stack>
      ) : wide ? (
        <BuildsTable items={items} />
      ) : (
        <BuildCards items={items} />
      )}
      {pages > 1 && (
        <Stack direction="row" gap={1} alignItems="center">
          <Button variant="outlined" disabled={page <= 1} onClick={() => setPage((p) => p - 1)}>
            Previous
          </Button>
          <Typography>
            Page {page} of {pages}
          </Typography>
          <Button variant="outlined" disabled={page >= pages} onClick={() => setPage((p) => p + 1)}>
            Next
          </Button>
        </Stack>
      )}
    </Stack>
  );
}

const totalOf = (b: BookingSummary) =>
  b.firmTotal ? formatRange(b.firmTotal, b.firmTotal, b.currency) : formatRange(b.totalLow, b.totalHigh, b.currency);

function BuildsTable({ items }: { items: BookingSummary[] }) {
  return (
    <Table aria-label="My builds" sx={{ fontVariantNumeric: 'tabular-nums' }} stickyHeader>
      <thead>
        <tr>
          <th>Build</th>
          <th>Board</th>
          <th>Status</th>
          <th>Deposit</th>
          <th>Bench date</th>
          <th>Total</th>
        </tr>
      </thead>
      <tbody>
        {items.map((b) => (
          <tr key={b.id}>
            <td>
              <Link component={RouterLink} to={`/builds/${b.id}`}>
                {b.reference}
              </Link>
              <UnreadMessagesBadge bookingId={b.id} />
            </td>
            <td>{b.summary}</td>
            <td>
              <BookingStateChip state={b.state} />
            </td>
            <td>{depositWords[b.depositStatus]}</td>
            <td>{formatDay(b.benchDate)}</td>
            <td>{totalOf(b)}</td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}

/** On a phone each build is a card: the same facts, each with its label, nothing past the edge. */
function BuildCards({ items }: { items: BookingSummary[] }) {
  return (
    <Stack component="ul" aria-label="My builds" gap={1.5} sx={{ listStyle: 'none', m: 0, p: 0 }}>
      {items.map((b) => (
        <Card component="li" key={b.id} variant="outlined" sx={{ gap: 1, fontVariantNumeric: 'tabular-nums' }}>
          <Stack direction="row" gap={1} alignItems="center" justifyContent="space-between" flexWrap="wrap">
            <Link component={RouterLink} to={`/builds/${b.id}`} level="title-md" overlay>
              {b.reference}
              <UnreadMessagesBadge bookingId={b.id} />
            </Link>
            <BookingStateChip state={b.state} />
          </Stack>
          <Typography level="body-sm">{b.summary}</Typography>
          <Box
            component="dl"
            sx={{
              m: 0,
              display: 'grid',
              gridTemplateColumns: 'auto minmax(0, 1fr)',
              columnGap: 2,
              rowGap: 0.5,
              '& dd': { m: 0, textAlign: 'right', overflowWrap: 'anywhere' },
            }}
          >
            <Typography component="dt" level="body-sm">
              Deposit
            </Typography>
            <Typography component="dd" level="body-sm">
              {depositWords[b.depositStatus]}
            </Typography>
            <Typography component="dt" level="body-sm">
              Bench date
            </Typography>
            <Typography component="dd" level="body-sm">
              {formatDay(b.benchDate)}
            </Typography>
            <Typography component="dt" level="body-sm">
              Total
            </Typography>
            <Typography component="dd" level="body-sm" sx={{ fontWeight: 'lg' }}>
              {totalOf(b)}
            </Typography>
          </Box>
        </Card>
      ))}
    </Stack>
  );
}
