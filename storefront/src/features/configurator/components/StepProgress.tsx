import Box from '@mui/joy/Box';
import Typography from '@mui/joy/Typography';
import visuallyHidden from '@mui/utils/visuallyHidden';
import { configuratorSteps, type StepId } from '../lib/steps';
import { CheckMark } from './CheckMark';

/**
 * Where the player is: the seven steps as a cable run with a jack for each step. Every step is a
 * link-like button, so any step can be revisited; the current one is marked in words for screen
 * readers (aria-current) and by shape and weight on screen. A button's name is its visible text
 * (the step's name, plus "visited" for screen readers), never a separate aria-label (WCAG 2.2 SC 2.5.3).
 */
export function StepProgress({ current, onSelect }: { current: StepId; onSelect: (step: StepId) => void }) {
  const index = configuratorSteps.findIndex((s) => s.id === current);
  return (
    <Box component="nav" aria-label="Configurator steps" sx={{ mb: 3 }}>
      <Typography level="body-sm" sx={{ fontWeight: 'lg', color: 'primary.700', mb: 1 }}>
        Step {index + 1} of {configuratorSteps.length}: {configuratorSteps[index]?.title}
      </Typography>
      <Box
        component="ol"
        sx={{
          listStyle: 'none',
          m: 0,
          p: 0,
          display: 'grid',
          gridTemplateColumns: `repeat(${configuratorSteps.length}, minmax(0, 1fr))`,
          position: 'relative',
          '&::before': {
            content: '""',
            position: 'absolute',
            top: 15,
            left: `${50 / configuratorSteps.length}%`,
            right: `${50 / configuratorSteps.length}%`,
            height: 4,
            borderRadius: 2,
            bgcolor: 'neutral.300',
          },
        }}
      >
        {configuratorSteps.map((step, i) => {
          const isCurrent = step.id === current;
          const done = i < index;
          return (
            <Box component="li" key={step.id} sx={{ position: 'relative', display: 'flex', justifyContent: 'center' }}>
              <Box
                component="button"
                type="button"
                onClick={() => onSelect(step.id)}
                aria-current={isCurrent ? 'step' : undefined}
                sx={{
                  all: 'unset',
                  cursor: 'pointer',
                  display: 'flex',
                  flexDirection: 'column',
                  alignItems: 'center',
                  gap: 0.75,
                  px: 0.5,
                  borderRadius: 'sm',
                  '&:focus-visible': { outline: '3px solid', outlineColor: 'primary.500', outlineOffset: '2px' },
                }}
              >
                <Box
                  aria-hidden
                  sx={{
                    width: 34,
                    height: 34,
                    borderRadius: '10px',
                    display: 'grid',
                    placeItems: 'center',
                    fontWeight: 'lg',
                    fontSize: 'sm',
                    border: '2px solid',
                    borderColor: isCurrent ? 'accent.600' : done ? 'primary.600' : 'neutral.400',
                    bgcolor: isCurrent ? 'accent.600' : done ? 'primary.600' : 'background.surface',
                    color: isCurrent || done ? 'common.white' : 'text.primary',
                    boxShadow: isCurrent ? '0 0 0 4px var(--joy-palette-accent-100)' : 'none',
                    position: 'relative',
                  }}
                >
                  {done ? <CheckMark color="inherit" /> : i + 1}
                </Box>
                <Typography
                  level="body-xs"
                  component="span"
                  sx={{
                    fontWeight: isCurrent ? 'lg' : 'md',
                    color: isCurrent ? 'text.primary' : 'text.secondary',
                    textDecoration: isCurrent ? 'underline' : 'none',
                    textUnderlineOffset: '4px',
                    textDecorationThickness: '2px',
                    display: 'block',
                    textAlign: 'center',
                    // On a phone only the current step's name shows; the others stay in the button's name.
                    ...(isCurrent ? {} : { '@media (max-width: 599.95px)': visuallyHidden }),
                  }}
                >
                  {step.title}
                  {done ? (
                    <Box component="span" sx={visuallyHidden}>
                      , visited
                    </Box>
                  ) : null}
                </Typography>
              </Box>
            </Box>
          );
        })}
      </Box>
    </Box>
  );
}
