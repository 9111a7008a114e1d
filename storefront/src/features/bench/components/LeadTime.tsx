import Typography from '@mui/joy/Typography';
import type { BuilderLevel } from '@loomwright/shared';
import { formatDay } from 'src/lib/format';
import { useLeadTime } from '../api/get-lead-time';

/** When the build could start and be done, from the shop's real bench, before the player pays. */
export function LeadTime({ hours, level }: { hours: string; level: BuilderLevel }) {
  const lead = useLeadTime(hours, level);
  if (lead.isPending) return <Typography level="body-sm">Reading the shop's bench…</Typography>;
  if (lead.error) return <Typography level="body-sm">The bench dates could not be read just now: {lead.error.message}</Typography>;
  const l = lead.data;
  if (!l.earliestBenchDate) return <Typography level="body-sm">{l.message}</Typography>;
  return (
    <>
      <Typography data-testid="lead-time">
        Earliest bench date <b>{formatDay(l.earliestBenchDate)}</b>, expected done {formatDay(l.expectedCompletion)}.
      </Typography>
      <Typography level="body-sm">
        If you book now, your pedals would need to arrive by {formatDay(l.shipBy)}. The date is set when a builder accepts your paid
        request; the queue may move before then, and the e-mail with your bench date says exactly when to ship.
      </Typography>
    </>
  );
}
