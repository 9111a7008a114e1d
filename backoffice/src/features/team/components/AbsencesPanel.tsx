import Button from '@mui/joy/Button';
import FormControl from '@mui/joy/FormControl';
import FormLabel from '@mui/joy/FormLabel';
import Input from '@mui/joy/Input';
import Option from '@mui/joy/Option';
import Select from '@mui/joy/Select';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { absenceSchema, type TeamMember } from '@loomwright/shared';
import { useState } from 'react';
import { BuildsToMove, type HitBuild } from 'src/components/BuildsToMove';
import { DayRangesTable } from 'src/components/DayRangesTable';
import { ErrorNote } from 'src/components/ErrorNote';
import { formatDay } from 'src/lib/format';
import { useAbsences, useAddAbsence, useRemoveAbsence } from '../api/absences';
import { FormProblems } from 'src/components/FormProblems';

/** Days a builder is away (ill, holiday, a course): their bench holds nothing then. */
export function AbsencesPanel({ team, canEdit, onSaved }: { team: TeamMember[]; canEdit: boolean; onSaved: (m: string) => void }) {
  const absences = useAbsences();
  const add = useAddAbsence();
  const remove = useRemoveAbsence();
  const [builderId, setBuilderId] = useState<string | null>(null);
  const [startsOn, setStartsOn] = useState('');
  const [endsOn, setEndsOn] = useState('');
  const [reason, setReason] = useState('');
  const [errors, setErrors] = useState<string[]>([]);
  const [hit, setHit] = useState<{ builds: HitBuild[]; reason: string } | null>(null);
  const nameOf = (id: string) => team.find((m) => m.id === id)?.name ?? 'A builder';

  const submit = () => {
    if (!builderId) return setErrors(['Choose the builder who is away.']);
    const parsed = absenceSchema.safeParse({ startsOn, endsOn, reason });
    if (!parsed.success) return setErrors(parsed.error.issues.map((i) => i.message));
    setErrors([]);
    add.mutate(
      { builderId, ...parsed.data },
      {
        onSuccess: (added) => {
          setHit({ builds: added.buildsOnBenchThen, reason: 'Your builder is away on those days.' });
          onSaved(
            added.buildsOnBenchThen.length === 0
              ? `${nameOf(builderId)} is away ${formatDay(added.startsOn)} to ${formatDay(added.endsOn)}; nothing on their bench then.`
              : `${nameOf(builderId)} is away then, and ${added.buildsOnBenchThen.length} build(s) are on their bench: move them below.`,
          );
        },
      },
    );
  };

  return (
    <Stack gap={1} component="section" aria-label="Builders away" sx={{ mt: 3 }}>
      <Typography level="title-md" component="h2">
        Builders away
      </Typography>
      {absences.data && absences.data.length === 0 && <Typography level="body-sm">Nobody is away.</Typography>}
      {absences.data && absences.data.length > 0 && (
        <DayRangesTable
          label="Builders away"
          rows={absences.data}
          who={{ heading: 'Builder', of: (a) => nameOf(a.builderId) }}
          reasonHeading="Why"
          removingId={remove.isPending ? remove.variables : undefined}
          onRemove={canEdit ? (a) => remove.mutate(a.id, { onSuccess: () => onSaved('Absence removed.') }) : undefined}
        />
      )}
      <ErrorNote error={absences.error ?? remove.error} />
      {hit && <BuildsToMove builds={hit.builds} reason={hit.reason} onDone={onSaved} />}
      {canEdit && (
        <Stack direction="row" gap={1} alignItems="flex-end" flexWrap="wrap">
          <FormControl size="sm">
            <FormLabel id="absence-builder">Builder</FormLabel>
            <Select
              size="sm"
              aria-labelledby="absence-builder"
              value={builderId}
              onChange={(_, v) => setBuilderId(v)}
              sx={{ minWidth: 180 }}
            >
              {team.map((m) => (
                <Option key={m.id} value={m.id}>
                  {m.name}
                </Option>
              ))}
            </Select>
          </FormControl>
          <FormControl size="sm">
            <FormLabel>First day away</FormLabel>
            <Input type="date" value={startsOn} onChange={(e) => setStartsOn(e.target.value)} />
          </FormControl>
          <FormControl size="sm">
            <FormLabel>Last day away</FormLabel>
            <Input type="date" value={endsOn} onChange={(e) => setEndsOn(e.target.value)} />
          </FormControl>
          <FormControl size="sm" sx={{ flex: 1, minWidth: 160 }}>
            <FormLabel>Why (only the shop sees it)</FormLabel>
            <Input value={reason} onChange={(e) => setReason(e.target.value)} />
          </FormControl>
          <Button size="sm" onClick={submit} loading={add.isPending}>
            Add absence
          </Button>
        </Stack>
      )}
      <FormProblems problems={errors} />
      <ErrorNote error={add.error} />
    </Stack>
  );
}
