import { useTheme } from '@mui/joy/styles';
import type { RevenueMonth } from '@loomwright/shared';
import { Bar, CartesianGrid, ComposedChart, Legend, Line, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { formatMoney, formatMonth } from 'src/lib/format';

/**
 * Money in and back per month: deposits and balances stacked above the line, refunds below it,
 * the net as a line. Loaded only on the Reports page (React.lazy), so the chart library never
 * weighs on the other pages. The table beside it carries the same figures in words.
 */
export default function RevenueChart({ months, currency }: { months: RevenueMonth[]; currency: string }) {
  const theme = useTheme();
  const data = months
    .filter((m) => m.currency === currency)
    .map((m) => ({
      month: formatMonth(`${m.month}-01`)
        .replace(/ (\d{4})$/, ' ’$1')
        .replace('’20', '’'),
      Deposits: Number(m.deposits),
      Balances: Number(m.balances),
      Refunds: -Number(m.refunds),
      Net: Number(m.net),
    }));
  const money = (v: number) => formatMoney(String(v), currency);
  return (
    <figure style={{ margin: 0 }} aria-label={`Revenue per month in ${currency}; the table below lists the same figures`}>
      <ResponsiveContainer width="100%" height={280}>
        <ComposedChart data={data} stackOffset="sign" margin={{ top: 8, right: 16, bottom: 0, left: 16 }}>
          <CartesianGrid stroke={theme.palette.neutral[200]} vertical={false} />
          <XAxis dataKey="month" tick={{ fontSize: 12, fill: theme.palette.text.secondary }} />
          <YAxis tickFormatter={money} width={88} tick={{ fontSize: 12, fill: theme.palette.text.secondary }} />
          <Tooltip formatter={(v) => money(Number(v))} />
          <Legend />
          <ReferenceLine y={0} stroke={theme.palette.neutral[500]} />
          <Bar dataKey="Deposits" stackId="money" maxBarSize={72} fill={theme.palette.primary[600]} />
          <Bar dataKey="Balances" stackId="money" maxBarSize={72} fill={theme.palette.primary[300]} />
          <Bar dataKey="Refunds" stackId="money" maxBarSize={72} fill={theme.palette.danger[400]} />
          <Line dataKey="Net" stroke={theme.palette.accent[600]} strokeWidth={2} dot={{ r: 3 }} />
        </ComposedChart>
      </ResponsiveContainer>
    </figure>
  );
}
