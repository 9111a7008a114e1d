import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import {
  benchTransitions,
  bookingStateLabels,
  type BenchState,
  type BookingDetail,
  type IntakeItemView,
} from '@loomwright/shared';
import { useState } from 'react';
import { formatMoney } from 'src/lib/format';
import { useChangeState } from '../api/change-state';
import { useRequestLayoutApproval } from '../api/request-layout';
import { useWaiveBalance } from '../api/waive-balance';
import { NoteDialog } from './NoteDialog';

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

  if (!isBenchState(booking.state)) {
    return <Typography level="body-sm">{bookingStateLabels[booking.state]}: no bench moves from here.</Typography>;
  }
  const moves = benchTransitions[booking.state];
  const balancePaid = booking.payments.some((p) => p.kind === 'balance' && p.status === 'paid');
  const balanceOpen = booking.balanceDue !== null && !balancePaid && Number(booking.balanceDue) > 0;

  const blockedBecause = (to: BenchState): string | null => {
    if (to === 'pedals_received' && (intake?.length ?? 0) === 0) return 'Record the intake below first.';
    if (to === 'testing' && booking.awaitingLayoutApproval) return "Waiting for the player's layout approval.";
    return null;
  };

  return (
    <Stack gap={1}>
      <Stack direction="row" gap={1} flexWrap="wrap" alignItems="center">
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
        {booking.state === 'ready' && isOwner && balanceOpen && (
          <Button variant="outlined" color="neutral" onClick={() => setWaiving(true)}>
            Waive the balance…
          </Button>
        )}
      </Stack>
      {booking.awaitingLayoutApproval && (
        <Alert variant="soft" color="warning">Waiting for the player to approve the top-view layout; testing starts after it.</Alert>
      )}
      {booking.state === 'ready' && (
        <Typography level="body-sm">
          {balancePaid
            ? 'The balance is paid; the board can go back to the player.'
            : balanceOpen
              ? `Balance due: ${formatMoney(booking.balanceDue, booking.currency)}. It is marked delivered once the player pays it${isOwner ? ' or you waive it with a reason' : ' or the owner waives it'}.`
              : 'No balance is due.'}
        </Typography>
      )}
      <NoteDialog
        open={moving !== null}
        title={moving ? `${moveWords[moving]} — ${booking.reference}` : ''}
        label="Note for the history (optional)"
        confirm="Confirm"
        pending={change.isPending}
        error={change.error}
        onClose={() => {
          setMoving(null);
          change.reset();
        }}
        onConfirm={(note) =>
          moving &&
          change.mutate(
            { to: moving, ...(note ? { note } : {}) },
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
          <Typography level="body-sm">
            The player is asked to pay the balance through the same checkout as the deposit.
          </Typography>
        )}
      </NoteDialog>
      <NoteDialog
        open={askingLayout}
        title={`Ask for layout approval — ${booking.reference}`}
        label="Note to the player (optional)"
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
          The player will not be asked for {formatMoney(booking.balanceDue, booking.currency)}; the build can then be marked delivered.
        </Typography>
      </NoteDialog>
    </Stack>
  );
}
