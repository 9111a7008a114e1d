import CircularProgress from '@mui/joy/CircularProgress';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';

export function PageLoading({ label = 'Loading…' }: { label?: string }) {
  return (
    <Stack direction="row" gap={2} alignItems="center" sx={{ py: 6, justifyContent: 'center' }} role="status">
      <CircularProgress size="sm" />
      <Typography>{label}</Typography>
    </Stack>
  );
}
