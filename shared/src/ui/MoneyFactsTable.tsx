import Table from '@mui/joy/Table';
import Typography from '@mui/joy/Typography';
import { moneyAccount } from '../money/money-account';
import type { MoneyFacts } from '../money/money-facts';

interface Props {
  money: MoneyFacts;
  /** Each app's own money and moment formats ("$1,120.00", "3 Dec 2026, 14:05"). */
  formatMoney: (amount: string, currency: string) => string;
  formatMoment: (iso: string) => string;
}

/**
 * The booking's money as one short account, the same words in the storefront, the backoffice and
 * the build sheet (`moneyAccount()`): firm quote, approved extras, each payment and each refund at
 * its own time, and what is due.
 */
export function MoneyFactsTable({ money, formatMoney, formatMoment }: Props) {
  const c = money.currency;
  const { rows, notes } = moneyAccount(money, formatMoney);
  return (
    <>
      <Table size="sm" aria-label="Money" sx={{ fontVariantNumeric: 'tabular-nums', '& td:last-child': { textAlign: 'right' } }}>
        <tbody>
          {rows.map((row) => (
            <tr key={row.key}>
              <td>
                {row.strong ? <b>{row.label}</b> : row.label}
                {row.at && (
                  <Typography component="span" level="body-xs">
                    {' '}
                    · {formatMoment(row.at)}
                  </Typography>
                )}
              </td>
              <td>{row.strong ? <b>{formatMoney(row.amount, c)}</b> : formatMoney(row.amount, c)}</td>
            </tr>
          ))}
        </tbody>
      </Table>
      {notes.map((note) => (
        <Typography key={note} level="body-xs">
          {note}
        </Typography>
      ))}
    </>
  );
}
