import Button from '@mui/joy/Button';
import { lazy, useDeferredValue } from 'react';
import { useHydrated } from 'src/app/hydration';
import { useShopVoiceWaiting } from 'src/app/shop-voice';
import { LateAlert, preloadLateAlert, useLateAlertReady } from 'src/components/LateAlert';
import { useCatalog } from 'src/features/configurator/api/get-catalog';
import { Configurator } from 'src/features/configurator/components/Configurator';
import type { KeepSlot } from 'src/features/configurator/components/steps/step-props';
import { readConfigurationDraft } from 'src/lib/configuration-draft';

// Saving, sharing and e-mailing show on the Review step only, so they load with it, not with the first screen.
const KeepConfiguration = lazy(() => import('src/features/saved-configurations/components/KeepConfiguration'));

const keepSlot: KeepSlot = (configuration, ready) => <KeepConfiguration configuration={configuration} ready={ready} />;

// A restored draft is announced in an Alert: fetch it while the price book loads.
const draftWaiting = readConfigurationDraft() !== undefined;
if (draftWaiting) preloadLateAlert();

export function Component() {
  const catalog = useCatalog();
  // The figures wait for the shop's voice (its currency and locale), as every page's do.
  const { shop, waiting: voiceWaiting } = useShopVoiceWaiting();
  const hydrated = useHydrated();
  // The notice comes with the configurator's first draw, not after it (where it would move the cards).
  const alertReady = useLateAlertReady(draftWaiting);
  // The price book's arrival is drawn in a deferred render (yielding every few ms) instead of in the
  // query update's one blocking task: the configurator's first step is the heaviest render of the page.
  const priceBook = useDeferredValue(catalog.data);
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
  const ready = hydrated && alertReady && priceBook !== undefined && !voiceWaiting;
  return (
    <Configurator
      catalog={ready ? priceBook : undefined}
      shop={shop.data}
      loadingLabel={catalog.isPending || !priceBook || !hydrated ? 'Loading the shop’s price book…' : 'Loading the shop’s settings…'}
      keep={keepSlot}
    />
  );
}
