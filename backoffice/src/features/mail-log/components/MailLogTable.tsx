import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import Chip from '@mui/joy/Chip';
import DialogContent from '@mui/joy/DialogContent';
import DialogTitle from '@mui/joy/DialogTitle';
import FormControl from '@mui/joy/FormControl';
import FormLabel from '@mui/joy/FormLabel';
import Input from '@mui/joy/Input';
import Modal from '@mui/joy/Modal';
import ModalDialog from '@mui/joy/ModalDialog';
import Option from '@mui/joy/Option';
import Select from '@mui/joy/Select';
import Sheet from '@mui/joy/Sheet';
import Stack from '@mui/joy/Stack';
import Table from '@mui/joy/Table';
import Typography from '@mui/joy/Typography';
import { useState } from 'react';
import { mailStateLabels, mailStates, singleUseLinkKeys, type MailLogEntry, type MailState } from '@loomwright/shared';
import { useMailLog } from 'src/features/mail-log/api/get-mail-log';
import { useResendMail } from 'src/features/mail-log/api/resend-mail';
import { formatStamp } from 'src/lib/format';
import { DialogButtons } from 'src/components/DialogButtons';

const pageSize = 25;

const stateColor: Record<MailState, 'neutral' | 'primary' | 'success' | 'warning' | 'danger'> = {
  queued: 'neutral',
  sending: 'primary',
  sent: 'success',
  failed: 'danger',
  unknown: 'warning',
};

/** Template names in the words the shop uses. */
const templateWords: Record<string, string> = {
  welcome: 'Welcome',
  'password-reset': 'Password reset',
  'password-changed': 'Password changed',
  'staff-invite': 'Staff invitation',
  'booking-requested': 'Request received',
  'deposit-received': 'Deposit received',
  'booking-scheduled': 'Bench date set',
  'status-changed': 'Status update',
  'balance-requested': 'Balance due',
  'deposit-refunded': 'Deposit refunded',
  'booking-declined': 'Request declined',
  'shop-new-paid-request': 'New paid request (to the shop)',
  'ship-by-reminder': 'Reminder: pedals due soon',
  'shop-ship-by-reminder': 'Reminder: no tracking yet (to the shop)',
  'balance-reminder': 'Reminder: balance still due',
  'checkout-reminder': 'Reminder: checkout not finished',
  'request-expired': 'Request expired',
};

function ResendButton({ entry }: { entry: MailLogEntry }) {
  const resend = useResendMail();
  const [confirming, setConfirming] = useState(false);
  const waiting = entry.state === 'queued' || entry.state === 'sending';
  const freshLink = entry.template in singleUseLinkKeys;
  const name = entry.subject ?? templateWords[entry.template] ?? entry.template;
  const send = (confirmPossibleDuplicate?: true) =>
    resend.mutate({ id: entry.id, confirmPossibleDuplicate }, { onSuccess: () => setConfirming(false) });
  return (
    <Stack gap={0.5} alignItems="flex-start">
      <Button
        size="sm"
        variant="outlined"
        color="accent"
        disabled={waiting || resend.isPending}
        loading={resend.isPending && !confirming}
        // A message of unknown outcome may already be in the mailbox: ask before a second copy.
        onClick={() => (entry.state === 'unknown' ? setConfirming(true) : send())}
        aria-label={`Resend “${name}” to ${entry.to}`}
      >
        Resend
      </Button>
      {resend.isSuccess && (
        <Typography level="body-xs">
          {freshLink ? 'Queued again with a fresh link; the earlier link no longer works.' : 'Queued again as a new message.'}
        </Typography>
      )}
      {resend.isError && !confirming && (
        <Typography level="body-xs" color="danger" role="alert">
          {resend.error.message}
        </Typography>
      )}
      <Modal open={confirming} onClose={() => setConfirming(false)}>
        <ModalDialog role="alertdialog" sx={{ width: 'min(520px, 96vw)' }}>
          <DialogTitle component="h2">This message may already have arrived</DialogTitle>
          <DialogContent sx={{ gap: 1 }}>
            <Typography level="body-sm">
              “{name}” to {entry.to} was with the mail server when our sender stopped, and its answer was never recorded. It may be in their
              mailbox already. Ask them first if you can: sending it again gives them a second copy.
            </Typography>
            {freshLink && <Typography level="body-sm">The copy carries a fresh link; the link in the first one stops working.</Typography>}
            {resend.isError && (
              <Typography level="body-sm" color="danger" role="alert">
                {resend.error.message}
              </Typography>
            )}
          </DialogContent>
          <DialogButtons
            onConfirm={() => send(true)}
            pending={resend.isPending}
            cancelLabel="Don’t send"
            onCancel={() => setConfirming(false)}
          >
            Send a second copy
          </DialogButtons>
        </ModalDialog>
      </Modal>
    </Stack>
  );
}

