import Button from '@mui/joy/Button';
import Stack from '@mui/joy/Stack';
import ToggleButtonGroup from '@mui/joy/ToggleButtonGroup';
import Typography from '@mui/joy/Typography';
import { useMemo, useState } from 'react';
import { useSearchParams } from 'react-router';
import { ErrorNote } from 'src/components/ErrorNote';
import { FilterBar } from 'src/components/FilterBar';
import { PageHeader } from 'src/components/PageHeader';
import { PageLoading } from 'src/components/PageLoading';
import { SelectFilter } from 'src/components/SelectFilter';
import { useBench } from 'src/features/bench/api/get-bench';
import { MonthCalendar } from 'src/features/bench/components/MonthCalendar';
import { WeekGrid } from 'src/features/bench/components/WeekGrid';
import { useTeam } from 'src/features/team/api/get-team';
import { useMe } from 'src/features/auth/api/get-me';
import { RescheduleDialog, type MovableBuild } from 'src/features/builds/components/RescheduleDialog';
import { Notice } from 'src/components/Notice';
import { addDays, endOfMonth, formatDay, formatMonth, startOfMonth, startOfWeek, today } from 'src/lib/format';

type BenchMode = 'week' | 'month';

function range(from: string, to: string): string[] {
  const days: string[] = [];
  for (let day = from; day <= to; day = addDays(day, 1)) days.push(day);
  return days;
}

export function Component() {
  const [search, setSearch] = useSearchParams();
  const mode: BenchMode = search.get('view') === 'month' ? 'month' : 'week';
  const anchor = /^\d{4}-\d{2}-\d{2}$/.test(search.get('day') ?? '') ? search.get('day')! : today();
  const builderId = search.get('builder') ?? '';
  const set = (patch: Record<string, string>) =>
    setSearch(
      (current) => {
        const next = new URLSearchParams(current);
        for (const [key, value] of Object.entries(patch)) {
          if (value) next.set(key, value);
          else next.delete(key);
        }
        return next;
      },
      { replace: true },
    );

  const { from, to, days, weeks, month } = useMemo(() => {
    if (mode === 'week') {
      const start = startOfWeek(anchor);
      const end = addDays(start, 6);
      return { from: start, to: end, days: range(start, end), weeks: [], month: '' };
    }
    const first = startOfMonth(anchor);
    const start = startOfWeek(first);
    const end = addDays(startOfWeek(endOfMonth(anchor)), 6);
    const all = range(start, end);
    const rows: string[][] = [];
    for (let i = 0; i < all.length; i += 7) rows.push(all.slice(i, i + 7));
    return { from: start, to: end, days: all, weeks: rows, month: first.slice(0, 7) };
  }, [mode, anchor]);

  const bench = useBench({ from, to, builderId: builderId || undefined });
  const team = useTeam();
  const me = useMe();
  const [moving, setMoving] = useState<MovableBuild | null>(null);
  const [notice, setNotice] = useState<string | null>(null);

  const view = useMemo(() => {
    if (!bench.data) return undefined;
    // The signed-in builder's own bench comes first (the API orders it so too; this keeps it if not).
    const builders = [...bench.data.builders].sort((a, b) => Number(b.builder.isMe) - Number(a.builder.isMe));
    return { ...bench.data, builders };
  }, [bench.data]);

  const step = (direction: 1 | -1) => {
    if (mode === 'week') set({ day: addDays(startOfWeek(anchor), 7 * direction) });
    else {
      const first = startOfMonth(anchor);
      set({ day: direction === 1 ? addDays(endOfMonth(first), 1) : startOfMonth(addDays(first, -1)) });
    }
  };

  const title = mode === 'week' ? `Week of ${formatDay(from)} – ${formatDay(to)}` : formatMonth(startOfMonth(anchor));
  return (
    <>
      <PageHeader
        title="Bench"
        hint="Booked bench hours against each builder's capacity, day by day. Closed days (shop closures, public holidays, days off) hold no bench time."
      />
      <FilterBar label="Choose the bench view">
        <ToggleButtonGroup
          size="sm"
          value={mode}
          onChange={(_, value) => value && set({ view: value === 'week' ? '' : value })}
          aria-label="View"
        >
          <Button value="week">Week</Button>
          <Button value="month">Month</Button>
        </ToggleButtonGroup>
        <Stack direction="row" gap={1} alignItems="center">
          <Button size="sm" variant="outlined" color="neutral" onClick={() => step(-1)}>
            {mode === 'week' ? 'Previous week' : 'Previous month'}
          </Button>
          <Button size="sm" variant="outlined" color="neutral" onClick={() => set({ day: '' })}>
            Today
          </Button>
          <Button size="sm" variant="outlined" color="neutral" onClick={() => step(1)}>
            {mode === 'week' ? 'Next week' : 'Next month'}
          </Button>
        </Stack>
        <SelectFilter
          label="Builder"
          value={builderId}
          onChange={(value) => set({ builder: value })}
          options={[
            { value: '', label: 'Every builder' },
            ...(team.data ?? []).map((member) => ({ value: member.id, label: `${member.name} (${member.level})` })),
          ]}
        />
      </FilterBar>
      <Typography level="title-lg" component="h2" sx={{ mb: 1 }} aria-live="polite">
        {title}
      </Typography>
      <ErrorNote error={bench.error} action="Reload the page to try again." />
      {!view && bench.isPending && <PageLoading label="Reading the bench…" />}
      {view && view.builders.length === 0 && <Typography>No active builders. Add one on the Team page.</Typography>}
      {view &&
        (mode === 'week' ? (
          <WeekGrid
            view={view}
            days={days}
            onMove={(build, builder) =>
              setMoving({ bookingId: build.bookingId, reference: build.reference, builderId: builder, benchDate: build.benchDate })
            }
          />
        ) : (
          <MonthCalendar view={view} weeks={weeks} month={month} />
        ))}
      <RescheduleDialog build={moving} isOwner={me.data?.role === 'owner'} onClose={() => setMoving(null)} onMoved={setNotice} />
      <Notice message={notice} onClose={() => setNotice(null)} />
    </>
  );
}
