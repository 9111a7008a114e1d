import Card from '@mui/joy/Card';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { useHealth } from 'src/features/shop/api/get-health';
import { useShop } from 'src/features/shop/api/get-shop';

export function Component() {
  const shop = useShop();
  const health = useHealth();
  return (
    <Stack gap={2} sx={{ maxWidth: 880 }}>
      <Typography level="h2" component="h1">{shop.data?.name ?? 'The shop'}</Typography>
      <Card variant="outlined">
        <Typography level="title-md">System</Typography>
        <Typography>
          {health.data?.db === 'up'
            ? 'The API and the database are answering.'
            : health.isError
              ? 'The database is not answering; bookings cannot be changed until it is back.'
              : 'Checking…'}
        </Typography>
      </Card>
    </Stack>
  );
}
