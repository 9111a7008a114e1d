import Button from '@mui/joy/Button';
import Link from '@mui/joy/Link';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import type { BenchBuild } from '@loomwright/shared';
import { Link as RouterLink } from 'react-router';
import { shortStateLabels } from 'src/components/StateChip';
import { formatHours } from 'src/lib/format';

/** States in which a build can still move to another day or builder. */
const MOVABLE = ['scheduled', 'pedals_received'];

/**
 * A build on a day: reference, customer, its hours that day and its state, all in words; with
 * `onMove`, a button to move it (while it waits for its pedals or the bench).
 */
export function BuildTag({ build, onMove }: { build: BenchBuild; onMove?: (build: BenchBuild) => void }) {
  const tag = (
    <Link
      component={RouterLink}
      to={`/builds/${build.bookingId}`}
      underline="none"
      aria-label={`${build.reference} · ${build.customerName}, ${formatHours(build.hours)} that day, ${shortStateLabels[build.state]}`}
      sx={{
        display: 'block',
        minWidth: 0,
        overflow: 'hidden',
        px: 0.75,
        py: 0.25,
        borderRadius: 'xs',
        borderLeft: '3px solid',
        borderColor: 'primary.400',
        bgcolor: 'primary.50',
        color: 'text.primary',
        '&:hover': { bgcolor: 'primary.100' },
      }}
    >
      <Typography level="body-xs" sx={{ display: 'block', fontWeight: 'lg', color: 'text.primary' }} noWrap>
        {build.reference}
      </Typography>
      <Typography level="body-xs" sx={{ display: 'block', color: 'text.primary' }} noWrap>
        {build.customerName}
      </Typography>
      <Typography level="body-xs" sx={{ display: 'block' }} noWrap>
        {formatHours(build.hours)} · {shortStateLabels[build.state]}
      </Typography>
    </Link>
  );
  if (!onMove || !MOVABLE.includes(build.state)) return tag;
  return (
    <Stack gap={0.25}>
      {tag}
      <Button
        size="sm"
        variant="plain"
        color="neutral"
        onClick={() => onMove(build)}
        aria-label={`Move ${build.reference}`}
        sx={{ minHeight: 0, py: 0.25, alignSelf: 'flex-start' }}
      >
        Move
      </Button>
    </Stack>
  );
}
