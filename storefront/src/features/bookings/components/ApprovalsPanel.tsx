import Button from '@mui/joy/Button';
import Card from '@mui/joy/Card';
import Stack from '@mui/joy/Stack';
import Textarea from '@mui/joy/Textarea';
import Typography from '@mui/joy/Typography';
import { decidedViaWords, type BookingDetail, type DecisionView } from '@loomwright/shared';
import { useState, type ReactNode } from 'react';
import { formatAmount, formatMoment } from 'src/lib/format';
import { useAnswerApproval, type ApprovalAnswer } from '../api/answer-approval';
import { ApiErrorAlert } from '@loomwright/shared/ui';

type Question = { kind: 'extra'; extraId: string } | { kind: 'layout' };

function decisionWords(d: DecisionView) {
  const how = decidedViaWords[d.via];
  return `${d.approved ? 'Approved' : 'Declined'} by ${d.givenBy} ${how}${d.recordedBy ? ` (recorded by ${d.recordedBy})` : ''}, ${formatMoment(d.at)}${d.comment ? `: “${d.comment}”` : ''}`;
}

/** Approve / Decline with an optional comment for the builder. */
function AnswerButtons({ bookingId, question, label }: { bookingId: string; question: Question; label: string }) {
  const answer = useAnswerApproval();
  const [comment, setComment] = useState('');
  const send = (approve: boolean) =>
    answer.mutate({ bookingId, approve, comment: comment.trim() || undefined, ...question } as ApprovalAnswer);
  return (
    <Stack gap={1}>
      <Textarea
        minRows={2}
        placeholder="A comment for your builder (optional)"
        value={comment}
        onChange={(e) => setComment(e.target.value)}
        slotProps={{ textarea: { 'aria-label': `Comment on ${label}`, maxLength: 1000 } }}
      />
      <Stack direction="row" gap={1} flexWrap="wrap">
        <Button
          color="accent"
          loading={answer.isPending && answer.variables?.approve === true}
          disabled={answer.isPending}
          onClick={() => send(true)}
        >
          Approve
        </Button>
        <Button
          variant="outlined"
          color="neutral"
          loading={answer.isPending && answer.variables?.approve === false}
          disabled={answer.isPending}
          onClick={() => send(false)}
        >
          Decline
        </Button>
      </Stack>
      <ApiErrorAlert error={answer.error} />
    </Stack>
  );
}

/**
 * What the shop asks the player: extras with their price, and the top-view layout before cables
 * are cut. Nothing is added to the bill until approved; earlier answers stay listed with who gave them and how.
 */
export function ApprovalsPanel({ booking, isPlayer, topView }: { booking: BookingDetail; isPlayer: boolean; topView: ReactNode }) {
  const c = booking.money.currency;
  const waitingLayout = booking.layoutApprovals.find((l) => l.status === 'waiting');
  const answeredLayouts = booking.layoutApprovals.filter((l) => l.status !== 'waiting');
  if (booking.extras.length === 0 && booking.layoutApprovals.length === 0) return null;
  return (
    <Stack gap={2}>
      {waitingLayout && (
        <Card variant="soft" color="warning" aria-label="Layout waiting for your approval">
          <Typography level="title-sm" component="h3">
            Your board layout is waiting for your approval
          </Typography>
          <Typography level="body-sm">The builder waits for your answer before cutting cables.</Typography>
          {waitingLayout.message && <Typography>From your builder: {waitingLayout.message}</Typography>}
          {topView}
          {isPlayer && <AnswerButtons bookingId={booking.id} question={{ kind: 'layout' }} label="the layout" />}
        </Card>
      )}
      {booking.extras.map((x) => (
        <Card key={x.id} variant="outlined" aria-label={`Extra: ${x.description}`}>
          <Stack direction="row" justifyContent="space-between" gap={2} flexWrap="wrap">
            <Typography level="title-sm" component="h3">
              {x.description}
            </Typography>
            <Typography level="title-sm" sx={{ fontVariantNumeric: 'tabular-nums' }}>
              {formatAmount(x.amount, c)}
            </Typography>
          </Stack>
          <Typography level="body-sm">Why: {x.reason}</Typography>
          {x.status === 'proposed' ? (
            <>
              <Typography level="body-sm">Waiting for your answer: it is added to your balance only if you approve it.</Typography>
              {isPlayer && <AnswerButtons bookingId={booking.id} question={{ kind: 'extra', extraId: x.id }} label={x.description} />}
            </>
          ) : (
            x.decision && <Typography level="body-sm">{decisionWords(x.decision)}</Typography>
          )}
        </Card>
      ))}
      {answeredLayouts.map((l) => (
        <Typography key={l.id} level="body-sm">
          Layout{l.message ? ` (“${l.message}”)` : ''}: {l.decision ? decisionWords(l.decision) : l.status}
        </Typography>
      ))}
    </Stack>
  );
}
