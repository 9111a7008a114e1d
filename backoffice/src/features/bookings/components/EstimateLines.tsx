import Table from '@mui/joy/Table';
import Typography from '@mui/joy/Typography';
import { quantityWithUnit, type QuoteView } from '@loomwright/shared';
import { formatDay, formatHours, formatMoney, formatMoneyRange } from 'src/lib/format';

/** A quote exactly as it was priced: its lines, totals and the price-book version it came from. */
export function EstimateLines({ quote }: { quote: QuoteView }) {
  const e = quote.estimate;
  const c = quote.currency;
  return (
    <>
      <Typography level="body-xs">
        {quote.kind === 'firm' ? 'Firm quote' : 'Estimate'} priced from price book version {quote.priceBookVersion}
        {quote.kind === 'estimate' ? `; valid until ${formatDay(quote.expiresAt.slice(0, 10))}` : ''}.
      </Typography>
      <Table size="sm" aria-label="Estimate lines" sx={{ '--TableCell-height': '28px', fontVariantNumeric: 'tabular-nums' }}>
        <thead>
          <tr>
            <th style={{ width: '46%' }}>Line</th>
            <th style={{ textAlign: 'right' }}>Qty</th>
            <th style={{ textAlign: 'right' }}>Unit price</th>
            <th style={{ textAlign: 'right' }}>Amount</th>
          </tr>
        </thead>
        <tbody>
          {quote.lines.map((line) => {
            // A firm quote's labor lines come at the assigned builder's own rate and add up to its labor total.
            const firm = quote.kind === 'firm' && line.kind === 'labor';
            const unitPrice = line.unitPrice;
            const amount = firm
              ? formatMoney(line.amount, c)
              : line.amountHigh
                ? formatMoneyRange(line.amount, line.amountHigh, c)
                : formatMoney(line.amount, c);
            return (
              <tr key={line.code}>
                <td>
                  {line.label}
                  {line.explanation && !firm && (
                    <Typography level="body-xs" sx={{ display: 'block' }}>
                      {line.explanation}
                    </Typography>
                  )}
                </td>
                <td style={{ textAlign: 'right' }}>{quantityWithUnit(line.quantity, line.unit)}</td>
                <td style={{ textAlign: 'right' }}>
                  {formatMoney(unitPrice, c)}
                  {line.kind === 'labor' && !firm && line.amountHigh ? '+' : ''}
                </td>
                <td style={{ textAlign: 'right' }}>{amount}</td>
              </tr>
            );
          })}
        </tbody>
        <tfoot>
          <tr>
            <th colSpan={3}>Materials</th>
            <td style={{ textAlign: 'right' }}>{formatMoney(e.materialsTotal, c)}</td>
          </tr>
          <tr>
            <th colSpan={3}>Labor ({formatHours(e.laborHours)})</th>
            <td style={{ textAlign: 'right' }}>
              {quote.laborTotal ? formatMoney(quote.laborTotal, c) : formatMoneyRange(e.laborLow, e.laborHigh, c)}
            </td>
          </tr>
          <tr>
            <th colSpan={3}>Total</th>
            <td style={{ textAlign: 'right', fontWeight: 700 }}>
              {quote.total ? formatMoney(quote.total, c) : formatMoneyRange(quote.totalLow, quote.totalHigh, c)}
            </td>
          </tr>
          <tr>
            <th colSpan={3}>Deposit</th>
            <td style={{ textAlign: 'right' }}>{formatMoney(quote.deposit, c)}</td>
          </tr>
        </tfoot>
      </Table>
    </>
  );
}
