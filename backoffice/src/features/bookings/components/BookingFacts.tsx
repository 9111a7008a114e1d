import Typography from '@mui/joy/Typography';
import { bookingStateLabels, type BookingDetail, type DepositStatus } from '@loomwright/shared';
import { formatDay, formatHours, formatMoney, formatMoneyRange, formatStamp } from 'src/lib/format';
import { Facts } from './Section';

const depositWords: Record<DepositStatus, string> = {
  unpaid: 'Not paid',
  pending: 'Checkout open, not paid yet',
  processing: 'Bank debit settling, not here yet',
  paid: 'Paid',
  disputed: "Disputed by the player's bank",
  refunded: 'Refunded',
};

export function BookingFacts({ booking }: { booking: BookingDetail }) {
  const c = booking.currency;
  const depositPayment = booking.payments.find((p) => p.kind === 'deposit' && (p.status === 'paid' || p.status === 'refunded'));
  return (
    <Facts
      items={[
        ['State', bookingStateLabels[booking.state]],
        [
          'Customer',
          <>
            {booking.customer.name}{' '}
            {booking.customer.email && (
              <Typography component="span" level="body-xs">
                {booking.customer.email}
              </Typography>
            )}
          </>,
        ],
        ['Requested', formatStamp(booking.createdAt)],
        ['Builder', booking.builder ? `${booking.builder.name} (${booking.builder.level})` : 'Not assigned yet'],
        ['Bench date', formatDay(booking.benchDate)],
        ['Expected completion', formatDay(booking.expectedCompletion)],
        ['Labor', formatHours(booking.laborHours)],
        ['Estimate', formatMoneyRange(booking.totalLow, booking.totalHigh, c)],
        ['Firm quote', booking.firmTotal ? formatMoney(booking.firmTotal, c) : 'Set when a builder accepts'],
        [
          'Deposit',
          `${formatMoney(booking.deposit, c)} · ${depositWords[booking.depositStatus]}${depositPayment?.paidAt ? ` ${formatStamp(depositPayment.paidAt)}` : ''}`,
        ],
        ['Approved extras', formatMoney(booking.money.approvedExtras, c)],
        [
          'Balance due',
          booking.money.balanceDue === null
            ? 'Set when a builder accepts'
            : `${formatMoney(booking.money.balanceDue, c)}${booking.money.balanceWaived ? ' (waived)' : ''}`,
        ],
        ...(booking.deliveryHold ? ([['Delivery on hold', booking.deliveryHold]] as Array<[string, string]>) : []),
        ...(booking.inbound
          ? ([['Parcel in', `${booking.inbound.carrier} · ${booking.inbound.tracking}`]] as Array<[string, string]>)
          : []),
        ...(booking.declineReason ? ([['Declined because', booking.declineReason]] as Array<[string, string]>) : []),
        ...(booking.cancelReason ? ([['Cancelled because', booking.cancelReason]] as Array<[string, string]>) : []),
      ]}
    />
  );
}
