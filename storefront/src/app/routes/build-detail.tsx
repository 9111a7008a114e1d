import Alert from '@mui/joy/Alert';
import Card from '@mui/joy/Card';
import Grid from '@mui/joy/Grid';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { Navigate, useLocation, useParams } from 'react-router';
import type { BookingState } from '@loomwright/shared';
import { PageLoading } from 'src/components/PageLoading';
import { ShopUnavailable } from 'src/components/ShopUnavailable';
import { useMe } from 'src/features/auth/api/get-me';
import { useBooking } from 'src/features/bookings/api/get-booking';
import { ApprovalsPanel } from 'src/features/bookings/components/ApprovalsPanel';
import { BookingStateChip } from 'src/features/bookings/components/BookingStateChip';
import { CancelBooking } from 'src/features/bookings/components/CancelBooking';
import { PaymentsList } from 'src/features/bookings/components/PaymentsList';
import { PhotoPanel } from 'src/features/bookings/components/PhotoPanel';
import { PriceConsent } from 'src/features/bookings/components/PriceConsent';
import { QuoteLines } from 'src/features/bookings/components/QuoteLines';
import { ShipmentForm } from 'src/features/bookings/components/ShipmentForm';
import { StatusTimeline } from 'src/features/bookings/components/StatusTimeline';
import { BoardSketch } from 'src/features/configurator/components/BoardSketch';
import { PayButton } from 'src/features/payments/components/PayButton';
import { ApiErrorAlert, ConversationPanel, MoneyFactsTable } from '@loomwright/shared/ui';
import { formatAmount, formatDay, formatMoment } from 'src/lib/format';

const shippable: BookingState[] = ['requested', 'deposit_paid', 'scheduled'];
const cancellable: BookingState[] = ['requested', 'deposit_paid'];

function Section({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <Card variant="outlined" component="section" aria-label={title}>
      <Typography level="title-md" component="h2">
        {title}
      </Typography>
      {children}
    </Card>
  );
}

export function Component() {
  const { id = '' } = useParams();
  const me = useMe();
  const location = useLocation();
  const booking = useBooking(id);
  if (me.isPending) return <PageLoading />;
  // Not knowing who is here (the shop is down) is not the same as nobody signed in.
  if (me.isError && !me.data) return <ShopUnavailable error={me.error} />;
  if (!me.data) return <Navigate to={`/sign-in?next=${encodeURIComponent(location.pathname)}`} replace />;
  if (booking.isPending) return <PageLoading label="Loading the build…" />;
  if (booking.error) return <ApiErrorAlert error={booking.error} />;
  const b = booking.data;
  const isPlayer = me.data.id === b.customer.id;
  // The proposed top view: the board-fit layout the firm quote (or the estimate) was priced with.
  const fit = (b.firmQuote ?? b.quote).estimate.checks?.boardFit;

  return (
    <Stack gap={2} sx={{ maxWidth: 1080, mx: 'auto' }}>
      <Stack direction="row" gap={2} alignItems="center" flexWrap="wrap">
        <Typography level="h1" sx={{ fontSize: 'xl2' }}>
          Build {b.reference}
        </Typography>
        <BookingStateChip state={b.state} />
      </Stack>
      <Typography>{b.summary}</Typography>
      {b.declineReason && <Alert color="warning">The shop declined this build: {b.declineReason}</Alert>}
      {b.cancelReason && b.state === 'cancelled' && <Alert color="neutral">Cancelled: {b.cancelReason}</Alert>}
      {isPlayer && b.priceConsent === 'pending' && <PriceConsent booking={b} />}
      {(b.extras.length > 0 || b.layoutApprovals.length > 0) && (
        <Section title="Your approval">
          <ApprovalsPanel
            booking={b}
            isPlayer={isPlayer}
            topView={
              fit ? (
                <BoardSketch fit={fit} surfaceName={b.configuration.surfaceId} />
              ) : (
                <Typography level="body-sm">The builder sends the top view with their message.</Typography>
              )
            }
          />
        </Section>
      )}

      <Grid container spacing={2}>
        <Grid xs={12} md={7}>
          <Stack gap={2}>
            <Section title={b.firmQuote ? 'Firm quote' : 'Estimate'}>
              <QuoteLines quote={b.firmQuote ?? b.quote} />
            </Section>
            <Section title="Messages with the shop">
              <ConversationPanel bookingId={b.id} otherSide="the shop" />
            </Section>
            <Section title="Photos">
              <PhotoPanel bookingId={b.id} photos={b.photos} />
            </Section>
            {isPlayer && shippable.includes(b.state) && (
              <Section title="Shipping your pedals in">
                {b.state === 'scheduled' || b.inbound ? (
                  <ShipmentForm bookingId={b.id} current={b.inbound} />
                ) : (
                  <Typography level="body-sm">
                    Keep your pedals until the shop sets a bench date. The e-mail with that date says which day to ship by; you can then
                    record the carrier and tracking number here.
                  </Typography>
                )}
              </Section>
            )}
          </Stack>
        </Grid>
        <Grid xs={12} md={5}>
          <Stack gap={2}>
            <Section title="Bench">
              <Typography>
                Bench date: <b>{formatDay(b.benchDate)}</b>
              </Typography>
              <Typography>Expected completion: {formatDay(b.expectedCompletion)}</Typography>
              {b.builder && (
                <Typography>
                  Builder: {b.builder.name} ({b.builder.level})
                </Typography>
              )}
              {b.levelOverrideReason && <Typography level="body-sm">Why this builder: {b.levelOverrideReason}</Typography>}
              {!b.benchDate && b.state === 'requested' && (
                <Typography level="body-sm">
                  {b.depositStatus === 'paid'
                    ? 'Your deposit is in. A builder accepts the build and sets a bench date next; we e-mail you when it is set.'
                    : b.depositStatus === 'processing'
                      ? 'The shop sets a bench date once your bank payment has settled.'
                      : 'The shop sets a bench date once the deposit is paid.'}
                </Typography>
              )}
            </Section>
            <Section title="Payments">
              <Typography sx={{ fontVariantNumeric: 'tabular-nums' }}>Deposit: {formatAmount(b.deposit, b.currency)}</Typography>
              <MoneyFactsTable money={b.money} formatMoney={formatAmount} formatMoment={formatMoment} />
              <Typography level="title-sm" component="h3">
                Checkout attempts
              </Typography>
              <PaymentsList payments={b.payments} />
              {b.depositStatus === 'processing' && (
                <Typography level="body-sm">
                  Your bank payment is settling; that takes a few working days. We e-mail you when it has, and the shop can then set a bench
                  date.
                </Typography>
              )}
              {isPlayer && b.state === 'requested' && b.depositStatus !== 'paid' && b.depositStatus !== 'processing' && (
                <PayButton bookingId={b.id} label="Pay the deposit" />
              )}
              {isPlayer && b.state === 'ready' && !b.money.settled && <PayButton bookingId={b.id} label="Pay the balance" />}
            </Section>
            <Section title="Status history">
              <StatusTimeline events={b.events} />
              {isPlayer && cancellable.includes(b.state) && <CancelBooking bookingId={b.id} depositPaid={b.depositStatus === 'paid'} />}
            </Section>
          </Stack>
        </Grid>
      </Grid>
    </Stack>
  );
}
