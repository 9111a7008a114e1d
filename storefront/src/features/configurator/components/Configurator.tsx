import Box from '@mui/joy/Box';
import Button from '@mui/joy/Button';
import Typography from '@mui/joy/Typography';
import { lazy, memo, Suspense, useCallback, useEffect, useRef, type ComponentType } from 'react';
import type { Catalog, ShopProfile } from '@loomwright/shared';
import { ShopVoiceProvider } from '@loomwright/shared/ui';
import { LateAlert } from 'src/components/LateAlert';
import { PageLoading } from 'src/components/PageLoading';
import { useConfiguration } from '../hooks/use-configuration';
import { useLiveEstimate } from '../hooks/use-live-estimate';
import { higherLevel } from '../lib/configuration';
import { configuratorSteps, type StepId } from '../lib/steps';
import { EstimatePanel } from './EstimatePanel';
import SurfaceStep, { SurfaceStepHeading } from './steps/SurfaceStep';
import { StepNotice } from './StepHeading';
import { StepProgress } from './StepProgress';
import type { KeepSlot, StepProps } from './steps/step-props';
import { formatMoment } from 'src/lib/format';

// Each later step is its own chunk (the form library arrives with the Pedals step). The Surface
// step, where every new configuration starts, comes with this screen: waiting for it would show
// the step's loading line first and then push the step navigation down when the step arrives.
const stepComponents: Record<StepId, ComponentType<StepProps>> = {
  surface: SurfaceStep,
  case: lazy(() => import('./steps/CaseStep')),
  pedals: lazy(() => import('./steps/PedalsStep')),
  routing: lazy(() => import('./steps/RoutingStep')),
  extras: lazy(() => import('./steps/ExtrasStep')),
  builder: lazy(() => import('./steps/BuilderStep')),
  review: lazy(() => import('./steps/ReviewStep')),
};

const layout = {
  maxWidth: 1280,
  mx: 'auto',
  display: 'grid',
  gap: { xs: 3, md: 4 },
  gridTemplateColumns: { xs: 'minmax(0, 1fr)', md: 'minmax(0, 1fr) 320px', lg: 'minmax(0, 1fr) 360px' },
  alignItems: 'start',
  pb: { xs: 16, md: 0 },
} as const;

const PageHeading = () => (
  <Typography level="h1" sx={{ fontSize: { xs: 'xl2', md: 'xl3' }, mb: 2 }}>
    Configure your board
  </Typography>
);

/**
 * The configurator. Until `catalog` (the price book, in the shop's voice) is given, it shows its frame:
 * the page's heading, the step bar and, on the Surface step (where every new board starts), the step's
 * heading and opening words, and a `status` line (`loadingLabel`) where the cards will come. None of
 * that depends on the shop's data, so the build prerenders it into configure.html and the browser's
 * first render draws the same: the first paint is the page's largest text. When the price book arrives
 * the same elements stay on screen (the step's content, its navigation and the estimate come in beside
 * them) instead of the page being drawn again.
 * Memoized: the page around it re-renders whenever one of its queries changes state (React draws those
 * updates in one blocking task), and the configurator need not be drawn again unless its props change.
 */
