import Chip from '@mui/joy/Chip';
import { bookingStateLabels, type BookingState } from '@loomwright/shared';

// Colour only supports the words: every chip says its state in full.
const tone: Record<BookingState, 'neutral' | 'primary' | 'success' | 'warning' | 'danger'> = {
  draft: 'neutral',
  requested: 'warning',
  deposit_paid: 'primary',
  scheduled: 'primary',
  pedals_received: 'primary',
  on_bench: 'primary',
  testing: 'primary',
  ready: 'warning',
  delivered: 'success',
  declined: 'danger',
  cancelled: 'neutral',
  refunded: 'neutral',
};

export function BookingStateChip({ state }: { state: BookingState }) {
  return (
    <Chip variant="soft" color={tone[state]} size="sm" sx={{ whiteSpace: 'normal', textAlign: 'left', height: 'auto', py: 0.25 }}>
      {bookingStateLabels[state]}
    </Chip>
  );
}
