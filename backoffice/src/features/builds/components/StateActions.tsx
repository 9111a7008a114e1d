import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import {
  benchTransitions,
  bookingStateLabels,
  waiveBalanceSchema,
  type BenchState,
  type BookingDetail,
  type IntakeItemView,
} from '@loomwright/shared';
import { useState } from 'react';
import { formatMoney } from 'src/lib/format';
import { useChangeState } from '../api/change-state';
import { useRequestLayoutApproval } from '../api/request-layout';
import { useWaiveBalance } from '../api/waive-balance';
import { BalanceDialog } from './BalanceDialog';
import { NoteDialog } from './NoteDialog';
import { RecordDecisionDialog } from './RecordDecisionDialog';

const moveWords: Record<BenchState, string> = {
  scheduled: 'Back to scheduled',
  pedals_received: 'Mark pedals received',
  on_bench: 'Put it on the bench',
  testing: 'Start testing',
  ready: 'Mark ready (requests the balance)',
  delivered: 'Mark delivered',
};

const isBenchState = (state: string): state is BenchState => state in benchTransitions;

/** The moves this build can make next, with what each needs spelled out before it is tried. */
export function StateActions({
  booking,
  intake,
  isOwner,
  onDone,
}: {
  booking: BookingDetail;
  intake: IntakeItemView[] | undefined;
  isOwner: boolean;
  onDone: (message: string) => void;
}) {
  const change = useChangeState(booking.id);
  const layout = useRequestLayoutApproval(booking.id);
  const waive = useWaiveBalance(booking.id);
  const [moving, setMoving] = useState<BenchState | null>(null);
  const [askingLayout, setAskingLayout] = useState(false);
  const [waiving, setWaiving] = useState(false);
  const [balanceOpen, setBalanceOpen] = useState(false);
  const [recordingLayout, setRecordingLayout] = useState(false);

  if (!isBenchState(booking.state)) {
    return <Typography level="body-sm">{bookingStateLabels[booking.state]}: no bench moves from here.</Typography>;
  }
  // Delivery is offered only once nothing is due or the owner waived it; until then the balance is the next step.
  const balanceDue = booking.state === 'ready' && !booking.money.settled;
  const moves = benchTransitions[booking.state].filter((to) => !(to === 'delivered' && balanceDue));
  const waitingExtras = booking.extras.filter((x) => x.status === 'proposed');

  const blockedBecause = (to: BenchState): string | null => {
    if (to === 'pedals_received' && (intake?.length ?? 0) === 0) return 'Record the intake below first.';
    if (to === 'testing' && booking.awaitingLayoutApproval) return "Waiting for the player's layout approval.";
    if (to === 'ready' && waitingExtras.length)
      return `Waiting for the player's answer on ${waitingExtras.map((x) => x.description).join(', ')}.`;
    return null;
  };

  return (
    <Stack gap={1}>
      <Stack direction="row" gap={1} flexWrap="wrap" alignItems="center">
        {balanceDue && (
          <Button color="accent" onClick={() => setBalanceOpen(true)}>
            {isOwner ? 'Request / record balance' : 'Request the balance'}
          </Button>
        )}
        {moves.map((to) => {
          const blocked = blockedBecause(to);
          return (
            <Stack key={to} gap={0.25}>
              <Button
                color={to === 'on_bench' && booking.state === 'testing' ? 'neutral' : 'accent'}
                variant={to === 'on_bench' && booking.state === 'testing' ? 'outlined' : 'solid'}
                disabled={Boolean(blocked)}
                onClick={() => setMoving(to)}
              >
                {to === 'on_bench' && booking.state === 'testing' ? 'Back to the bench for a fix' : moveWords[to]}
              </Button>
              {blocked && <Typography level="body-xs">{blocked}</Typography>}
            </Stack>
          );
        })}
        {booking.state === 'on_bench' && !booking.awaitingLayoutApproval && (
          <Button variant="outlined" color="primary" onClick={() => setAskingLayout(true)}>
            Ask the player to approve the layout
          </Button>
        )}
        {booking.state === 'ready' && isOwner && balanceDue && (
          <Button variant="outlined" color="neutral" onClick={() => setWaiving(true)}>
            Waive the balance…
          </Button>
        )}
      </Stack>
      {booking.awaitingLayoutApproval && (
        <Alert
          variant="soft"
          color="warning"
          endDecorator={
            <Button size="sm" variant="outlined" color="warning" onClick={() => setRecordingLayout(true)}>
              Record an answer given by phone or in person
            </Button>
          }
        >
          The player has been e-mailed the top-view layout to approve; testing starts after their answer.
        </Alert>
      )}
      {booking.state === 'ready' && (
        <Typography level="body-sm">
          {!balanceDue
            ? booking.money.balanceWaived && booking.money.balanceDue !== '0.00'
              ? 'The owner waived the balance; the board can go back to the player.'
              : 'Nothing is due; the board can go back to the player.'
            : `Balance due: ${formatMoney(booking.money.balanceDue, booking.money.currency)}. Delivery is offered once the player pays it${isOwner ? ', you record it, or you waive it with a reason' : ' or the owner records or waives it'}.`}
        </Typography>
      )}
      <BalanceDialog
        booking={booking}
        open={balanceOpen}
        isOwner={isOwner}
        onClose={() => setBalanceOpen(false)}
        onDone={(message) => {
          onDone(message);
          setBalanceOpen(false);
        }}
      />
      <RecordDecisionDialog
        bookingId={booking.id}
        target={recordingLayout ? { layout: true } : null}
        what="the layout"
        playerName={booking.customer.name}
        onClose={() => setRecordingLayout(false)}
        onDone={(message) => {
          onDone(`${booking.reference}: ${message}`);
          setRecordingLayout(false);
        }}
      />
      <NoteDialog
        open={moving !== null}
        title={moving ? `${moveWords[moving]} — ${booking.reference}` : ''}
        label="Note (optional)"
        canTellPlayer
        confirm="Confirm"
        pending={change.isPending}
        error={change.error}
        onClose={() => {
          setMoving(null);
          change.reset();
        }}
        onConfirm={(note, tellPlayer) =>
          moving &&
          change.mutate(
            { to: moving, ...(note ? { note } : {}), ...(tellPlayer ? { tellPlayer } : {}) },
            {
              onSuccess: () => {
                onDone(`${booking.reference}: ${bookingStateLabels[moving]}.`);
                setMoving(null);
              },
            },
          )
        }
      >
        {moving === 'ready' && (
          <Typography level="body-sm">The player is asked to pay the balance through the same checkout as the deposit.</Typography>
        )}
      </NoteDialog>
      <NoteDialog
        open={askingLayout}
        title={`Ask for layout approval — ${booking.reference}`}
        label="Message to the player with the top view (optional; sent word for word)"
        confirm="Send the request"
        pending={layout.isPending}
        error={layout.error}
        onClose={() => setAskingLayout(false)}
        onConfirm={(note) =>
          layout.mutate(note, {
            onSuccess: () => {
              onDone(`${booking.reference}: layout sent to the player for approval.`);
              setAskingLayout(false);
            },
          })
        }
      />
      <NoteDialog
        open={waiving}
        title={`Waive the balance — ${booking.reference}`}
        label="Reason (kept in the history)"
        required
        rule={waiveBalanceSchema.shape.reason}
        confirm="Waive the balance"
        pending={waive.isPending}
        error={waive.error}
        onClose={() => setWaiving(false)}
        onConfirm={(reason) =>
          waive.mutate(reason, {
            onSuccess: () => {
              onDone(`${booking.reference}: balance waived.`);
              setWaiving(false);
            },
          })
        }
      >
        <Typography level="body-sm">
          The player will not be asked for {formatMoney(booking.money.balanceDue, booking.money.currency)}; the build can then be marked
          delivered.
        </Typography>
      </NoteDialog>
    </Stack>
  );
}
