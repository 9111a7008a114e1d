import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { MailLogTable } from 'src/features/mail-log/components/MailLogTable';

export function Component() {
  return (
    <Stack gap={2} sx={{ maxWidth: 1280 }}>
      <Typography level="h2" component="h1">
        Mail log
      </Typography>
      <Typography level="body-sm">
        Every message the shop sends, newest first. A message that could not be delivered is retried on its own, waiting longer each time;
        one marked “Not sent” needs a look, and the owner can send any message again.
      </Typography>
      <MailLogTable />
    </Stack>
  );
}
