import Card from '@mui/joy/Card';
import Grid from '@mui/joy/Grid';
import Link from '@mui/joy/Link';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { Link as RouterLink } from 'react-router';
import { useMe } from 'src/features/auth/api/get-me';
import { MyWeek } from 'src/features/bench/components/MyWeek';
import { useBookings, type BookingListQuery } from 'src/features/bookings/api/list-bookings';
import { useHealth } from 'src/features/shop/api/get-health';
import { useShop } from 'src/features/shop/api/get-shop';

const base: BookingListQuery = { page: 1, pageSize: 1, sort: 'created_at', order: 'desc' };

/** What needs the shop's attention today, each a count with the page that acts on it. */
const queues: Array<{ title: string; hint: string; query: BookingListQuery; to: string }> = [
  {
    title: 'Paid, waiting for a bench date',
    hint: 'Accept each with a builder and a date, or decline it.',
    query: { ...base, state: 'deposit_paid' },
    to: '/requests?state=deposit_paid',
  },
  {
    title: 'Requested, deposit not paid',
    hint: 'The player has not paid yet; nothing to do until they do.',
    query: { ...base, state: 'requested' },
    to: '/requests?state=requested',
  },
  {
    title: 'Scheduled, pedals on their way',
    hint: 'Check each parcel in and record every pedal as working or faulty.',
    query: { ...base, state: 'scheduled' },
    to: '/builds?state=scheduled',
  },
  {
    title: 'On the bench',
    hint: 'Record hours as they are spent; test every path and preset before it is ready.',
    query: { ...base, state: 'on_bench' },
    to: '/builds?state=on_bench',
  },
  {
    title: 'Ready, balance due',
    hint: 'The board ships or is collected once the balance is paid.',
    query: { ...base, state: 'ready' },
    to: '/builds?state=ready',
  },
];

function QueueCard({ title, hint, query, to }: (typeof queues)[number]) {
  const list = useBookings(query);
  return (
    <Card variant="outlined" sx={{ height: '100%' }}>
      <Typography level="body-sm">{title}</Typography>
      <Typography level="h2" component="p" sx={{ fontVariantNumeric: 'tabular-nums' }}>
        {list.isError ? '—' : (list.data?.total ?? '…')}
      </Typography>
      <Typography level="body-sm">{list.isError ? list.error.message : hint}</Typography>
      <Link component={RouterLink} to={to} level="body-sm" overlay>
        Open the list
      </Link>
    </Card>
  );
}

export function Component() {
  const shop = useShop();
  const health = useHealth();
  const me = useMe();
  return (
    <Stack gap={2} sx={{ maxWidth: 1080 }}>
      <Typography level="h2" component="h1">
        {shop.data?.name ?? 'The shop'}
      </Typography>
      {/* A builder lands on their own week first; the owner on the shop's queues. */}
      {me.data?.role === 'builder' && <MyWeek />}
      <Grid container spacing={2}>
        {queues.map((queue) => (
          <Grid key={queue.title} xs={12} sm={6} md={4}>
            <QueueCard {...queue} />
          </Grid>
        ))}
      </Grid>
      <Card variant="soft">
        <Typography level="title-md">At the bench</Typography>
        <Typography level="body-sm">
          Mains wiring and any power inlet only by qualified people under local electrical codes; match every pedal’s voltage and polarity;
          a loaded road case is a two-person lift; solder in a ventilated place and wash hands after.
        </Typography>
        <Typography level="body-sm">
          {health.data?.db === 'up'
            ? 'The API and the database are answering.'
            : health.isError
              ? 'The database is not answering; bookings cannot be changed until it is back.'
              : 'Checking…'}
        </Typography>
      </Card>
    </Stack>
  );
}
