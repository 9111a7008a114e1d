import Card from '@mui/joy/Card';
import Link from '@mui/joy/Link';
import Stack from '@mui/joy/Stack';
import Switch from '@mui/joy/Switch';
import Typography from '@mui/joy/Typography';
import type { TodayBuild } from '@loomwright/shared';
import { Link as RouterLink, useSearchParams } from 'react-router';
import { ErrorNote } from 'src/components/ErrorNote';
import { PageHeader } from 'src/components/PageHeader';
import { PageLoading } from 'src/components/PageLoading';
import { useMe } from 'src/features/auth/api/get-me';
import { useToday } from 'src/features/today/api/get-today';
import { TodayBuildCard } from 'src/features/today/components/TodayBuildCard';
import { formatDay } from 'src/lib/format';

const sections: Array<{ when: TodayBuild['when']; title: string; empty: string }> = [
  { when: 'today', title: 'On the bench today', empty: 'Nothing on the bench today.' },
  { when: 'week', title: 'Later this week', empty: 'Nothing else booked on the bench this week.' },
  { when: 'ready', title: 'Built, waiting to go out', empty: 'No finished board waiting for its balance or hand-over.' },
];

/**
 * A builder's landing page: today's and this week's builds on their bench, what each waits for and
 * the next step. The owner sees every builder's, or switches to their own bench (?mine=1, kept in the address).
 */
export function Component() {
  const me = useMe();
  const [params, setParams] = useSearchParams();
  const isOwner = me.data?.role === 'owner';
  const onlyMine = isOwner && params.get('mine') === '1';
  const today = useToday(isOwner ? (onlyMine ? 'mine' : 'all') : undefined);
  const data = today.data;
  return (
    <Stack gap={2} sx={{ maxWidth: 1080 }}>
      <PageHeader
        title="Today"
        hint={
          data
            ? `${formatDay(data.today)}, and the rest of the week to ${formatDay(data.weekEnd)}. Each build says what it waits for and what to do next.`
            : 'Your builds today and this week: what each waits for and what to do next.'
        }
        actions={
          isOwner ? (
            <Typography
              component="label"
              level="body-sm"
              startDecorator={
                <Switch checked={onlyMine} onChange={(e) => setParams(e.target.checked ? { mine: '1' } : {}, { replace: true })} />
              }
            >
              Only my own bench
            </Typography>
          ) : undefined
        }
      />
      <ErrorNote error={today.error} action="Reload the page to try again." />
      {today.isPending && !today.error && <PageLoading label="Loading today’s builds…" />}
      {data && data.scope === 'mine' && !data.hasOwnBench && (
        <Typography level="body-md">Your account has no bench of its own on the team, so there are no builds of yours to list.</Typography>
      )}
      {data &&
        (data.scope === 'all' || data.hasOwnBench) &&
        sections.map((section) => {
          const builds = data.builds.filter((b) => b.when === section.when);
          return (
            <Stack key={section.when} component="section" aria-label={section.title} gap={1}>
              <Typography level="title-lg" component="h2">
                {section.title} {builds.length > 0 && <Typography level="body-sm">({builds.length})</Typography>}
              </Typography>
              {builds.length === 0 ? (
                <Typography level="body-sm">{section.empty}</Typography>
              ) : (
                builds.map((build) => <TodayBuildCard key={build.bookingId} build={build} showBuilder={data.scope === 'all'} />)
              )}
            </Stack>
          );
        })}
      <Card variant="soft">
        <Typography level="title-sm">At the bench</Typography>
        <Typography level="body-sm">
          Mains wiring and any power inlet only by qualified people under local electrical codes; match every pedal’s voltage and polarity
          before power goes on; a loaded road case is a two-person lift; solder in a ventilated place and wash hands after.
        </Typography>
        <Stack direction="row" gap={2} flexWrap="wrap">
          <Link component={RouterLink} to="/bench" level="body-sm">
            The whole bench
          </Link>
          <Link component={RouterLink} to="/calendars" level="body-sm">
            {isOwner ? 'Calendar links' : 'My calendar link'}
          </Link>
        </Stack>
      </Card>
    </Stack>
  );
}
