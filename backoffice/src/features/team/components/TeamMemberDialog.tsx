import DialogContent from '@mui/joy/DialogContent';
import DialogTitle from '@mui/joy/DialogTitle';
import FormControl from '@mui/joy/FormControl';
import FormHelperText from '@mui/joy/FormHelperText';
import FormLabel from '@mui/joy/FormLabel';
import Input from '@mui/joy/Input';
import Modal from '@mui/joy/Modal';
import ModalDialog from '@mui/joy/ModalDialog';
import Option from '@mui/joy/Option';
import Select from '@mui/joy/Select';
import Stack from '@mui/joy/Stack';
import Switch from '@mui/joy/Switch';
import Typography from '@mui/joy/Typography';
import {
  builderLevels,
  teamMemberFormSchema,
  type TeamMember,
  type TeamMemberFormInput,
  type TeamMemberFormOutput,
  type WeeklyHours,
} from '@loomwright/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { ErrorNote } from 'src/components/ErrorNote';
import { useUpdateTeamMember } from '../api/update-team-member';
import { DialogButtons } from 'src/components/DialogButtons';

export const weekdays = [
  ['1', 'Mon'],
  ['2', 'Tue'],
  ['3', 'Wed'],
  ['4', 'Thu'],
  ['5', 'Fri'],
  ['6', 'Sat'],
  ['7', 'Sun'],
] as const;

const toForm = (m: TeamMember): TeamMemberFormInput => ({
  level: m.level,
  hourlyRate: m.hourlyRate ?? '',
  active: m.active,
  hours: Object.fromEntries(weekdays.map(([d]) => [d, m.weeklyHours[d] ? String(m.weeklyHours[d]) : ''])) as TeamMemberFormInput['hours'],
});

/** The owner sets a builder's level, rate and bench hours; the bench and suggestions follow. */
export function TeamMemberDialog({
  member,
  onClose,
  onSaved,
}: {
  member: TeamMember | null;
  onClose: () => void;
  onSaved: (m: string) => void;
}) {
  const update = useUpdateTeamMember();
  const form = useForm<TeamMemberFormInput, unknown, TeamMemberFormOutput>({ resolver: zodResolver(teamMemberFormSchema) });
  // useForm returns the same form object on every render, and a mutation's reset is stable.
  const { reset: resetForm } = form;
  const resetUpdate = update.reset;
  useEffect(() => {
    if (member) resetForm(toForm(member));
    resetUpdate();
  }, [member, resetForm, resetUpdate]);
  const submit = form.handleSubmit((values) => {
    if (!member) return;
    const weeklyHours: WeeklyHours = {};
    for (const [d] of weekdays) if (values.hours[d] > 0) weeklyHours[d] = values.hours[d];
    update.mutate(
      { id: member.id, body: { level: values.level, hourlyRate: values.hourlyRate, active: values.active, weeklyHours } },
      {
        onSuccess: () => {
          onSaved(`${member.name}'s details are saved.`);
          onClose();
        },
      },
    );
  });
  const errors = form.formState.errors;
  const hourError = weekdays.map(([d]) => errors.hours?.[d]?.message).find(Boolean);
  return (
    <Modal open={Boolean(member)} onClose={onClose}>
      <ModalDialog sx={{ width: 'min(600px, 96vw)' }}>
        <form onSubmit={submit} noValidate>
          <DialogTitle component="h2" sx={{ mb: 1.5 }}>
            {member?.name}
          </DialogTitle>
          <DialogContent sx={{ gap: 1.5 }}>
            <Stack direction="row" gap={1.5} flexWrap="wrap">
              <FormControl sx={{ minWidth: 180 }}>
                <FormLabel>Level</FormLabel>
                <Controller
                  control={form.control}
                  name="level"
                  render={({ field }) => (
                    <Select value={field.value ?? null} onChange={(_, v) => v && field.onChange(v)}>
                      {builderLevels.map((l) => (
                        <Option key={l} value={l}>
                          {l}
                        </Option>
                      ))}
                    </Select>
                  )}
                />
              </FormControl>
              <FormControl error={Boolean(errors.hourlyRate)} sx={{ width: 160 }}>
                <FormLabel>Hourly rate</FormLabel>
                <Input startDecorator="$" inputMode="decimal" {...form.register('hourlyRate')} />
                {errors.hourlyRate && <FormHelperText>{errors.hourlyRate.message}</FormHelperText>}
              </FormControl>
              <FormControl orientation="horizontal" sx={{ gap: 1, alignSelf: 'flex-end', pb: 1 }}>
                <Controller
                  control={form.control}
                  name="active"
                  render={({ field }) => <Switch checked={Boolean(field.value)} onChange={(e) => field.onChange(e.target.checked)} />}
                />
                <FormLabel>Takes builds</FormLabel>
              </FormControl>
            </Stack>
            <Typography level="title-sm">Bench hours per weekday (empty = day off)</Typography>
            <Stack direction="row" gap={1} flexWrap="wrap">
              {weekdays.map(([d, name]) => (
                <FormControl key={d} error={Boolean(errors.hours?.[d])} sx={{ width: 64 }}>
                  <FormLabel>{name}</FormLabel>
                  <Input size="sm" inputMode="decimal" {...form.register(`hours.${d}`)} />
                </FormControl>
              ))}
            </Stack>
            {hourError && (
              <Typography level="body-sm" color="danger" role="alert">
                {hourError}
              </Typography>
            )}
            <Typography level="body-xs">
              A new rate applies to builds accepted from now on; firm quotes already given keep theirs.
            </Typography>
            <ErrorNote error={update.error} />
          </DialogContent>
          <DialogButtons color="primary" pending={update.isPending} onCancel={onClose} spaced>
            Save
          </DialogButtons>
        </form>
      </ModalDialog>
    </Modal>
  );
}
