import Card from '@mui/joy/Card';
import Chip from '@mui/joy/Chip';
import Link from '@mui/joy/Link';
import List from '@mui/joy/List';
import ListItem from '@mui/joy/ListItem';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import type { TodayBuild, TodayWaitKind } from '@loomwright/shared';
import { Link as RouterLink } from 'react-router';
import { StateChip } from 'src/components/StateChip';
import { formatDay, formatHours } from 'src/lib/format';

/** The short name of what a build waits for, before the words that say it in full. */
const waitNames: Record<TodayWaitKind, string> = {
  parcel: 'Parcel',
  intake: 'Check-in',
  approval: 'Player’s answer',
  balance: 'Balance',
  hours: 'Hours',
};

/** One build on a builder's today: who, what the bench holds for it, what it waits for, and the next step. */
export function TodayBuildCard({ build, showBuilder }: { build: TodayBuild; showBuilder: boolean }) {
  return (
    <Card variant="outlined" component="article" aria-label={`${build.reference}, ${build.customerName}`} sx={{ gap: 1 }}>
      <Stack direction="row" gap={1} alignItems="center" flexWrap="wrap">
        <Typography level="title-md" component="h3">
          {build.reference} · {build.customerName}
        </Typography>
        <StateChip state={build.state} />
        {showBuilder && (
          <Typography level="body-sm" sx={{ ml: 'auto' }}>
            {build.builderName ?? 'No builder yet'}
          </Typography>
        )}
      </Stack>
      <Typography level="body-sm" sx={{ fontVariantNumeric: 'tabular-nums' }}>
        {build.when === 'today'
          ? `${formatHours(build.hoursToday)} on the bench today`
          : build.benchDays.length > 0
            ? `On the bench ${build.benchDays.map((d) => `${formatDay(d.day)} (${formatHours(d.hours)})`).join(', ')}`
            : 'Built; bench days done'}
        {` · ${formatHours(build.recordedHours)} recorded of ${build.quotedHours ? formatHours(build.quotedHours) : 'no'} quoted`}
      </Typography>
      {build.waitingFor.length > 0 ? (
        <List size="sm" aria-label="Waiting for" sx={{ '--ListItem-paddingX': 0, '--ListItem-minHeight': '28px' }}>
          {build.waitingFor.map((w) => (
            <ListItem key={`${w.kind}:${w.words}`} sx={{ gap: 1, alignItems: 'baseline' }}>
              <Chip size="sm" variant="outlined" color={w.kind === 'hours' ? 'neutral' : 'warning'} sx={{ flex: 'none' }}>
                {waitNames[w.kind]}
              </Chip>
              <Typography level="body-sm">{w.words}</Typography>
            </ListItem>
          ))}
        </List>
      ) : (
        <Typography level="body-sm">Waiting for nothing.</Typography>
      )}
      <Stack direction="row" gap={1} alignItems="baseline" flexWrap="wrap">
        <Typography level="body-sm" fontWeight="lg">
          Next:
        </Typography>
        <Typography level="body-sm">{build.nextAction.words}</Typography>
        <Link component={RouterLink} to={build.nextAction.to} level="body-sm" sx={{ ml: 'auto' }}>
          Open {build.reference}
        </Link>
      </Stack>
    </Card>
  );
}
