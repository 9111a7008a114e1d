import Alert from '@mui/joy/Alert';
import Box from '@mui/joy/Box';
import Button from '@mui/joy/Button';
import List from '@mui/joy/List';
import ListItem from '@mui/joy/ListItem';
import Table from '@mui/joy/Table';
import Typography from '@mui/joy/Typography';
import { Suspense, type ReactNode } from 'react';
import { useNavigate } from 'react-router';
import { encodeConfiguration, quantityWithUnit } from '@loomwright/shared';
import { formatHours, formatMoney, formatMoneyRange } from 'src/lib/format';
import { useDownloadQuote } from '../../api/download-quote';
import { BoardFitView } from '../BoardFitView';
import { CableList } from '../CableList';
import { MissingChoices } from '../MissingChoices';
import { PowerBudgetView } from '../PowerBudgetView';
import { PowerCautions } from '../PowerCautions';
import { StepHeading } from '../StepHeading';
import type { StepProps } from './step-props';

type EstimateLine = NonNullable<StepProps['live']['estimate']>['lines'][number];

/** One part of the estimate as a table: a row per line (its words, then its figures), and the part's total below. */
function LinesSection({
  id,
  title,
  firstHeading,
  headings,
  lines,
  cells,
  total,
}: {
  id: string;
  title: string;
  firstHeading: string;
  headings: string[];
  lines: EstimateLine[];
  cells: (line: EstimateLine) => ReactNode[];
  total: ReactNode;
}) {
  return (
    <Box component="section" aria-labelledby={id}>
      <Typography level="title-lg" component="h3" id={id} sx={{ mb: 1 }}>
        {title}
      </Typography>
      <Box>
        <Table
          size="sm"
          aria-labelledby={id}
          sx={{ '--TableCell-paddingX': { xs: '4px', sm: '8px' }, '& tr > :nth-child(n+2)': { textAlign: 'right' } }}
        >
          <thead>
            <tr>
              <th scope="col" style={{ width: '46%' }}>
                {firstHeading}
              </th>
              {headings.map((heading) => (
                <th scope="col" key={heading}>
                  {heading}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {lines.map((line) => (
              <tr key={line.code}>
                <td>
                  {line.label}
                  {line.explanation ? <Typography level="body-xs">{line.explanation}</Typography> : null}
                </td>
                {cells(line).map((cell, i) => (
                  <td key={i}>{cell}</td>
                ))}
              </tr>
            ))}
          </tbody>
          <tfoot>{total}</tfoot>
        </Table>
      </Box>
    </Box>
  );
}

export default function ReviewStep({ catalog, configuration, live, keep, goToStep }: StepProps) {
  const navigate = useNavigate();
  const quote = useDownloadQuote();
  const e = live.estimate;
  const currency = e?.currency ?? catalog.currency;
  const materials = e?.lines.filter((l) => l.kind === 'materials') ?? [];
  const labor = e?.lines.filter((l) => l.kind === 'labor') ?? [];
  const switcher = configuration.routing.mode === 'switcher';
  const levelName = catalog.levels.find((l) => l.code === e?.level)?.name ?? e?.level;
  return (
    <>
      <StepHeading title="Review your build">
        Everything the estimate is made of, line by line. It is a range because the rate depends on the builder who takes it; the shop
        confirms a firm price when it accepts.
      </StepHeading>
      {live.missing.length ? (
        <MissingChoices missing={live.missing} goToStep={goToStep} />
      ) : !e ? (
        <Typography>{live.error ? `The estimate could not be made: ${live.error.message}` : 'Working out the estimate…'}</Typography>
      ) : (
        <Box sx={{ display: 'grid', gap: 4, gridTemplateColumns: 'minmax(0, 1fr)' }} aria-busy={live.isUpdating}>
          <LinesSection
            id="materials-heading"
            title="Materials"
            firstHeading="Item"
            headings={['Quantity', 'Each', 'Amount']}
            lines={materials}
            cells={(l) => [quantityWithUnit(l.quantity, l.unit), formatMoney(l.unitPrice, currency), formatMoney(l.amount, currency)]}
            total={
              <tr>
                <th scope="row" colSpan={3}>
                  Materials total
                </th>
                <td data-testid="review-materials">{formatMoney(e.materialsTotal, currency)}</td>
              </tr>
            }
          />
          <LinesSection
            id="labor-heading"
            title="Labor"
            firstHeading="Work"
            headings={['Hours', 'Amount']}
            lines={labor}
            cells={(l) => [formatHours(l.quantity), formatMoneyRange(l.amount, l.amountHigh ?? l.amount, currency)]}
            total={
              <tr>
                <th scope="row">
                  Labor at {levelName} rates ({formatMoneyRange(e.rate.low, e.rate.high, currency)} an hour)
                </th>
                <td data-testid="review-hours">{formatHours(e.laborHours)}</td>
                <td data-testid="review-labor">{formatMoneyRange(e.laborLow, e.laborHigh, currency)}</td>
              </tr>
            }
          />
          <Box
            component="section"
            aria-labelledby="total-heading"
            sx={{ p: 2, borderRadius: 'md', bgcolor: 'primary.50', border: '1px solid', borderColor: 'primary.200' }}
          >
            <Typography level="title-lg" component="h3" id="total-heading">
              Estimated total
            </Typography>
            <Typography level="h3" component="p" sx={{ fontVariantNumeric: 'tabular-nums' }} data-testid="review-total">
              {formatMoneyRange(e.totalLow, e.totalHigh, currency)}
            </Typography>
            <Typography sx={{ mt: 1, fontVariantNumeric: 'tabular-nums' }}>
              Deposit to book bench time: <b data-testid="review-deposit">{formatMoney(e.deposit, currency)}</b>
            </Typography>
            <Typography level="body-sm" sx={{ mt: 0.5 }}>
              {catalog.depositPolicy.description}
            </Typography>
          </Box>
          {e.checks ? (
            <>
              <BoardFitView fit={e.checks.boardFit} catalog={catalog} />
              <CableList schedule={e.checks.cableSchedule} />
              <PowerBudgetView budget={e.checks.powerBudget} />
            </>
          ) : null}
          {e.notes.length ? (
            <Box component="section" aria-labelledby="notes-heading">
              <Typography level="title-lg" component="h3" id="notes-heading">
                Notes from the checks
              </Typography>
              <List marker="disc" size="sm" sx={{ pl: 2 }}>
                {e.notes.map((n) => (
                  <ListItem key={n}>{n}</ListItem>
                ))}
              </List>
            </Box>
          ) : null}
          <Box component="section" aria-labelledby="supply-you-heading">
            <Typography level="title-lg" component="h3" id="supply-you-heading">
              What you still supply
            </Typography>
            <List marker="disc" size="sm" sx={{ pl: 2 }}>
              <ListItem>Your pedals: the estimate covers mounting and wiring them, not the pedals.</ListItem>
              <ListItem>Your power supply: we cut its leads to length and fit new plugs.</ListItem>
              {switcher ? <ListItem>Your loop switcher, with its own power lead.</ListItem> : null}
            </List>
          </Box>
          <PowerCautions />
          <Alert variant="soft" color="neutral">
            A loaded board in a road case is heavy: lift it with two people.
          </Alert>
          <Box component="section" aria-labelledby="keep-heading">
            <Typography level="title-lg" component="h3" id="keep-heading">
              Keep this quote
            </Typography>
            <Typography level="body-sm" sx={{ mb: 1 }}>
              A PDF with every line, the layout, the power plan, the patch cables and the cautions, priced from today’s price book.
            </Typography>
            <Button variant="outlined" loading={quote.isPending} onClick={() => quote.mutate(configuration)} disabled={!live.isCurrent}>
              Download the quote (PDF)
            </Button>
            {quote.isError ? (
              <Typography role="alert" level="body-sm" sx={{ color: 'danger.700', mt: 1 }}>
                {quote.error.message}
              </Typography>
            ) : null}
            {keep ? (
              <Box sx={{ mt: 3 }}>
                <Suspense fallback={<Typography level="body-sm">Loading…</Typography>}>{keep(configuration, live.isCurrent)}</Suspense>
              </Box>
            ) : null}
          </Box>
          <Box>
            <Button
              onClick={() => navigate(`/request?c=${encodeConfiguration(configuration)}`)}
              color="accent"
              size="lg"
              disabled={!live.isCurrent}
            >
              Request this build
            </Button>
            <Typography level="body-sm" sx={{ mt: 1 }}>
              Next you sign in (or create an account), see the bench dates on offer and pay the deposit.
            </Typography>
          </Box>
        </Box>
      )}
    </>
  );
}
