import Box from '@mui/joy/Box';
import Card from '@mui/joy/Card';
import Radio from '@mui/joy/Radio';
import RadioGroup from '@mui/joy/RadioGroup';
import Typography from '@mui/joy/Typography';
import type { ReactNode } from 'react';
import { CheckMark } from './CheckMark';

export interface Choice {
  value: string;
  title: string;
  /** The figure that decides, shown big: a price, a rate. */
  figure?: string;
  details?: ReactNode;
  disabled?: boolean;
}

/**
 * A radio group drawn as cards. The chosen card says so three ways — a check mark, the word
 * "Selected" and a heavier border — so colour is never the only signal (WCAG 2.2 SC 1.4.1).
 */
export function ChoiceCards({
  name,
  label,
  value,
  choices,
  onChange,
  columns = { xs: 1, sm: 2, lg: 3 },
}: {
  name: string;
  label: string;
  value: string;
  choices: Choice[];
  onChange: (value: string) => void;
  columns?: { xs?: number; sm?: number; md?: number; lg?: number };
}) {
  return (
    <RadioGroup
      name={name}
      aria-label={label}
      value={value}
      onChange={(event) => onChange(event.target.value)}
      sx={{
        display: 'grid',
        gap: 2,
        gridTemplateColumns: Object.fromEntries(Object.entries(columns).map(([bp, n]) => [bp, `repeat(${n}, minmax(0, 1fr))`])),
      }}
    >
      {choices.map((choice) => {
        const selected = choice.value === value;
        const detailsId = `${name}-${choice.value}-details`;
        return (
          <Card
            key={choice.value}
            variant="outlined"
            sx={{
              gap: 1,
              borderWidth: 2,
              borderColor: selected ? 'primary.600' : 'neutral.200',
              bgcolor: selected ? 'primary.50' : 'background.surface',
              boxShadow: selected ? 'sm' : 'none',
              opacity: choice.disabled ? 0.72 : 1,
              '&:has(input:focus-visible)': { outline: '3px solid', outlineColor: 'primary.500', outlineOffset: '2px' },
            }}
          >
            <Radio
              value={choice.value}
              overlay
              disabled={choice.disabled}
              label={
                <Typography level="title-md" component="span">
                  {choice.title}
                </Typography>
              }
              slotProps={{ input: { 'aria-describedby': detailsId }, action: { sx: { borderRadius: 'md' } } }}
              sx={{ alignItems: 'flex-start' }}
            />
            <Box id={detailsId}>
              {/* The badge sits on the figure's line, so it never narrows the title (long names stay on one line). */}
              <Box sx={{ display: 'flex', alignItems: 'center', justifyContent: 'space-between', gap: 1, flexWrap: 'wrap' }}>
                {choice.figure ? (
                  <Typography level="title-lg" sx={{ fontVariantNumeric: 'tabular-nums' }}>
                    {choice.figure}
                  </Typography>
                ) : (
                  <span />
                )}
                <Box
                  aria-hidden={!selected}
                  sx={{
                    display: 'inline-flex',
                    alignItems: 'center',
                    gap: 0.5,
                    px: 1,
                    py: 0.25,
                    borderRadius: 'sm',
                    fontSize: 'sm',
                    fontWeight: 'lg',
                    color: 'primary.700',
                    bgcolor: 'primary.100',
                    visibility: selected ? 'visible' : 'hidden',
                  }}
                >
                  <CheckMark /> Selected
                </Box>
              </Box>
              {choice.details}
            </Box>
          </Card>
        );
      })}
    </RadioGroup>
  );
}
