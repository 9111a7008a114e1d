import { useTheme } from '@mui/joy/styles';
import type { UtilisationReport } from '@loomwright/shared';
import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { formatHours } from 'src/lib/format';

/** One builder's weeks: capacity, booked and recorded hours side by side. Loaded only on the Reports page. */
export default function UtilisationChart({ builder }: { builder: UtilisationReport['builders'][number] }) {
  const theme = useTheme();
  const data = builder.weeks.map((w) => ({
    week: w.isoWeek.replace(/^\d{4}-/, ''),
    Capacity: Number(w.capacityHours),
    Booked: Number(w.bookedHours),
    Recorded: Number(w.recordedHours),
  }));
  return (
    <figure style={{ margin: 0 }} aria-label={`Bench hours per week for ${builder.builderName}; the table lists the same figures`}>
      <ResponsiveContainer width="100%" height={200}>
        <BarChart data={data} margin={{ top: 8, right: 16, bottom: 0, left: 0 }}>
          <CartesianGrid stroke={theme.palette.neutral[200]} vertical={false} />
          <XAxis dataKey="week" tick={{ fontSize: 12, fill: theme.palette.text.secondary }} />
          <YAxis tickFormatter={(v) => `${v} h`} width={48} tick={{ fontSize: 12, fill: theme.palette.text.secondary }} />
          <Tooltip formatter={(v) => formatHours(Number(v))} />
          <Legend />
          <Bar dataKey="Capacity" fill={theme.palette.neutral[300]} />
          <Bar dataKey="Booked" fill={theme.palette.primary[600]} />
          <Bar dataKey="Recorded" fill={theme.palette.accent[500]} />
        </BarChart>
      </ResponsiveContainer>
    </figure>
  );
}
