import Button from '@mui/joy/Button';
import { lazy, useDeferredValue } from 'react';
import { useSearchParams } from 'react-router';
import { useHydrated } from 'src/app/hydration';
import { ShopVoice } from 'src/app/shop-voice';
import { LateAlert, preloadLateAlert, useLateAlertReady } from 'src/components/LateAlert';
import { useCatalog } from 'src/features/configurator/api/get-catalog';
import { Configurator, ConfiguratorFrame } from 'src/features/configurator/components/Configurator';
import { isStepId } from 'src/features/configurator/lib/steps';
import { readConfigurationDraft } from 'src/lib/configuration-draft';

// Saving, sharing and e-mailing show on the Review step only, so they load with it, not with the first screen.
const KeepConfiguration = lazy(() => import('src/features/saved-configurations/components/KeepConfiguration'));

// A restored draft is announced in an Alert: fetch it while the price book loads.
const draftWaiting = readConfigurationDraft() !== undefined;
if (draftWaiting) preloadLateAlert();

export function Component() {
  const catalog = useCatalog();
  const hydrated = useHydrated();
  // The notice comes with the configurator's first draw, not after it (where it would move the cards).
  const alertReady = useLateAlertReady(draftWaiting);
  const [search, setSearch] = useSearchParams();
  const stepParam = search.get('step');
  const frame = (label: string) => (
    <ConfiguratorFrame
      step={isStepId(stepParam) ? stepParam : 'surface'}
      onSelect={(step) =>
        setSearch((prev) => {
          const next = new URLSearchParams(prev);
          next.set('step', step);
          return next;
        })
      }
      label={label}
    />
  );
  // The price book's arrival is drawn in a deferred render (yielding every few ms) instead of in the
  // query update's one blocking task: the configurator's first step is the heaviest render of the page.
  const priceBook = useDeferredValue(catalog.data);
  if (!hydrated || !alertReady || catalog.isPending || (catalog.isSuccess && !priceBook)) return frame('Loading the shop’s price book…');
  if (catalog.isError)
    return (
      <LateAlert
        color="danger"
        variant="soft"
        sx={{ maxWidth: 640, mx: 'auto' }}
        endDecorator={
          <Button size="sm" onClick={() => void catalog.refetch()}>
            Try again
          </Button>
        }
      >
        The price book could not be loaded: {catalog.error.message}
      </LateAlert>
    );
  // The figures wait for the shop's voice (its currency and locale); the frame stays meanwhile.
  return (
    <ShopVoice fallback={frame('Loading the shop’s settings…')}>
      <Configurator
        catalog={priceBook ?? catalog.data}
        keep={(configuration, ready) => <KeepConfiguration configuration={configuration} ready={ready} />}
      />
    </ShopVoice>
  );
}
