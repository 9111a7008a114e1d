import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import List from '@mui/joy/List';
import ListItem from '@mui/joy/ListItem';
import Typography from '@mui/joy/Typography';
import { levelRank } from '@loomwright/shared';
import { formatMoneyRange } from 'src/lib/format';
import { levelTotals } from '../../lib/level-compare';
import { ChoiceCards } from '../ChoiceCards';
import { InfoIcon } from '../icons';
import { StepHeading } from '../StepHeading';
import type { StepProps } from './step-props';

export default function BuilderStep({ catalog, configuration, update, live }: StepProps) {
  const minimum = live.estimate?.minimumLevel ?? 'apprentice';
  const reasons = live.estimate?.minimumLevelReasons ?? [];
  const minimumName = catalog.levels.find((l) => l.code === minimum)?.name ?? minimum;
  const levels = [...catalog.levels].sort((a, b) => levelRank(a.code) - levelRank(b.code));
  const totals = new Map(levelTotals(configuration, catalog).map((t) => [t.level, t.estimate]));
  const chosen = totals.get(configuration.level);
  const lower = live.isCurrent && live.estimate && levelRank(configuration.level) > levelRank(minimum) ? totals.get(minimum) : undefined;
  return (
    <>
      <StepHeading title="Who builds it">
        Builders work at rates that follow their experience. The estimate shows the range of the level you pick; the shop fixes the rate
        when a builder accepts your request.
      </StepHeading>
      {minimum !== 'apprentice' ? (
        <Alert variant="soft" color="primary" startDecorator={<InfoIcon />} sx={{ mb: 3, alignItems: 'flex-start' }} aria-live="polite">
          <div>
            <Typography level="title-sm" component="p">
              This rig needs at least a {minimumName.toLowerCase()} builder
            </Typography>
            {reasons.length ? (
              <List size="sm" marker="disc" sx={{ pl: 2, '--List-padding': '0' }}>
                {reasons.map((r) => (
                  <ListItem key={r}>{r}</ListItem>
                ))}
              </List>
            ) : null}
          </div>
        </Alert>
      ) : (
        <Typography level="body-sm" sx={{ mb: 3 }}>
          A plain serial board like this one suits any level, an apprentice included.
        </Typography>
      )}
      {lower && chosen ? (
        <Alert
          variant="soft"
          color="success"
          sx={{ mb: 3, flexWrap: 'wrap' }}
          data-testid="lower-level-offer"
          endDecorator={
            <Button size="sm" variant="outlined" color="success" onClick={() => update((c) => ({ ...c, level: minimum }))}>
              Choose {minimumName.toLowerCase()}
            </Button>
          }
        >
          This rig needs only a {minimumName.toLowerCase()} builder now. Choosing one brings the estimate to{' '}
          {formatMoneyRange(lower.totalLow, lower.totalHigh, catalog.currency)}, from{' '}
          {formatMoneyRange(chosen.totalLow, chosen.totalHigh, catalog.currency)}.
        </Alert>
      ) : null}
      <ChoiceCards
        name="level"
        label="Builder level"
        value={configuration.level}
        onChange={(level) => update((c) => ({ ...c, level: level as typeof c.level }))}
        choices={levels.map((l) => {
          const tooLow = levelRank(l.code) < levelRank(minimum);
          return {
            value: l.code,
            title: l.name,
            figure: `${formatMoneyRange(l.rateLow, l.rateHigh, catalog.currency)} an hour`,
            disabled: tooLow,
            details: (
              <>
                <Typography
                  level="title-sm"
                  component="p"
                  sx={{ fontVariantNumeric: 'tabular-nums', mb: 0.5 }}
                  data-testid={`level-total-${l.code}`}
                >
                  {totals.get(l.code)
                    ? `This rig: ${formatMoneyRange(totals.get(l.code)!.totalLow, totals.get(l.code)!.totalHigh, catalog.currency)}`
                    : null}
                </Typography>
                <Typography level="body-sm">{l.description}</Typography>
                {tooLow ? (
                  <Typography level="body-sm" sx={{ mt: 1, fontWeight: 'md', color: 'warning.700' }}>
                    Not offered for this rig: it needs at least a {minimumName.toLowerCase()}.
                  </Typography>
                ) : null}
                {l.code === minimum && minimum !== 'apprentice' ? (
                  <Typography level="body-sm" sx={{ mt: 1, fontWeight: 'md' }}>
                    The least this rig calls for.
                  </Typography>
                ) : null}
              </>
            ),
          };
        })}
      />
    </>
  );
}
