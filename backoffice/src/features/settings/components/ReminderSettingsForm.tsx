import Button from '@mui/joy/Button';
import FormControl from '@mui/joy/FormControl';
import FormHelperText from '@mui/joy/FormHelperText';
import FormLabel from '@mui/joy/FormLabel';
import Input from '@mui/joy/Input';
import Stack from '@mui/joy/Stack';
import Switch from '@mui/joy/Switch';
import Typography from '@mui/joy/Typography';
import {
  reminderSettingsFormSchema,
  type ReminderSettingsFormInput,
  type ReminderSettingsView,
  type UpdateReminderSettingsInput,
} from '@loomwright/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect } from 'react';
import { Controller, useForm, type FieldPath } from 'react-hook-form';
import { setServerFieldErrors } from '@loomwright/shared/ui';
import { ErrorNote } from 'src/components/ErrorNote';
import { PageLoading } from 'src/components/PageLoading';
import { useReminderSettings } from '../api/get-reminder-settings';
import { useUpdateReminderSettings } from '../api/update-reminder-settings';

type Row = {
  kind: keyof ReminderSettingsView;
  field: string;
  title: string;
  what: string;
  figure: string;
  unit: string;
};

/** What each reminder does, in the shop's words; the figure is the one setting beside its switch. */
const rows: Row[] = [
  {
    kind: 'shipBy',
    field: 'daysBefore',
    title: 'Pedals due, no tracking number',
    what: 'E-mails the player, and the build’s builder, when the ship-by day is near and the player has not added a tracking number.',
    figure: 'Days before the ship-by day',
    unit: 'days',
  },
  {
    kind: 'balanceUnpaid',
    field: 'daysAfterReady',
    title: 'Balance still due',
    what: 'E-mails the player the balance and the link to pay it, once, when the board has been ready this long.',
    figure: 'Days after the board is ready',
    unit: 'days',
  },
  {
    kind: 'checkoutAbandoned',
    field: 'hoursAfter',
    title: 'Checkout not finished',
    what: 'E-mails the player once when they opened the deposit or balance checkout and did not pay.',
    figure: 'Hours after the checkout was opened',
    unit: 'hours',
  },
  {
    kind: 'requestExpiry',
    field: 'daysUnpaid',
    title: 'Unpaid requests expire',
    what: 'Closes a request whose deposit was never paid, records it in the history and tells the player. A request holds no bench time, so none is released.',
    figure: 'Days a request waits for its deposit',
    unit: 'days',
  },
];

/** Each reminder's group of fields: a server's problem with any of them stands under that field. */
const REMINDER_FIELDS = ['shipBy', 'balanceUnpaid', 'checkoutAbandoned', 'requestExpiry'] as const satisfies ReadonlyArray<
  keyof ReminderSettingsView
>;

const asForm = (view: ReminderSettingsView): ReminderSettingsFormInput => ({
  shipBy: { enabled: view.shipBy.enabled, daysBefore: String(view.shipBy.daysBefore) },
  balanceUnpaid: { enabled: view.balanceUnpaid.enabled, daysAfterReady: String(view.balanceUnpaid.daysAfterReady) },
  checkoutAbandoned: { enabled: view.checkoutAbandoned.enabled, hoursAfter: String(view.checkoutAbandoned.hoursAfter) },
  requestExpiry: { enabled: view.requestExpiry.enabled, daysUnpaid: String(view.requestExpiry.daysUnpaid) },
});

/** Settings → Reminders: each reminder on or off and when it goes out (GET/PATCH /api/settings/reminders). */
export function ReminderSettingsForm({ canEdit, onSaved }: { canEdit: boolean; onSaved: (message: string) => void }) {
  const settings = useReminderSettings();
  const update = useUpdateReminderSettings();
  const form = useForm<ReminderSettingsFormInput, unknown, UpdateReminderSettingsInput>({
    resolver: zodResolver(reminderSettingsFormSchema) as never,
  });
  // The saved settings fill the form each time they arrive (react-hook-form's reset is stable).
  const { reset } = form;
  useEffect(() => {
    if (settings.data) reset(asForm(settings.data));
  }, [settings.data, reset]);
  if (settings.isPending) return <PageLoading />;
  if (settings.error) return <ErrorNote error={settings.error} />;
  const errors = form.formState.errors as Record<string, Record<string, { message?: string }> | undefined>;
  return (
    <Stack
      component="form"
      gap={2}
      noValidate
      aria-label="Reminders"
      onSubmit={form.handleSubmit((values) =>
        update.mutate(values, {
          onSuccess: () => onSaved('Reminder settings saved.'),
          onError: (error) => setServerFieldErrors(error, form.setError, REMINDER_FIELDS),
        }),
      )}
    >
      <Typography level="body-sm">
        The job queue checks every 15 minutes and sends each reminder once; every one is listed in the Mail log. Nothing is sent once the
        tracking number or the payment is in.
      </Typography>
      {rows.map((row) => {
        const name = `${row.kind}.${row.field}` as FieldPath<ReminderSettingsFormInput>;
        const error = errors[row.kind]?.[row.field]?.message;
        return (
          <Stack key={row.kind} direction={{ xs: 'column', sm: 'row' }} gap={2} alignItems={{ sm: 'flex-start' }}>
            <Stack sx={{ flex: 2, minWidth: 240 }} gap={0.5}>
              <Controller
                control={form.control}
                name={`${row.kind}.enabled` as FieldPath<ReminderSettingsFormInput>}
                render={({ field }) => (
                  <Typography
                    component="label"
                    level="title-sm"
                    startDecorator={
                      <Switch
                        checked={Boolean(field.value)}
                        disabled={!canEdit}
                        onChange={(event) => field.onChange(event.target.checked)}
                      />
                    }
                  >
                    {row.title}: {field.value ? 'on' : 'off'}
                  </Typography>
                )}
              />
              <Typography level="body-xs">{row.what}</Typography>
            </Stack>
            <FormControl error={Boolean(error)} disabled={!canEdit} sx={{ flex: 1, minWidth: 200 }}>
              <FormLabel>{row.figure}</FormLabel>
              <Input {...form.register(name)} inputMode="numeric" endDecorator={row.unit} sx={{ maxWidth: 180 }} />
              <FormHelperText>{error ?? ' '}</FormHelperText>
            </FormControl>
          </Stack>
        );
      })}
      <ErrorNote error={update.error} fields={REMINDER_FIELDS} />
      {canEdit && (
        <Stack direction="row">
          <Button type="submit" loading={update.isPending}>
            Save reminders
          </Button>
        </Stack>
      )}
    </Stack>
  );
}
