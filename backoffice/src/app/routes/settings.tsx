import Card from '@mui/joy/Card';
import Link from '@mui/joy/Link';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { useState } from 'react';
import { Link as RouterLink } from 'react-router';
import { ErrorNote } from 'src/components/ErrorNote';
import { Notice } from 'src/components/Notice';
import { PageHeader } from 'src/components/PageHeader';
import { PageLoading } from 'src/components/PageLoading';
import { useMe } from 'src/features/auth/api/get-me';
import { useSettings } from 'src/features/settings/api/get-settings';
import { ClosuresList } from 'src/features/settings/components/ClosuresList';
import { HolidaysList } from 'src/features/settings/components/HolidaysList';
import { ReminderSettingsForm } from 'src/features/settings/components/ReminderSettingsForm';
import { ShopDetailsForm } from 'src/features/settings/components/ShopDetailsForm';

export function Component() {
  const settings = useSettings();
  const me = useMe();
  const canEdit = me.data?.role === 'owner';
  const [notice, setNotice] = useState<string | null>(null);
  return (
    <>
      <PageHeader title="Settings" hint={canEdit ? undefined : 'Only the owner changes these; you can read them.'} />
      <ErrorNote error={settings.error} />
      {settings.isPending && <PageLoading />}
      {settings.data && (
        <Stack gap={2} sx={{ maxWidth: 980 }}>
          <Card variant="outlined">
            <Typography level="title-md" component="h2">
              Shop details
            </Typography>
            <ShopDetailsForm settings={settings.data} canEdit={canEdit} onSaved={setNotice} />
          </Card>
          <Card variant="outlined">
            <Typography level="title-md" component="h2">
              Deposit policy
            </Typography>
            <Typography level="body-sm">
              The deposit (a share of the estimate with a minimum) lives in the price book, so every quote keeps the policy it was priced
              with.{' '}
              <Link component={RouterLink} to="/price-book">
                Open the price book
              </Link>
              .
            </Typography>
          </Card>
          <Card variant="outlined">
            <Typography level="title-md" component="h2">
              Closures
            </Typography>
            <ClosuresList settings={settings.data} canEdit={canEdit} onSaved={setNotice} />
          </Card>
          <Card variant="outlined">
            <Typography level="title-md" component="h2">
              Public holidays, next twelve months
            </Typography>
            <HolidaysList settings={settings.data} canEdit={canEdit} onSaved={setNotice} />
          </Card>
          <Card variant="outlined">
            <Typography level="title-md" component="h2">
              Reminders
            </Typography>
            <ReminderSettingsForm canEdit={canEdit} onSaved={setNotice} />
          </Card>
        </Stack>
      )}
      <Notice message={notice} onClose={() => setNotice(null)} />
    </>
  );
}
