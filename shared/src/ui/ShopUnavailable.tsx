import Button from '@mui/joy/Button';
import Sheet from '@mui/joy/Sheet';
import Typography from '@mui/joy/Typography';
import { useQueryClient } from '@tanstack/react-query';
import { shopUnavailableMessage } from '../api-types';
import { hasErrorCode } from '../api-client';

/**
 * Shown where the app cannot tell who is signed in because the shop is not answering (a 503 while
 * its database is down, or no connection). It never signs the person out: the "who is signed in"
 * query keeps asking by itself (see meQueryOptions) and the page comes back when the shop does.
 */
export function ShopUnavailable({ error }: { error: Error }) {
  const queryClient = useQueryClient();
  const words = hasErrorCode(error, 'shop_unavailable') ? shopUnavailableMessage : error.message;
  // Everything that failed while the shop was away, not only "who is signed in".
  const retry = () => void queryClient.refetchQueries({ predicate: (query) => query.state.status === 'error' });
  return (
    <Sheet variant="soft" color="warning" role="alert" sx={{ maxWidth: 560, mx: 'auto', my: 6, p: 3, borderRadius: 'md' }}>
      <Typography level="title-lg" component="h1">
        The shop is briefly unavailable
      </Typography>
      <Typography sx={{ my: 1.5 }}>{words} This page tries again by itself.</Typography>
      <Button variant="outlined" color="neutral" onClick={retry}>
        Try again now
      </Button>
    </Sheet>
  );
}
