import { zodResolver } from '@hookform/resolvers/zod';
import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import FormControl from '@mui/joy/FormControl';
import FormHelperText from '@mui/joy/FormHelperText';
import FormLabel from '@mui/joy/FormLabel';
import Input from '@mui/joy/Input';
import Option from '@mui/joy/Option';
import Select from '@mui/joy/Select';
import Stack from '@mui/joy/Stack';
import { builderLevels, inviteStaffSchema, type BuilderLevel } from '@loomwright/shared';
import { useQueryClient } from '@tanstack/react-query';
import { Controller, useForm } from 'react-hook-form';
import { useCreateInvitation } from 'src/features/invitations/api/create-invitation';
import { formatStamp } from 'src/lib/format';
import { teamKeys } from 'src/features/team/api/query-keys';
import { ApiErrorAlert, setServerFieldErrors } from '@loomwright/shared/ui';

const levelNames: Record<BuilderLevel, string> = { apprentice: 'Apprentice', journeyman: 'Journeyman', master: 'Master' };
// Typical rates by level (common practice in the trade, no published source); the owner sets the real one.
const typicalRate: Record<BuilderLevel, string> = { apprentice: '$40–$50/h', journeyman: '$80–$100/h', master: '$100–$150/h' };

const FIELDS = ['email', 'name', 'level', 'hourlyRate'] as const;

const dateTime = (iso: string) => formatStamp(iso);

export function InviteBuilderForm() {
  const invite = useCreateInvitation();
  const queryClient = useQueryClient();
  const { register, handleSubmit, control, formState, watch, reset, setError } = useForm({
    resolver: zodResolver(inviteStaffSchema),
    defaultValues: { email: '', name: '', level: 'apprentice' as BuilderLevel, hourlyRate: '45.00' },
  });
  const level = watch('level');
  const onSubmit = handleSubmit((values) =>
    invite.mutate(values, {
      onSuccess: () => {
        void queryClient.invalidateQueries({ queryKey: teamKeys.all });
        reset();
      },
      onError: (error) => setServerFieldErrors(error, setError, FIELDS),
    }),
  );
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Invite a builder">
      <Stack gap={2} sx={{ maxWidth: 460 }}>
        {invite.isSuccess && (
          <Alert color="success" role="status">
            {invite.data.resent
              ? `A fresh invitation went to ${invite.data.user.email}; the earlier link no longer works.`
              : `Invitation sent to ${invite.data.user.email}.`}{' '}
            The link works once, until {dateTime(invite.data.expiresAt)}.
          </Alert>
        )}
        <ApiErrorAlert error={invite.error} fields={FIELDS} signInHref="/sign-in" />
        <FormControl error={!!formState.errors.name}>
          <FormLabel>Name</FormLabel>
          <Input autoComplete="off" {...register('name')} />
          {formState.errors.name && <FormHelperText>{formState.errors.name.message}</FormHelperText>}
        </FormControl>
        <FormControl error={!!formState.errors.email}>
          <FormLabel>E-mail</FormLabel>
          <Input type="email" autoComplete="off" {...register('email')} />
          <FormHelperText>{formState.errors.email?.message ?? 'The invitation link goes here.'}</FormHelperText>
        </FormControl>
        <FormControl error={!!formState.errors.level}>
          <FormLabel id="invite-level-label">Level</FormLabel>
          <Controller
            control={control}
            name="level"
            render={({ field }) => (
              <Select
                value={field.value}
                onChange={(_event, value) => value && field.onChange(value)}
                onClose={field.onBlur}
                slotProps={{ button: { 'aria-labelledby': 'invite-level-label' } }}
              >
                {builderLevels.map((l) => (
                  <Option key={l} value={l}>
                    {levelNames[l]}
                  </Option>
                ))}
              </Select>
            )}
          />
          <FormHelperText>
            {formState.errors.level?.message ?? 'Complex rigs (switcher loops, several functions) call for a higher level.'}
          </FormHelperText>
        </FormControl>
        <FormControl error={!!formState.errors.hourlyRate}>
          <FormLabel>Hourly rate</FormLabel>
          <Input startDecorator="$" inputMode="decimal" sx={{ fontVariantNumeric: 'tabular-nums' }} {...register('hourlyRate')} />
          <FormHelperText>{formState.errors.hourlyRate?.message ?? `Typical for this level: ${typicalRate[level]}.`}</FormHelperText>
        </FormControl>
        <FormHelperText>New builders start with a Monday–Friday week of 7 bench hours a day; change it on the team page.</FormHelperText>
        <Button type="submit" color="accent" loading={invite.isPending} sx={{ alignSelf: 'flex-start' }}>
          Send invitation
        </Button>
      </Stack>
    </form>
  );
}
