import Card from '@mui/joy/Card';
import Chip from '@mui/joy/Chip';
import Link from '@mui/joy/Link';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import Decimal from 'decimal.js';
import type {
  BookingState,
  DateRangeQuery,
  UtilisationReport,
  HoursBuildRow,
  HoursBuilderRow,
  OutstandingItem,
  RevenueMonth,
  UtilisationWeek,
} from '@loomwright/shared';
import Button from '@mui/joy/Button';
import { lazy, Suspense, useState, type ReactNode } from 'react';
import { Link as RouterLink } from 'react-router';
import { ErrorNote } from 'src/components/ErrorNote';
import { PageLoading } from 'src/components/PageLoading';
import { StateChip } from 'src/components/StateChip';
import { formatDay, formatHours, formatMoney, formatMonth } from 'src/lib/format';
import { useHoursReport } from '../api/get-hours';
import { useOutstanding } from '../api/get-outstanding';
import { useRevenue } from '../api/get-revenue';
import { useUtilisation } from '../api/get-utilisation';
import { ReportTable } from './ReportTable';

// The chart library is fetched only when a chart is first drawn on this page.
const RevenueChart = lazy(() => import('./RevenueChart'));
const UtilisationChart = lazy(() => import('./UtilisationChart'));

export function ReportSection({ id, title, hint, children }: { id: string; title: string; hint: ReactNode; children: ReactNode }) {
  return (
    <Card variant="outlined" component="section" aria-labelledby={`${id}-title`} sx={{ gap: 1.5 }}>
      <div>
        <Typography id={`${id}-title`} level="title-lg" component="h2">
          {title}
        </Typography>
        <Typography level="body-sm">{hint}</Typography>
      </div>
      {children}
    </Card>
  );
}

const signed = (amount: string, currency: string) => formatMoney(amount, currency);
const overWords = (over: string) => {
  const d = new Decimal(over);
  if (d.isZero()) return 'on the quote';
  return d.gt(0) ? `${formatHours(d.toFixed(2))} over` : `${formatHours(d.neg().toFixed(2))} under`;
};

export function RevenueSection({ range }: { range: DateRangeQuery | null }) {
  const revenue = useRevenue(range);
  const data = revenue.data;
  return (
    <ReportSection
      id="revenue"
      title="Revenue by month"
      hint="Money that arrived (deposits and balances) and went back (refunds), by the month on the shop’s calendar. Sums of the payments CSV."
    >
      <ErrorNote error={revenue.error} />
      {revenue.isPending && range && <PageLoading label="Adding up the payments…" />}
      {data &&
        data.totals.map((total) => (
          <Stack key={total.currency} gap={1}>
            <Suspense fallback={<PageLoading label="Drawing the chart…" />}>
              <RevenueChart months={data.months} currency={total.currency} />
            </Suspense>
            <ReportTable<RevenueMonth>
              label={`Revenue by month in ${total.currency}`}
              rows={data.months.filter((m) => m.currency === total.currency)}
              rowKey={(m) => `${m.month}-${m.currency}`}
              empty="No months in this range."
              columns={[
                { header: 'Month', render: (m) => formatMonth(`${m.month}-01`) },
                { header: 'Deposits', figure: true, render: (m) => signed(m.deposits, m.currency) },
                { header: 'Balances', figure: true, render: (m) => signed(m.balances, m.currency) },
                {
                  header: 'Refunds',
                  figure: true,
                  render: (m) => (new Decimal(m.refunds).isZero() ? signed('0', m.currency) : `−${signed(m.refunds, m.currency)}`),
                },
                { header: 'Net', figure: true, render: (m) => <strong>{signed(m.net, m.currency)}</strong> },
              ]}
              footer={[
                'Total',
                signed(total.deposits, total.currency),
                signed(total.balances, total.currency),
                new Decimal(total.refunds).isZero() ? signed('0', total.currency) : `−${signed(total.refunds, total.currency)}`,
                signed(total.net, total.currency),
              ]}
            />
          </Stack>
        ))}
    </ReportSection>
  );
}

const kindWords: Record<OutstandingItem['kind'], string> = {
  deposit: 'Deposit not paid',
  balance: 'Balance due',
  credit: 'Held beyond what is owed',
};

