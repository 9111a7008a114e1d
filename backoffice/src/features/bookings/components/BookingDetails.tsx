import Stack from '@mui/joy/Stack';
import Divider from '@mui/joy/Divider';
import Typography from '@mui/joy/Typography';
import type { BookingDetail } from '@loomwright/shared';
import { BookingFacts } from './BookingFacts';
import { ConfigurationSummary } from './ConfigurationSummary';
import { EstimateLines } from './EstimateLines';
import { EventTimeline } from './EventTimeline';
import { PaymentsList } from 'src/components/PaymentsList';
import { PhotoGrid } from './PhotoGrid';
import { Section } from './Section';

/** Everything the shop knows about one booking, read-only: facts, rig, quote, money, photos, story. */
export function BookingDetails({ booking, show = 'all' }: { booking: BookingDetail; show?: 'all' | 'request' }) {
  return (
    <Stack gap={2} divider={<Divider />}>
      <Section title="Booking">
        <BookingFacts booking={booking} />
      </Section>
      <Section title="The rig">
        <ConfigurationSummary booking={booking} />
      </Section>
      <Section title="Player's notes">
        <Typography level="body-sm" sx={{ whiteSpace: 'pre-wrap' }}>
          {booking.customerNotes || 'No notes.'}
        </Typography>
      </Section>
      {booking.firmQuote && (
        <Section title="Firm quote">
          <EstimateLines quote={booking.firmQuote} />
        </Section>
      )}
      <Section title={booking.firmQuote ? 'Original estimate' : 'Estimate snapshot'}>
        <EstimateLines quote={booking.quote} />
      </Section>
      <Section title="Payments">
        <PaymentsList payments={booking.payments} />
      </Section>
      <Section title="Photos">
        <PhotoGrid photos={booking.photos} />
      </Section>
      {show === 'all' && (
        <Section title="History">
          <EventTimeline events={booking.events} />
        </Section>
      )}
    </Stack>
  );
}
