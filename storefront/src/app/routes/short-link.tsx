import { ApiErrorAlert } from '@loomwright/shared/ui';
import Button from '@mui/joy/Button';
import Stack from '@mui/joy/Stack';
import { Link as RouterLink, Navigate, useParams } from 'react-router';
import { CONFIGURATION_PARAM, encodeConfiguration } from '@loomwright/shared';
import { PageLoading } from 'src/components/PageLoading';
import { useShortLink } from 'src/features/saved-configurations/api/open-short-link';

/** /c/<code>: a short link someone shared opens its configuration on the Review step. */
export function Component() {
  const { code = '' } = useParams();
  const link = useShortLink(code);
  if (link.isPending) return <PageLoading label="Opening the shared board…" />;
  if (link.isError)
    return (
      <Stack gap={2} sx={{ maxWidth: 640, mx: 'auto' }}>
        <ApiErrorAlert error={link.error} />
        <Button component={RouterLink} to="/configure" sx={{ alignSelf: 'flex-start' }}>
          Configure a board
        </Button>
      </Stack>
    );
  const params = new URLSearchParams({ step: 'review', [CONFIGURATION_PARAM]: encodeConfiguration(link.data.configuration) });
  return <Navigate to={`/configure?${params.toString()}`} replace />;
}
