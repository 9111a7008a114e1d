import Button from '@mui/joy/Button';
import { lazy, useDeferredValue } from 'react';
import { LateAlert, preloadLateAlert } from 'src/components/LateAlert';
import { PageLoading } from 'src/components/PageLoading';
import { useCatalog } from 'src/features/configurator/api/get-catalog';
import { Configurator } from 'src/features/configurator/components/Configurator';
import { readConfigurationDraft } from 'src/lib/configuration-draft';

// Saving, sharing and e-mailing show on the Review step only, so they load with it, not with the first screen.
const KeepConfiguration = lazy(() => import('src/features/saved-configurations/components/KeepConfiguration'));

// A restored draft is announced in an Alert: fetch it while the price book loads.
if (readConfigurationDraft()) preloadLateAlert();

export function Component() {
  const catalog = useCatalog();
  // The price book's arrival is drawn in a deferred render (yielding every few ms) instead of in the
  // query update's one blocking task: the configurator's first step is the heaviest render of the page.
  const priceBook = useDeferredValue(catalog.data);
  if (catalog.isPending || (catalog.isSuccess && !priceBook)) return <PageLoading label="Loading the shop’s price book…" />;
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
  return (
    <Configurator
      catalog={priceBook ?? catalog.data}
      keep={(configuration, ready) => <KeepConfiguration configuration={configuration} ready={ready} />}
    />
  );
}
