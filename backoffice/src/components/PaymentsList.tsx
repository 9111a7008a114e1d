import Table from '@mui/joy/Table';
import Typography from '@mui/joy/Typography';
import type { PaymentView } from '@loomwright/shared';
import { formatMoney, formatStamp } from 'src/lib/format';

const statusWords: Record<PaymentView['status'], string> = {
  pending: 'Checkout open',
  processing: 'Bank debit settling',
  paid: 'Paid',
  failed: 'Failed',
  expired: 'Checkout expired',
  refunded: 'Refunded',
};

/** A payment as a booking or a customer lists it; the customer's list also names the booking. */
export type PaymentRow = Pick<PaymentView, 'id' | 'kind' | 'status' | 'amount' | 'currency' | 'paidAt' | 'createdAt'> &
  Partial<Pick<PaymentView, 'failureMessage' | 'refundedAt' | 'refundStatus' | 'refundFailure' | 'dispute'>> & { reference?: string };

const refundWords: Record<NonNullable<PaymentView['refundStatus']>, string> = {
  pending: 'refund pending with the provider',
  requires_action: 'refund waiting for details from the player',
  succeeded: 'refund sent',
  failed: 'refund failed',
  canceled: 'refund cancelled',
};

/** The money's story after payment: refund and dispute, in words. */
function afterPayment(p: PaymentRow): string {
  const parts: string[] = [];
  if (p.refundStatus && !(p.refundStatus === 'succeeded' && p.status === 'refunded')) {
    parts.push(`${refundWords[p.refundStatus]}${p.refundFailure ? ` (${p.refundFailure})` : ''}`);
  }
  if (p.dispute) {
    parts.push(
      `disputed: ${p.dispute.reason.replace(/_/g, ' ')}, ${p.dispute.status.replace(/_/g, ' ')}${p.dispute.releasedAt ? ', delivery released' : ''}`,
    );
  }
  return parts.length ? ` · ${parts.join(' · ')}` : '';
}

export function PaymentsList({ payments, showBooking = false }: { payments: PaymentRow[]; showBooking?: boolean }) {
  if (payments.length === 0) return <Typography level="body-sm">No payments yet.</Typography>;
  return (
    <Table size="sm" aria-label="Payments" sx={{ '--TableCell-height': '28px', fontVariantNumeric: 'tabular-nums' }}>
      <thead>
        <tr>
          {showBooking && <th>Booking</th>}
          <th>Kind</th>
          <th>Status</th>
          <th style={{ textAlign: 'right' }}>Amount</th>
          <th>When</th>
        </tr>
      </thead>
      <tbody>
        {payments.map((p) => (
          <tr key={p.id}>
            {showBooking && <td>{p.reference}</td>}
            <td>{p.kind === 'deposit' ? 'Deposit' : 'Balance'}</td>
            <td>
              {statusWords[p.status]}
              {p.failureMessage ? ` — ${p.failureMessage}` : ''}
              {afterPayment(p)}
            </td>
            <td style={{ textAlign: 'right' }}>{formatMoney(p.amount, p.currency)}</td>
            <td>{formatStamp(p.refundedAt ?? p.paidAt ?? p.createdAt)}</td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
