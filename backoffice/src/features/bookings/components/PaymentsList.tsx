import Table from '@mui/joy/Table';
import Typography from '@mui/joy/Typography';
import type { PaymentView } from '@loomwright/shared';
import { formatMoney, formatStamp } from 'src/lib/format';

const statusWords: Record<PaymentView['status'], string> = {
  pending: 'Checkout open',
  paid: 'Paid',
  failed: 'Failed',
  expired: 'Checkout expired',
  refunded: 'Refunded',
};

export function PaymentsList({ payments }: { payments: PaymentView[] }) {
  if (payments.length === 0) return <Typography level="body-sm">No payments yet.</Typography>;
  return (
    <Table size="sm" aria-label="Payments" sx={{ '--TableCell-height': '28px', fontVariantNumeric: 'tabular-nums' }}>
      <thead>
        <tr>
          <th>Kind</th>
          <th>Status</th>
          <th style={{ textAlign: 'right' }}>Amount</th>
          <th>When</th>
        </tr>
      </thead>
      <tbody>
        {payments.map((p) => (
          <tr key={p.id}>
            <td>{p.kind === 'deposit' ? 'Deposit' : 'Balance'}</td>
            <td>
              {statusWords[p.status]}
              {p.failureMessage ? ` — ${p.failureMessage}` : ''}
            </td>
            <td style={{ textAlign: 'right' }}>{formatMoney(p.amount, p.currency)}</td>
            <td>{formatStamp(p.refundedAt ?? p.paidAt ?? p.createdAt)}</td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
