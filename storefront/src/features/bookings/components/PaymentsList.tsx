import Table from '@mui/joy/Table';
import Typography from '@mui/joy/Typography';
import type { PaymentView } from '@loomwright/shared';
import { formatAmount, formatMoment } from 'src/lib/format';

const statusWords: Record<PaymentView['status'], string> = {
  pending: 'Waiting for payment',
  processing: 'Bank payment settling (a few working days)',
  paid: 'Paid',
  failed: 'Not paid',
  expired: 'Checkout closed without payment',
  refunded: 'Refunded',
};

export function PaymentsList({ payments }: { payments: PaymentView[] }) {
  if (payments.length === 0) return <Typography level="body-sm">No payments yet.</Typography>;
  return (
    <Table size="sm" aria-label="Payments" sx={{ fontVariantNumeric: 'tabular-nums' }}>
      <thead>
        <tr>
          <th>What</th>
          <th>Amount</th>
          <th>Status</th>
        </tr>
      </thead>
      <tbody>
        {payments.map((p) => (
          <tr key={p.id}>
            <td>{p.kind === 'deposit' ? 'Deposit' : 'Balance'}</td>
            <td>{formatAmount(p.amount, p.currency)}</td>
            <td>
              {statusWords[p.status]}
              {p.status === 'paid' && p.paidAt ? `, ${formatMoment(p.paidAt)}` : ''}
              {p.status === 'refunded' && p.refundedAt ? `, ${formatMoment(p.refundedAt)}` : ''}
              {p.status === 'paid' && (p.refundStatus === 'pending' || p.refundStatus === 'requires_action') && (
                <Typography level="body-xs">Refund asked for; we e-mail you once the money is on its way.</Typography>
              )}
              {p.status === 'paid' && (p.refundStatus === 'failed' || p.refundStatus === 'canceled') && (
                <Typography level="body-xs" color="warning">
                  The refund did not go through; the shop has been told and will be in touch.
                </Typography>
              )}
              {p.dispute && !['won', 'warning_closed'].includes(p.dispute.status) && (
                <Typography level="body-xs" color="warning">
                  Disputed with your bank; the shop will be in touch about this build.
                </Typography>
              )}
              {p.failureMessage && p.status !== 'paid' && (
                <Typography level="body-xs" color="danger">
                  {p.failureMessage}
                </Typography>
              )}
            </td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
