import Divider from '@mui/joy/Divider';
import Link from '@mui/joy/Link';
import Stack from '@mui/joy/Stack';
import Table from '@mui/joy/Table';
import Typography from '@mui/joy/Typography';
import type { CustomerDetail } from '@loomwright/shared';
import type { ReactNode } from 'react';
import { Link as RouterLink } from 'react-router';
import { StateChip } from 'src/components/StateChip';
import { PaymentsList } from 'src/components/PaymentsList';
import { formatDay, formatStamp } from 'src/lib/format';

const mailWords: Record<string, string> = { queued: 'Queued', sending: 'Sending', sent: 'Sent', failed: 'Not delivered' };

function Block({ title, children }: { title: string; children: ReactNode }) {
  return (
    <Stack gap={1} component="section">
      <Typography level="title-md" component="h3">
        {title}
      </Typography>
      {children}
    </Stack>
  );
}

export function CustomerDetails({ customer }: { customer: CustomerDetail }) {
  const small = { '--TableCell-height': '28px', fontVariantNumeric: 'tabular-nums' } as const;
  return (
    <Stack gap={2} divider={<Divider />}>
      <Typography level="body-sm">
        {customer.email ?? 'E-mail and phone are shown to the builder of their build and the owner'}
        {customer.phone ? ` · ${customer.phone}` : ''} · customer since {formatDay(customer.createdAt.slice(0, 10))}
      </Typography>
      <Block title={`Builds (${customer.builds.length})`}>
        {customer.builds.length === 0 ? (
          <Typography level="body-sm">No builds yet.</Typography>
        ) : (
          <Table size="sm" aria-label="Builds" sx={small}>
            <thead>
              <tr>
                <th>Reference</th>
                <th>State</th>
                <th>Bench date</th>
                <th>Requested</th>
              </tr>
            </thead>
            <tbody>
              {customer.builds.map((b) => (
                <tr key={b.id}>
                  <td>
                    <Link component={RouterLink} to={`/builds/${b.id}`}>
                      {b.reference}
                    </Link>
                  </td>
                  <td>
                    <StateChip state={b.state} />
                  </td>
                  <td>{formatDay(b.benchDate)}</td>
                  <td>{formatDay(b.createdAt.slice(0, 10))}</td>
                </tr>
              ))}
            </tbody>
          </Table>
        )}
      </Block>
      <Block title="Payments">
        <PaymentsList payments={customer.payments} showBooking />
      </Block>
      <Block title="Messages sent">
        {customer.messages.length === 0 ? (
          <Typography level="body-sm">No messages yet.</Typography>
        ) : (
          <Table size="sm" aria-label="Messages sent" sx={small}>
            <thead>
              <tr>
                <th style={{ width: '50%' }}>Subject</th>
                <th>Status</th>
                <th>When</th>
              </tr>
            </thead>
            <tbody>
              {customer.messages.map((m) => (
                <tr key={m.id}>
                  <td>
                    {m.subject ?? m.template}
                    <Typography level="body-xs" sx={{ display: 'block' }}>
                      {m.toAddress ? `to ${m.toAddress}` : ''}
                    </Typography>
                  </td>
                  <td>{mailWords[m.state] ?? m.state}</td>
                  <td>{formatStamp(m.sentAt ?? m.createdAt)}</td>
                </tr>
              ))}
            </tbody>
          </Table>
        )}
      </Block>
    </Stack>
  );
}