export function OutstandingSection() {
  const outstanding = useOutstanding();
  const data = outstanding.data;
  return (
    <ReportSection
      id="outstanding"
      title="Money outstanding"
      hint={`As of ${data ? formatDay(data.asOf) : 'today'}: deposits of open requests, balances of accepted builds, and money the shop holds beyond what a build owes (to refund or settle). The deposit and balance_due columns of the bookings CSV.`}
    >
      <ErrorNote error={outstanding.error} />
      {outstanding.isPending && <PageLoading />}
      {data && (
        <>
          <Stack direction="row" gap={1} flexWrap="wrap" aria-label="Totals">
            {data.totals.length === 0 && (
              <Typography level="body-sm">Nothing is owed and nothing is held: every booking is square.</Typography>
            )}
            {data.totals.map((t) => (
              <Chip key={`${t.kind}-${t.currency}`} variant="soft" color={t.kind === 'credit' ? 'warning' : 'primary'} size="lg">
                {kindWords[t.kind]}: {formatMoney(t.amount, t.currency)} ({t.count} {t.count === 1 ? 'booking' : 'bookings'})
              </Chip>
            ))}
          </Stack>
          <ReportTable<OutstandingItem>
            label="Money outstanding per booking"
            rows={data.items}
            rowKey={(i) => `${i.bookingId}-${i.kind}`}
            empty="Nothing outstanding."
            columns={[
              {
                header: 'Reference',
                render: (i) => (
                  <Link component={RouterLink} to={i.kind === 'deposit' ? `/requests?open=${i.bookingId}` : `/builds/${i.bookingId}`}>
                    {i.reference}
                  </Link>
                ),
              },
              { header: 'State', render: (i) => <StateChip state={i.state as BookingState} /> },
              { header: 'Customer', render: (i) => i.customerName },
              { header: 'Builder', render: (i) => i.builderName ?? '—' },
              { header: 'What', render: (i) => kindWords[i.kind] },
              { header: 'Since', render: (i) => formatDay(i.since) },
              { header: 'Amount', figure: true, render: (i) => formatMoney(i.amount, i.currency) },
            ]}
          />
        </>
      )}
    </ReportSection>
  );
}

export function HoursSection({ range }: { range: DateRangeQuery | null }) {
  const report = useHoursReport(range);
  const data = report.data;
  return (
    <ReportSection
      id="hours"
      title="Quoted against spent hours"
      hint="Builds with hours recorded in the range: the hours the firm quote (or the estimate) allowed against the hours recorded so far. “In range” is the hours CSV for the same days."
    >
      <ErrorNote error={report.error} />
      {report.isPending && range && <PageLoading />}
      {data && (
        <>
          <Typography level="title-md" component="h3">
            Per builder
          </Typography>
          <ReportTable<HoursBuilderRow>
            label="Hours per builder"
            rows={data.builders}
            rowKey={(r) => r.builderId}
            empty="No hours recorded in this range."
            columns={[
              { header: 'Builder', render: (r) => `${r.builderName} (${r.level})` },
              { header: 'Their hours in range', figure: true, render: (r) => formatHours(r.hoursInRange) },
              { header: 'Their builds', figure: true, render: (r) => r.builds },
              { header: 'Quoted', figure: true, render: (r) => formatHours(r.quotedHours) },
              { header: 'Spent to date', figure: true, render: (r) => formatHours(r.hoursToDate) },
              { header: 'Against the quote', figure: true, render: (r) => overWords(r.overQuote) },
            ]}
          />
          <Typography level="title-md" component="h3">
            Per build
          </Typography>
          <ReportTable<HoursBuildRow>
            label="Hours per build"
            rows={data.builds}
            rowKey={(r) => r.bookingId}
            empty="No hours recorded in this range."
            columns={[
              {
                header: 'Reference',
                render: (r) => (
                  <Link component={RouterLink} to={`/builds/${r.bookingId}`}>
                    {r.reference}
                  </Link>
                ),
              },
              { header: 'State', render: (r) => <StateChip state={r.state as BookingState} /> },
              { header: 'Builder', render: (r) => r.builderName ?? '—' },
              { header: 'Quoted', figure: true, render: (r) => formatHours(r.quotedHours) },
              { header: 'In range', figure: true, render: (r) => formatHours(r.hoursInRange) },
              { header: 'To date', figure: true, render: (r) => formatHours(r.hoursToDate) },
              { header: 'Against the quote', figure: true, render: (r) => overWords(r.overQuote) },
            ]}
          />
        </>
      )}
    </ReportSection>
  );
}

