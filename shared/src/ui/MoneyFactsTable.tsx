import Table from '@mui/joy/Table';
import Typography from '@mui/joy/Typography';
import type { MoneyFacts } from '../money/money-facts';

interface Props {
  money: MoneyFacts;
  /** Each app's own money and moment formats ("$1,120.00", "3 Dec 2026, 14:05"). */
  formatMoney: (amount: string, currency: string) => string;
  formatMoment: (iso: string) => string;
}

const paymentWords = { deposit: 'Deposit', balance: 'Balance' } as const;

/**
 * The booking's money as one short account, the same words in the storefront and the backoffice:
 * firm quote, approved extras, each payment and each refund at its own time, and what is due.
 */
export function MoneyFactsTable({ money, formatMoney, formatMoment }: Props) {
  const c = money.currency;
  const when = (at: string | null) => (at ? formatMoment(at) : '');
  const rows: Array<{ key: string; label: string; detail?: string; amount: string; strong?: boolean }> = [];
  if (money.firmTotal !== null) rows.push({ key: 'firm', label: 'Firm quote', amount: money.firmTotal });
  if (money.firmTotal !== null || money.approvedExtras !== formatZero(money.approvedExtras)) {
    rows.push({ key: 'extras', label: 'Approved extras', amount: money.approvedExtras });
  }
  money.ledger.forEach((entry, i) =>
    rows.push({
      key: `ledger-${i}`,
      label: entry.kind === 'refund' ? `${paymentWords[entry.paymentKind]} refunded` : `${paymentWords[entry.paymentKind]} paid`,
      detail: when(entry.at),
      amount: entry.amount,
    }),
  );
  if (money.balanceDue !== null) {
    rows.push({
      key: 'due',
      label: money.balanceWaived && money.balanceDue !== formatZero(money.balanceDue) ? 'Balance due (waived by the shop)' : 'Balance due',
      amount: money.balanceDue,
      strong: true,
    });
  }
  if (money.credit !== formatZero(money.credit)) rows.push({ key: 'credit', label: 'Paid beyond the total (the shop refunds it)', amount: money.credit });
  return (
    <>
      <Table size="sm" aria-label="Money" sx={{ fontVariantNumeric: 'tabular-nums', '& td:last-child': { textAlign: 'right' } }}>
        <tbody>
          {rows.map((row) => (
            <tr key={row.key}>
              <td>
                {row.strong ? <b>{row.label}</b> : row.label}
                {row.detail && (
                  <Typography component="span" level="body-xs">
                    {' '}
                    · {row.detail}
                  </Typography>
                )}
              </td>
              <td>{row.strong ? <b>{formatMoney(row.amount, c)}</b> : formatMoney(row.amount, c)}</td>
            </tr>
          ))}
        </tbody>
      </Table>
      {money.proposedExtras !== formatZero(money.proposedExtras) && (
        <Typography level="body-xs">
          Extras waiting for the player&apos;s answer ({formatMoney(money.proposedExtras, c)}) are not counted until approved.
        </Typography>
      )}
      {money.firmTotal === null && <Typography level="body-xs">The balance is worked out once a builder accepts and the quote is firm.</Typography>}
    </>
  );
}

/** "0.00" in the same digits as `amount`, so a zero is recognised without a float. */
function formatZero(amount: string) {
  const digits = amount.split('.')[1]?.length ?? 0;
  return digits ? `0.${'0'.repeat(digits)}` : '0';
}
