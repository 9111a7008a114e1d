import Box from '@mui/joy/Box';
import Card from '@mui/joy/Card';
import Checkbox from '@mui/joy/Checkbox';
import Typography from '@mui/joy/Typography';
import visuallyHidden from '@mui/utils/visuallyHidden';
import { formatHours, formatMoneyRange } from 'src/lib/format';
import { extraEffect } from '../../lib/level-compare';
import { functionHint } from '../../lib/function-hints';
import { CheckIcon } from '../icons';
import { StepHeading } from '../StepHeading';
import type { StepProps } from './step-props';

/** "+$509–$1,144" or "−$80–$100": a price change in words, with its sign. */
function change(low: string, high: string, currency: string): string {
  const falling = low.startsWith('-') && high.startsWith('-');
  const abs = (v: string) => v.replace(/^-/, '');
  return `${falling ? '−' : '+'}${formatMoneyRange(abs(low), abs(high), currency)}`;
}

export default function ExtrasStep({ catalog, configuration, update, live }: StepProps) {
  const now = live.isCurrent ? live.estimate : undefined;
  const levelName = (code: string) => catalog.levels.find((l) => l.code === code)?.name.toLowerCase() ?? code;
  const chosen = new Set(configuration.functions);
  const toggle = (code: string, on: boolean) =>
    update((c) => ({ ...c, functions: on ? [...c.functions.filter((f) => f !== code), code] : c.functions.filter((f) => f !== code) }));
  return (
    <>
      <StepHeading title="Extras">
        Functions are wiring jobs beyond the plain chain. Each adds bench time, about an hour each; choose none if your board goes straight
        into one amp.
      </StepHeading>
      <Box component="fieldset" sx={{ border: 0, p: 0, m: 0 }}>
        <Typography component="legend" sx={visuallyHidden}>
          Functions to add
        </Typography>
        <Box sx={{ display: 'grid', gap: 2, gridTemplateColumns: { xs: '1fr', md: '1fr 1fr' } }}>
          {catalog.functions.map((f) => {
            const on = chosen.has(f.code);
            const hint = functionHint(f.code, f.name);
            const effect = now ? extraEffect(configuration, f.code, catalog, now) : null;
            return (
              <Card
                key={f.id}
                variant="outlined"
                sx={{
                  borderWidth: 2,
                  borderColor: on ? 'primary.600' : 'neutral.200',
                  bgcolor: on ? 'primary.50' : 'background.surface',
                  '&:has(input:focus-visible)': { outline: '3px solid', outlineColor: 'primary.500', outlineOffset: '2px' },
                }}
              >
                <Checkbox
                  overlay
                  checked={on}
                  onChange={(e) => toggle(f.code, e.target.checked)}
                  label={
                    <Typography level="title-md" component="span">
                      {f.name}
                    </Typography>
                  }
                  slotProps={{ input: { 'aria-describedby': `fn-${f.id}` } }}
                />
                <Box id={`fn-${f.id}`}>
                  <Typography level="body-sm" sx={{ fontWeight: 'md', fontVariantNumeric: 'tabular-nums' }}>
                    +{formatHours(f.laborHours)} bench time
                    {f.extraPatchCables ? ` · ${f.extraPatchCables} more patch cable${f.extraPatchCables > 1 ? 's' : ''}` : ''}
                    {on ? (
                      <Typography component="span" startDecorator={<CheckIcon />} sx={{ ml: 1, color: 'primary.700', fontWeight: 'lg' }}>
                        Added
                      </Typography>
                    ) : null}
                  </Typography>
                  {effect ? (
                    <Typography
                      level="body-sm"
                      data-testid={`extra-effect-${f.code}`}
                      sx={{
                        mt: 0.5,
                        fontVariantNumeric: 'tabular-nums',
                        fontWeight: effect.raises || effect.lowers ? 'lg' : 'md',
                        color: effect.raises ? 'warning.800' : 'text.secondary',
                      }}
                    >
                      {effect.raises
                        ? `Adding it raises the minimum builder level to ${levelName(effect.minimumAfter)}: ${change(effect.deltaLow, effect.deltaHigh, catalog.currency)} in all, the higher rate included.`
                        : effect.lowers
                          ? `Removing it lowers the minimum builder level to ${levelName(effect.minimumAfter)} (${change(effect.deltaLow, effect.deltaHigh, catalog.currency)} at your chosen level; the Builder step offers the lower level back).`
                          : `${on ? 'Removing' : 'Adding'} it: ${change(effect.deltaLow, effect.deltaHigh, catalog.currency)} in all.`}
                    </Typography>
                  ) : null}
                  <Typography level="body-sm" sx={{ mt: 0.5 }}>
                    {f.description}
                  </Typography>
                  {hint && hint !== f.description ? (
                    <Typography level="body-xs" sx={{ mt: 0.5 }}>
                      {hint}
                    </Typography>
                  ) : null}
                </Box>
              </Card>
            );
          })}
        </Box>
      </Box>
    </>
  );
}