export function UtilisationSection({ range }: { range: DateRangeQuery | null }) {
  const report = useUtilisation(range);
  const data = report.data;
  return (
    <ReportSection
      id="utilisation"
      title="Bench utilisation"
      hint="Per builder and ISO week (Monday to Sunday): the hours their week allows (less holidays, closures and days away), the hours booked on the bench, and the hours recorded."
    >
      <ErrorNote error={report.error} />
      {report.isPending && range && <PageLoading />}
      {data && (
        <ReportTable<UtilisationReport['builders'][number]>
          label="Bench utilisation per builder over the range"
          rows={data.builders}
          rowKey={(b) => b.builderId}
          empty="No builders have joined yet."
          columns={[
            { header: 'Builder', render: (b) => `${b.builderName} (${b.level})` },
            { header: 'Weeks', figure: true, render: (b) => b.weeks.length },
            { header: 'Capacity', figure: true, render: (b) => formatHours(totalOf(b.weeks, 'capacityHours')) },
            { header: 'Booked', figure: true, render: (b) => formatHours(totalOf(b.weeks, 'bookedHours')) },
            { header: 'Booked %', figure: true, render: (b) => share(totalOf(b.weeks, 'bookedHours'), totalOf(b.weeks, 'capacityHours')) },
            { header: 'Recorded', figure: true, render: (b) => formatHours(totalOf(b.weeks, 'recordedHours')) },
            {
              header: 'Recorded %',
              figure: true,
              render: (b) => share(totalOf(b.weeks, 'recordedHours'), totalOf(b.weeks, 'capacityHours')),
            },
          ]}
        />
      )}
      {data?.builders.map((b) => (
        <Stack key={b.builderId} gap={1}>
          <Typography level="title-md" component="h3">
            {b.builderName} <Typography level="body-sm">({b.level})</Typography>
          </Typography>
          <Suspense fallback={<PageLoading label="Drawing the chart…" />}>
            <UtilisationChart builder={b} />
          </Suspense>
          <WeeklyFigures count={b.weeks.length}>
            <ReportTable<UtilisationWeek>
              label={`Bench utilisation of ${b.builderName}`}
              rows={b.weeks}
              rowKey={(w) => w.weekStart}
              empty="No weeks in this range."
              columns={[
                { header: 'Week', render: (w) => `${w.isoWeek} · from ${formatDay(w.weekStart)}` },
                { header: 'Capacity', figure: true, render: (w) => formatHours(w.capacityHours) },
                { header: 'Booked', figure: true, render: (w) => formatHours(w.bookedHours) },
                { header: 'Booked %', figure: true, render: (w) => (w.bookedPercent === null ? 'no bench' : `${w.bookedPercent} %`) },
                { header: 'Recorded', figure: true, render: (w) => formatHours(w.recordedHours) },
                { header: 'Recorded %', figure: true, render: (w) => (w.recordedPercent === null ? 'no bench' : `${w.recordedPercent} %`) },
              ]}
            />
          </WeeklyFigures>
        </Stack>
      ))}
    </ReportSection>
  );
}

const totalOf = (weeks: UtilisationWeek[], key: 'capacityHours' | 'bookedHours' | 'recordedHours') =>
  weeks.reduce((s, w) => s.plus(w[key]), new Decimal(0)).toFixed(2);
const share = (part: string, whole: string) =>
  new Decimal(whole).isZero() ? 'no bench' : `${new Decimal(part).div(whole).times(100).toFixed(1)} %`;

/** The week-by-week table behind a button: a year is 53 rows per builder. */
function WeeklyFigures({ count, children }: { count: number; children: ReactNode }) {
  // Open by itself for a month or so; a year's weeks wait for the button (until someone chooses).
  const [choice, setChoice] = useState<boolean | null>(null);
  const open = choice ?? count <= 6;
  const setOpen = (value: boolean) => setChoice(value);
  return (
    <>
      {count > 6 && (
        <Button size="sm" variant="plain" sx={{ alignSelf: 'flex-start' }} aria-expanded={open} onClick={() => setOpen(!open)}>
          {open ? 'Hide the weekly figures' : `Show the weekly figures (${count} weeks)`}
        </Button>
      )}
      {open && children}
    </>
  );
}
