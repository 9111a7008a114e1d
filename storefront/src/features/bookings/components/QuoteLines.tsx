import Table from '@mui/joy/Table';
import Typography from '@mui/joy/Typography';
import { quantityWithUnit, type QuoteView } from '@loomwright/shared';
import { formatAmount, formatDay, formatRange } from 'src/lib/format';

/** The quote as it was priced (its own price-book version), line by line. */
export function QuoteLines({ quote }: { quote: QuoteView }) {
  const c = quote.currency;
  return (
    <>
      <Table
        size="sm"
        aria-label={quote.kind === 'firm' ? 'Firm quote' : 'Estimate'}
        sx={{ fontVariantNumeric: 'tabular-nums', '& td:last-child, & th:last-child': { textAlign: 'right' } }}
      >
        <thead>
          <tr>
            <th>Item</th>
            <th style={{ width: '30%' }}>Quantity</th>
            <th style={{ width: '30%' }}>Amount</th>
          </tr>
        </thead>
        <tbody>
          {quote.lines.map((line) => (
            <tr key={line.code}>
              <td>{line.label}</td>
              <td>{quantityWithUnit(line.quantity, line.unit)}</td>
              <td>
                {line.amountHigh && quote.kind === 'estimate' ? formatRange(line.amount, line.amountHigh, c) : formatAmount(line.amount, c)}
              </td>
            </tr>
          ))}
        </tbody>
        <tfoot>
          <tr>
            <th scope="row" colSpan={2}>
              Total ({quote.laborHours} h labor)
            </th>
            <td>
              <b>{quote.total ? formatAmount(quote.total, c) : formatRange(quote.totalLow, quote.totalHigh, c)}</b>
            </td>
          </tr>
        </tfoot>
      </Table>
      <Typography level="body-xs" sx={{ mt: 1 }}>
        Priced from price book version {quote.priceBookVersion}; this {quote.kind === 'firm' ? 'quote' : 'estimate'} holds until{' '}
        {formatDay(quote.expiresAt.slice(0, 10))}. Pedals, the power supply and any switcher are yours and not included.
      </Typography>
    </>
  );
}
