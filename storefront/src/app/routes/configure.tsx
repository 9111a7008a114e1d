import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import { PageLoading } from 'src/components/PageLoading';
import { useCatalog } from 'src/features/configurator/api/get-catalog';
import { Configurator } from 'src/features/configurator/components/Configurator';

export function Component() {
  const catalog = useCatalog();
  if (catalog.isPending) return <PageLoading label="Loading the shop’s price book…" />;
  if (catalog.isError)
    return (
      <Alert color="danger" variant="soft" sx={{ maxWidth: 640, mx: 'auto' }} endDecorator={<Button size="sm" onClick={() => void catalog.refetch()}>Try again</Button>}>
        The price book could not be loaded: {catalog.error.message}
      </Alert>
    );
  return <Configurator catalog={catalog.data} />;
}
