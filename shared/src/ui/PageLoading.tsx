import CircularProgress from '@mui/joy/CircularProgress';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';

export function PageLoading({ label = 'Loading…' }: { label?: string }) {
  return (
    <Stack direction="row" gap={2} alignItems="center" sx={{ py: 6, justifyContent: 'center' }} role="status">
      {/* The spinner's root has role="progressbar", which would need a name of its own; the words beside it say it. */}
      <CircularProgress size="sm" aria-hidden />
      <Typography>{label}</Typography>
    </Stack>
  );
}
