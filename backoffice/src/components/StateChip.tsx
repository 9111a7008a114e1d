import Chip from '@mui/joy/Chip';
import type { ColorPaletteProp } from '@mui/joy/styles';
import type { BookingState } from '@loomwright/shared';

/** Short words for a dense table; the full sentence (bookingStateLabels) goes in detail views. */
export const shortStateLabels: Record<BookingState, string> = {
  draft: 'Draft',
  requested: 'Requested',
  deposit_paid: 'Deposit paid',
  scheduled: 'Scheduled',
  pedals_received: 'Pedals in',
  on_bench: 'On the bench',
  testing: 'Testing',
  ready: 'Ready',
  delivered: 'Delivered',
  declined: 'Declined',
  cancelled: 'Cancelled',
  refunded: 'Refunded',
};

// The word carries the state; colour only groups them (waiting on the shop, at the bench, done, ended).
const stateColour: Record<BookingState, ColorPaletteProp> = {
  draft: 'neutral',
  requested: 'neutral',
  deposit_paid: 'warning',
  scheduled: 'primary',
  pedals_received: 'primary',
  on_bench: 'primary',
  testing: 'primary',
  ready: 'accent' as ColorPaletteProp,
  delivered: 'success',
  declined: 'danger',
  cancelled: 'neutral',
  refunded: 'neutral',
};

export function StateChip({ state }: { state: BookingState }) {
  return (
    <Chip size="sm" variant="soft" color={stateColour[state]} sx={{ fontWeight: 'md' }}>
      {shortStateLabels[state]}
    </Chip>
  );
}