export const Configurator = memo(function Configurator({
  catalog,
  shop,
  keep,
  loadingLabel = 'Loading the shop’s price book…',
}: {
  catalog?: Catalog;
  /** The shop's settings, for the figures' voice (undefined: the default voice). */
  shop?: ShopProfile;
  keep?: KeepSlot;
  loadingLabel?: string;
}) {
  const { configuration, encoded, update, step, goToStep, restoredFrom, startOver, dismissRestored } = useConfiguration(catalog);
  const live = useLiveEstimate(encoded ?? '', step === 'review' ? 'full' : 'panel');
  const guard = useRef<(() => Promise<boolean>) | null>(null);
  const setLeaveGuard = useCallback((g: (() => Promise<boolean>) | null) => {
    guard.current = g;
  }, []);

  // A rig that calls for more experience than the chosen level is priced at the level it needs;
  // the Builder step says why.
  const minimum = live.isCurrent ? live.estimate?.minimumLevel : undefined;
  const level = configuration?.level;
  useEffect(() => {
    if (minimum && level && higherLevel(minimum, level) !== level) {
      update((c) => ({ ...c, level: higherLevel(minimum, c.level) }));
    }
  }, [minimum, level, update]);

  // Moving to a step puts the keyboard and screen reader at its heading.
  const headingRef = useRef<HTMLDivElement>(null);
  const firstRender = useRef(true);
  useEffect(() => {
    if (firstRender.current) {
      firstRender.current = false;
      return;
    }
    const timer = window.setTimeout(() => headingRef.current?.querySelector<HTMLElement>('[data-step-heading]')?.focus(), 50);
    return () => window.clearTimeout(timer);
  }, [step]);

  const index = configuratorSteps.findIndex((s) => s.id === step);
  const previous = configuratorSteps[index - 1];
  const next = configuratorSteps[index + 1];
  const leaveTo = async (target: StepId) => {
    if (guard.current && configuratorSteps.findIndex((s) => s.id === target) > index && !(await guard.current())) return;
    goToStep(target);
  };
  const Step = stepComponents[step];
  // The notice's buttons leave with it: the keyboard and screen reader go on from the step's heading,
  // not from the top of the page.
  const focusStepHeading = () => window.setTimeout(() => headingRef.current?.querySelector<HTMLElement>('[data-step-heading]')?.focus(), 0);
  const opened = catalog && configuration ? { catalog, configuration } : undefined;

  return (
    <Box sx={layout}>
      <Box sx={{ minWidth: 0 }}>
        <PageHeading />
        <StepProgress current={step} onSelect={(s) => void leaveTo(s)} />
        <Box component="section" aria-label={`Step ${index + 1}: ${configuratorSteps[index]?.title}`} ref={headingRef}>
          {opened ? (
            <ShopVoiceProvider profile={shop}>
              {/* Told under the step's opening words (StepHeading), so its arrival moves nothing painted above it. */}
              <StepNotice.Provider
                value={
                  restoredFrom ? (
                    <RestoredNotice
                      savedAt={restoredFrom}
                      onKeep={() => {
                        dismissRestored();
                        focusStepHeading();
                      }}
                      onStartOver={() => {
                        startOver();
                        focusStepHeading();
                      }}
                    />
                  ) : null
                }
              >
                <Suspense fallback={<PageLoading label="Loading this step…" />}>
                  <Step
                    catalog={opened.catalog}
                    configuration={opened.configuration}
                    update={update}
                    live={live}
                    goToStep={goToStep}
                    setLeaveGuard={setLeaveGuard}
                    keep={keep}
                  />
                </Suspense>
              </StepNotice.Provider>
            </ShopVoiceProvider>
          ) : (
            <>
              {step === 'surface' ? <SurfaceStepHeading /> : null}
              <PageLoading label={loadingLabel} />
            </>
          )}
        </Box>
        {opened ? (
          <Box
            component="nav"
            aria-label="Step navigation"
            sx={{ display: 'flex', justifyContent: 'space-between', gap: 2, mt: 5, pt: 3, borderTop: '1px solid', borderColor: 'divider' }}
          >
            {previous ? (
              <Button variant="outlined" color="neutral" onClick={() => void leaveTo(previous.id)}>
                Back: {previous.title}
              </Button>
            ) : (
              <span />
            )}
            {next ? <Button onClick={() => void leaveTo(next.id)}>Next: {next.title}</Button> : null}
          </Box>
        ) : null}
      </Box>
      {opened ? (
        <ShopVoiceProvider profile={shop}>
          <EstimatePanel live={live} catalog={opened.catalog} />
        </ShopVoiceProvider>
      ) : null}
    </Box>
  );
});

/** "We restored the board…": drawn under the shop's voice, which writes the moment it was saved. */
function RestoredNotice({ savedAt, onKeep, onStartOver }: { savedAt: string; onKeep: () => void; onStartOver: () => void }) {
  return (
    <LateAlert
      variant="soft"
      color="neutral"
      role="status"
      sx={{ mt: 2, maxWidth: 640, flexWrap: 'wrap' }}
      endDecorator={
        <Box sx={{ display: 'flex', gap: 1 }}>
          <Button size="sm" variant="plain" onClick={onKeep}>
            Keep it
          </Button>
          <Button size="sm" variant="outlined" onClick={onStartOver}>
            Start over
          </Button>
        </Box>
      }
    >
      We restored the board you were configuring on {formatMoment(savedAt)}.
    </LateAlert>
  );
}
