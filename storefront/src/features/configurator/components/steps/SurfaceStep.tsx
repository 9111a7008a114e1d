import Typography from '@mui/joy/Typography';
import { formatMoney, formatQuantity } from 'src/lib/format';
import { ChoiceCards } from '../ChoiceCards';
import { StepHeading } from '../StepHeading';
import type { StepProps } from './step-props';

const inches = (mm: number) => formatQuantity(mm / 25.4, undefined, 1);

/** The step's heading and opening words: they depend on nothing the shop sends, so the page's first paint draws them too. */
export function SurfaceStepHeading() {
  return (
    <StepHeading title="Choose the board surface">
      The surface is the deck your pedals are fixed to. Sizes are the usable mounting area, width × depth, as you look down at the board
      from where you stand.
    </StepHeading>
  );
}

export default function SurfaceStep({ catalog, configuration, update }: StepProps) {
  const surfaces = [...catalog.surfaces].sort((a, b) => a.widthMm * a.depthMm - b.widthMm * b.depthMm);
  return (
    <>
      <SurfaceStepHeading />
      <ChoiceCards
        name="surface"
        label="Board surface"
        value={configuration.surfaceId}
        onChange={(surfaceId) => update((c) => ({ ...c, surfaceId }))}
        choices={surfaces.map((s) => ({
          value: s.id,
          title: s.name,
          figure: formatMoney(s.price, catalog.currency),
          details: (
            <>
              <Typography level="body-sm" sx={{ fontVariantNumeric: 'tabular-nums', fontWeight: 'md' }}>
                {s.widthMm} × {s.depthMm} mm ({inches(s.widthMm)} × {inches(s.depthMm)} in){s.custom ? ' · made to order' : ''}
              </Typography>
              <Typography level="body-sm" sx={{ mt: 0.5 }}>
                {s.description}
              </Typography>
            </>
          ),
        }))}
      />
    </>
  );
}