export function MailLogTable() {
  const [state, setState] = useState<MailState | null>(null);
  const [q, setQ] = useState('');
  const [page, setPage] = useState(1);
  const log = useMailLog({ page, pageSize, state: state ?? undefined, q: q.trim() || undefined });
  const data = log.data;
  const pages = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;

  return (
    <Stack gap={2}>
      <Stack direction={{ xs: 'column', sm: 'row' }} gap={2} alignItems={{ sm: 'flex-end' }}>
        <FormControl size="sm" sx={{ minWidth: 200 }}>
          <FormLabel id="mail-state-label">State</FormLabel>
          <Select
            aria-labelledby="mail-state-label"
            value={state}
            placeholder="Every state"
            onChange={(_, value) => {
              setState(value);
              setPage(1);
            }}
          >
            <Option value={null}>Every state</Option>
            {mailStates.map((s) => (
              <Option key={s} value={s}>
                {mailStateLabels[s]}
              </Option>
            ))}
          </Select>
        </FormControl>
        <FormControl size="sm" sx={{ minWidth: 260 }}>
          <FormLabel>Recipient</FormLabel>
          <Input
            type="search"
            placeholder="Part of an e-mail address"
            value={q}
            onChange={(event) => {
              setQ(event.target.value);
              setPage(1);
            }}
          />
        </FormControl>
        <Typography level="body-sm" sx={{ ml: { sm: 'auto' } }} role="status">
          {data ? `${data.total} message${data.total === 1 ? '' : 's'}` : log.isLoading ? 'Loading…' : ''}
        </Typography>
      </Stack>

      {log.isError && <Alert color="danger">{log.error.message}</Alert>}

      <Sheet variant="outlined" sx={{ borderRadius: 'sm', overflow: 'auto' }}>
        {/* Seven columns need about 56 rem; on a phone the table scrolls sideways inside the sheet. */}
        <Table
          size="sm"
          stickyHeader
          hoverRow
          sx={{ minWidth: '56rem', '& td, & th': { verticalAlign: 'top' }, fontVariantNumeric: 'tabular-nums' }}
        >
          <thead>
            <tr>
              <th style={{ width: 130 }}>Queued</th>
              <th>To</th>
              <th>Message</th>
              <th style={{ width: 150 }}>State</th>
              <th style={{ width: 80 }}>Attempts</th>
              <th>Last error</th>
              {data?.canResend && <th style={{ width: 120 }}>Action</th>}
            </tr>
          </thead>
          <tbody>
            {data?.items.map((entry) => (
              <tr key={entry.id}>
                <td>{formatStamp(entry.createdAt)}</td>
                <td style={{ wordBreak: 'break-all' }}>{entry.to}</td>
                <td>
                  <Typography level="body-sm" fontWeight="md">
                    {entry.subject ?? templateWords[entry.template] ?? entry.template}
                  </Typography>
                  <Typography level="body-xs">
                    {templateWords[entry.template] ?? entry.template}
                    {entry.resentFromId ? ' · a resend' : ''}
                  </Typography>
                </td>
                <td>
                  <Chip size="sm" variant="soft" color={stateColor[entry.state]}>
                    {mailStateLabels[entry.state]}
                  </Chip>
                  {entry.sentAt && <Typography level="body-xs">{formatStamp(entry.sentAt)}</Typography>}
                </td>
                <td>{entry.attempts}</td>
                <td>
                  <Typography level="body-xs" sx={{ whiteSpace: 'pre-wrap' }}>
                    {entry.lastError ?? '—'}
                  </Typography>
                </td>
                {data.canResend && (
                  <td>
                    <ResendButton entry={entry} />
                  </td>
                )}
              </tr>
            ))}
            {data && data.items.length === 0 && (
              <tr>
                <td colSpan={data.canResend ? 7 : 6}>
                  <Typography level="body-sm" sx={{ py: 2 }}>
                    No messages match. Clear the filters to see every message.
                  </Typography>
                </td>
              </tr>
            )}
          </tbody>
        </Table>
      </Sheet>

      <Stack direction="row" gap={1} alignItems="center" component="nav" aria-label="Mail log pages">
        <Button size="sm" variant="outlined" color="neutral" disabled={page <= 1} onClick={() => setPage((p) => p - 1)}>
          Newer
        </Button>
        <Typography level="body-sm">
          Page {page} of {pages}
        </Typography>
        <Button size="sm" variant="outlined" color="neutral" disabled={page >= pages} onClick={() => setPage((p) => p + 1)}>
          Older
        </Button>
      </Stack>
    </Stack>
  );
}
