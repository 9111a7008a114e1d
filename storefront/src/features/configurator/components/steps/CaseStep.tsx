import Alert from '@mui/joy/Alert';
import Typography from '@mui/joy/Typography';
import type { CaseKind } from '@loomwright/shared';
import { formatMoney } from 'src/lib/format';
import { ChoiceCards } from '../ChoiceCards';
import { CautionIcon } from '../icons';
import { StepHeading } from '../StepHeading';
import type { StepProps } from './step-props';

const kindWords: Record<CaseKind, string> = {
  hard_case: 'Hard case',
  road_case: 'Road case',
  soft_bag: 'Soft bag',
};

export default function CaseStep({ catalog, configuration, update }: StepProps) {
  const surface = catalog.surfaces.find((s) => s.id === configuration.surfaceId);
  const chosen = catalog.cases.find((c) => c.id === configuration.caseId);
  // Before a surface is chosen every case is open; the fit is checked once there is a surface.
  const fits = (fitsSurfaceIds: string[]) =>
    !configuration.surfaceId || fitsSurfaceIds.length === 0 || fitsSurfaceIds.includes(configuration.surfaceId);
  return (
    <>
      <StepHeading title="Choose how it travels">
        Every board goes back to you in a case sized for {surface ? `the ${surface.name}` : 'your surface'}. A loaded board is heavy and its
        jacks stick out: a rigid case protects both.
      </StepHeading>
      <ChoiceCards
        name="case"
        label="Case"
        value={configuration.caseId}
        onChange={(caseId) => update((c) => ({ ...c, caseId }))}
        choices={catalog.cases.map((k) => ({
          value: k.id,
          title: k.name,
          figure: formatMoney(k.price, catalog.currency),
          disabled: !fits(k.fitsSurfaceIds),
          details: (
            <>
              <Typography level="body-sm" sx={{ fontWeight: 'md' }}>
                {kindWords[k.kind]}
                {k.notRecommended ? ' · not recommended for a loaded board' : ''}
                {!fits(k.fitsSurfaceIds) ? ' · does not fit this surface' : ''}
              </Typography>
              <Typography level="body-sm" sx={{ mt: 0.5 }}>
                {k.description}
              </Typography>
              {k.caution ? (
                <Typography
                  level="body-sm"
                  startDecorator={<CautionIcon />}
                  sx={{ mt: 1, color: 'warning.700', fontWeight: 'md', alignItems: 'flex-start' }}
                >
                  {k.caution}
                </Typography>
              ) : null}
            </>
          ),
        }))}
      />
      {chosen?.notRecommended ? (
        <Alert color="warning" variant="soft" startDecorator={<CautionIcon />} sx={{ mt: 3, alignItems: 'flex-start' }}>
          <div>
            <Typography level="title-sm" component="p">
              The shop’s caution on a soft bag
            </Typography>
            <Typography level="body-sm">
              {chosen.caution ?? 'A soft bag does not protect a loaded board in transit.'} You can still choose it; we will note it on the
              build.
            </Typography>
          </div>
        </Alert>
      ) : null}
      {chosen && !fits(chosen.fitsSurfaceIds) ? (
        <Alert color="danger" variant="soft" startDecorator={<CautionIcon />} sx={{ mt: 3 }}>
          {chosen.name} does not fit the surface you chose. Pick another case, or go back and change the surface.
        </Alert>
      ) : null}
    </>
  );
}
