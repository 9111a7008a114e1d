import Button from '@mui/joy/Button';
import FormControl from '@mui/joy/FormControl';
import FormLabel from '@mui/joy/FormLabel';
import Input from '@mui/joy/Input';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { createClosureSchema, type CreateClosureInput } from '@loomwright/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { useState } from 'react';
import { BuildsToMove, type HitBuild } from 'src/components/BuildsToMove';
import { DayRangesTable } from 'src/components/DayRangesTable';
import { ErrorNote } from 'src/components/ErrorNote';
import { formatDay } from 'src/lib/format';
import { useAddClosure } from '../api/add-closure';
import { useRemoveClosure } from '../api/remove-closure';
import type { SettingsSectionProps } from './settings-section';

/** Shop-wide closed days: no builder has bench time on them. */
export function ClosuresList({ settings, canEdit, onSaved }: SettingsSectionProps) {
  const add = useAddClosure();
  const remove = useRemoveClosure();
  const form = useForm<CreateClosureInput>({
    resolver: zodResolver(createClosureSchema),
    defaultValues: { startsOn: '', endsOn: '', reason: '' },
  });
  const e = form.formState.errors;
  const firstError = e.startsOn?.message ?? e.endsOn?.message ?? e.reason?.message;
  const [hit, setHit] = useState<{ builds: HitBuild[]; reason: string } | null>(null);
  return (
    <Stack gap={1}>
      {settings.closures.length === 0 ? (
        <Typography level="body-sm">No closures planned.</Typography>
      ) : (
        <DayRangesTable
          label="Shop closures"
          rows={settings.closures}
          reasonHeading="Reason"
          sx={{ '--TableCell-height': '32px' }}
          removingId={remove.isPending ? remove.variables : undefined}
          onRemove={canEdit ? (c) => remove.mutate(c.id, { onSuccess: () => onSaved(`Closure “${c.reason}” removed.`) }) : undefined}
        />
      )}
      {hit && <BuildsToMove builds={hit.builds} reason={hit.reason} onDone={onSaved} />}
      {canEdit && (
        <Stack
          component="form"
          direction="row"
          gap={1}
          alignItems="flex-end"
          flexWrap="wrap"
          noValidate
          onSubmit={form.handleSubmit((values) =>
            add.mutate(values, {
              onSuccess: (added) => {
                form.reset();
                const clash = added.buildsOnBenchThen;
                setHit({
                  builds: clash,
                  reason: `The shop is closed on ${formatDay(added.startsOn)}${added.endsOn !== added.startsOn ? ` to ${formatDay(added.endsOn)}` : ''} (${added.reason}).`,
                });
                onSaved(
                  clash.length === 0
                    ? 'Closure added; the bench skips those days.'
                    : `Closure added. ${clash.length === 1 ? 'One build is' : `${clash.length} builds are`} already on the bench then: move ${clash.length === 1 ? 'it' : 'them'} below.`,
                );
              },
            }),
          )}
        >
          <FormControl size="sm" error={Boolean(e.startsOn)}>
            <FormLabel>First day</FormLabel>
            <Input type="date" {...form.register('startsOn')} />
          </FormControl>
          <FormControl size="sm" error={Boolean(e.endsOn)}>
            <FormLabel>Last day</FormLabel>
            <Input type="date" {...form.register('endsOn')} />
          </FormControl>
          <FormControl size="sm" error={Boolean(e.reason)} sx={{ flex: 1, minWidth: 200 }}>
            <FormLabel>Reason</FormLabel>
            <Input {...form.register('reason')} placeholder="Stocktake" />
          </FormControl>
          <Button size="sm" type="submit" loading={add.isPending}>
            Add closure
          </Button>
        </Stack>
      )}
      {firstError && (
        <Typography level="body-sm" color="danger" role="alert">
          {firstError}
        </Typography>
      )}
      <ErrorNote error={add.error ?? remove.error} />
    </Stack>
  );
}
