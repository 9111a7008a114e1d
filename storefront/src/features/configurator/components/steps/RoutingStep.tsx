import Alert from '@mui/joy/Alert';
import Box from '@mui/joy/Box';
import Button from '@mui/joy/Button';
import Checkbox from '@mui/joy/Checkbox';
import Typography from '@mui/joy/Typography';
import { ChoiceCards } from '../ChoiceCards';
import { InfoIcon } from '../icons';
import { StepHeading } from '../StepHeading';
import { pedalsFromCount } from '../../lib/configuration';
import { SwitcherPowerFields } from '../SwitcherPowerFields';
import type { StepProps } from './step-props';

export default function RoutingStep({ configuration, update, goToStep, live }: StepProps) {
  const switcher = configuration.routing.mode === 'switcher';
  const pedals = configuration.pedals ?? [];
  const loops = pedals.filter((p) => p.inLoop).length;

  const chooseRouting = (mode: string) =>
    update((c) => {
      if (mode === 'switcher') {
        const list = c.pedals ?? pedalsFromCount(c.pedalCount ?? 0);
        const next = { ...c, routing: { ...c.routing, mode: 'switcher' as const }, pedals: list };
        delete next.pedalCount;
        return next;
      }
      // A serial board has no loops, so nobody stays "in a loop", and no switcher.
      return { ...c, routing: { mode: 'serial' as const }, pedals: c.pedals?.map((p) => ({ ...p, inLoop: false })) };
    });

  const setInLoop = (index: number, inLoop: boolean) =>
    update((c) => ({ ...c, pedals: c.pedals?.map((p, i) => (i === index ? { ...p, inLoop } : p)) }));

  return (
    <>
      <StepHeading title="How the signal runs">
        Serial means one pedal after another, each one always in the chain. A <b>loop switcher</b> is a footswitch unit with numbered loops:
        each pedal in a loop can be switched in or out, alone or in saved presets. You supply the switcher; we wire both ends of every loop,
        so each pedal in a loop takes more bench time.
      </StepHeading>
      <ChoiceCards
        name="routing"
        label="Routing"
        value={configuration.routing.mode}
        onChange={chooseRouting}
        columns={{ xs: 1, sm: 2 }}
        choices={[
          {
            value: 'serial',
            title: 'Serial',
            details: <Typography level="body-sm">Simplest and quickest to build. You switch each pedal on its own footswitch.</Typography>,
          },
          {
            value: 'switcher',
            title: 'Loop switcher (yours)',
            details: (
              <Typography level="body-sm">
                Pedals you choose sit in the switcher’s loops; the rest stay in the main chain. The switcher takes a power lead too.
              </Typography>
            ),
          },
        ]}
      />
      {switcher ? (
        <Box component="fieldset" sx={{ border: 0, p: 0, m: 0, mt: 4 }}>
          <Typography component="legend" level="title-lg">
            Which pedals sit in loops?
          </Typography>
          <Typography level="body-sm" sx={{ mb: 2 }}>
            {loops} of {pedals.length} in loops. A tuner, a wah or a volume pedal usually stays in the main chain.
          </Typography>
          <Box sx={{ display: 'grid', gap: 1, gridTemplateColumns: { xs: '1fr', sm: '1fr 1fr' } }}>
            {pedals.map((p, i) => (
              <Checkbox
                key={`${p.name}-${i}`}
                label={`${i + 1}. ${p.name}`}
                checked={p.inLoop}
                onChange={(e) => setInLoop(i, e.target.checked)}
                variant="outlined"
                sx={{ p: 1, borderRadius: 'md', border: '1px solid', borderColor: p.inLoop ? 'primary.500' : 'neutral.200' }}
              />
            ))}
          </Box>
          {pedals.length === 0 ? (
            <Alert variant="soft" color="neutral" startDecorator={<InfoIcon />} sx={{ mt: 2, alignItems: 'flex-start' }}>
              <div>
                No pedals yet: list them first, then choose which sit in loops.{' '}
                <Button size="sm" variant="plain" onClick={() => goToStep('pedals')} sx={{ p: 0, minHeight: 0, verticalAlign: 'baseline' }}>
                  Add your pedals on the Pedals step
                </Button>
              </div>
            </Alert>
          ) : pedals.every((p) => p.name.startsWith('Pedal ')) ? (
            <Alert variant="soft" color="neutral" startDecorator={<InfoIcon />} sx={{ mt: 2, alignItems: 'flex-start' }}>
              <div>
                We turned your pedal count into a list so you can choose loops.{' '}
                <Button size="sm" variant="plain" onClick={() => goToStep('pedals')} sx={{ p: 0, minHeight: 0, verticalAlign: 'baseline' }}>
                  Name them on the Pedals step
                </Button>
              </div>
            </Alert>
          ) : null}
        </Box>
      ) : null}
      {switcher && !pedals.some((p) => p.kind === 'switcher') ? (
        <SwitcherPowerFields configuration={configuration} update={update} />
      ) : null}
      {live.estimate?.checks?.cableSchedule ? (
        <Typography level="body-sm" sx={{ mt: 3, fontVariantNumeric: 'tabular-nums' }}>
          This routing takes {live.estimate.checks.cableSchedule.patchCount} patch cables ({live.estimate.checks.cableSchedule.plugCount}{' '}
          plugs, about {Number(live.estimate.checks.cableSchedule.cableFeet)} ft of cable with spare) and{' '}
          {live.estimate.checks.cableSchedule.barrelPlugCount} power leads.
        </Typography>
      ) : null}
    </>
  );
}
