import Box from '@mui/joy/Box';
import Button from '@mui/joy/Button';
import Typography from '@mui/joy/Typography';
import type { MissingChoice } from '../lib/configuration';
import type { StepId } from '../lib/steps';

const choiceWords: Record<MissingChoice, { words: string; step: StepId; action: string }> = {
  surface: { words: 'a board surface', step: 'surface', action: 'Choose a surface' },
  case: { words: 'a case', step: 'case', action: 'Choose a case' },
  pedals: { words: 'your pedals (a count is enough)', step: 'pedals', action: 'Add your pedals' },
};

const listed = (items: string[]) =>
  items.length <= 1 ? items.join('') : `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;

/** "Still to choose: a case and your pedals." */
export function missingWords(missing: MissingChoice[]): string {
  return `Still to choose: ${listed(missing.map((m) => choiceWords[m].words))}.`;
}

/**
 * The explained empty state of the estimate: nothing is priced until the player has chosen what
 * it is made of, and each missing choice is one click away.
 */
export function MissingChoices({
  missing,
  goToStep,
  size = 'md',
}: {
  missing: MissingChoice[];
  goToStep?: (step: StepId) => void;
  size?: 'sm' | 'md';
}) {
  return (
    // Boxes, not Stack: the estimate panel shows this on the configurator's first screen, which ships without Stack.
    <Box sx={{ display: 'flex', flexDirection: 'column', gap: 1, alignItems: 'flex-start' }} data-testid="estimate-missing">
      <Typography level={size === 'sm' ? 'body-sm' : 'body-md'}>
        Your estimate is built from your own choices, so nothing is priced yet. {missingWords(missing)}
      </Typography>
      {goToStep ? (
        <Box sx={{ display: 'flex', gap: 1, flexWrap: 'wrap' }}>
          {missing.map((m) => (
            <Button key={m} size="sm" variant="outlined" onClick={() => goToStep(choiceWords[m].step)}>
              {choiceWords[m].action}
            </Button>
          ))}
        </Box>
      ) : null}
    </Box>
  );
}
