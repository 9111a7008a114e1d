import Box from '@mui/joy/Box';
import Breadcrumbs from '@mui/joy/Breadcrumbs';
import Button from '@mui/joy/Button';
import Card from '@mui/joy/Card';
import Link from '@mui/joy/Link';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { bookingStateLabels, messageWords } from '@loomwright/shared';
import { useState } from 'react';
import { Link as RouterLink, useParams } from 'react-router';
import { ErrorNote } from 'src/components/ErrorNote';
import { Notice } from 'src/components/Notice';
import { PageLoading } from 'src/components/PageLoading';
import { shortStateLabels, StateChip } from 'src/components/StateChip';
import { useBooking } from 'src/features/bookings/api/get-booking';
import { BookingFacts } from 'src/features/bookings/components/BookingFacts';
import { ConfigurationSummary } from 'src/features/bookings/components/ConfigurationSummary';
import { EstimateLines } from 'src/features/bookings/components/EstimateLines';
import { EventTimeline } from 'src/features/bookings/components/EventTimeline';
import { PaymentsList } from 'src/components/PaymentsList';
import { PhotoGrid } from 'src/features/bookings/components/PhotoGrid';
import { SectionCard } from 'src/features/bookings/components/Section';
import { useExtras } from 'src/features/builds/api/get-extras';
import { useIntake } from 'src/features/builds/api/get-intake';
import { useTimeEntries } from 'src/features/builds/api/get-time-entries';
import { DeliveryHold } from 'src/features/builds/components/DeliveryHold';
import { ExtrasPanel } from 'src/features/builds/components/ExtrasPanel';
import { HoursPanel } from 'src/features/builds/components/HoursPanel';
import { IntakePanel } from 'src/features/builds/components/IntakePanel';
import { SafetyNote } from 'src/features/builds/components/SafetyNote';
import { StateActions } from 'src/features/builds/components/StateActions';
import { NoteDialog } from 'src/features/builds/components/NoteDialog';
import { useAddNote } from 'src/features/builds/api/add-note';
import { CancelBuildDialog } from 'src/features/builds/components/CancelBuildDialog';
import { RescheduleDialog, type MovableBuild } from 'src/features/builds/components/RescheduleDialog';
import { useMe } from 'src/features/auth/api/get-me';
import { ConversationPanel, MoneyFactsTable } from '@loomwright/shared/ui';
import { formatMoney, formatStamp } from 'src/lib/format';

export function Component() {
  const { bookingId = '' } = useParams();
  const booking = useBooking(bookingId);
  const intake = useIntake(bookingId);
  const entries = useTimeEntries(bookingId);
  const extras = useExtras(bookingId);
  const me = useMe();
  const isOwner = me.data?.role === 'owner';
  const [notice, setNotice] = useState<string | null>(null);
  const [noting, setNoting] = useState(false);
  const addNote = useAddNote(bookingId);
  const [moving, setMoving] = useState<MovableBuild | null>(null);
  const [cancelling, setCancelling] = useState<{ id: string; reference: string } | null>(null);

  if (booking.isPending) return <PageLoading />;
  if (booking.error || !booking.data)
    return <ErrorNote error={booking.error ?? new Error('This build was not found.')} action="Go back to the list of builds." />;
  const b = booking.data;

  return (
    <Stack gap={2}>
      <Breadcrumbs sx={{ p: 0 }}>
        <Link component={RouterLink} to="/builds">
          Builds
        </Link>
        <Typography>{b.reference}</Typography>
      </Breadcrumbs>
      <Stack direction="row" gap={2} alignItems="center" flexWrap="wrap">
        <Typography level="h3" component="h1">
          {b.reference} · {b.customer.name}
        </Typography>
        <StateChip state={b.state} />
        {bookingStateLabels[b.state] !== shortStateLabels[b.state] && (
          <Typography level="body-sm">{bookingStateLabels[b.state]}</Typography>
        )}
        <Box sx={{ flex: 1 }} />
        <Button component="a" href={`/api/bookings/${b.id}/build-sheet`} target="_blank" rel="noopener" variant="outlined" color="neutral">
          Print the build sheet (PDF)
        </Button>
      </Stack>
      <DeliveryHold booking={b} isOwner={isOwner} onDone={setNotice} />
      <Card variant="outlined">
        <Typography level="title-md" component="h2">
          Next step
        </Typography>
        <StateActions booking={b} intake={intake.data} isOwner={isOwner} onDone={setNotice} />
        {(['scheduled', 'pedals_received', 'on_bench'] as const).some((s) => s === b.state) && (
          <Stack direction="row" gap={1} flexWrap="wrap" sx={{ mt: 1 }}>
            {b.state !== 'on_bench' && (
              <Button
                variant="outlined"
                color="neutral"
                onClick={() =>
                  setMoving({ bookingId: b.id, reference: b.reference, builderId: b.builder?.id ?? null, benchDate: b.benchDate })
                }
              >
                Move or reassign
              </Button>
            )}
            {isOwner && (
              <Button variant="outlined" color="danger" onClick={() => setCancelling({ id: b.id, reference: b.reference })}>
                Cancel the build
              </Button>
            )}
          </Stack>
        )}
        {b.priceConsent === 'pending' && (
          <Typography level="body-sm" sx={{ mt: 1 }}>
            Waiting for the player to agree to the firm total, which is above the estimate they were quoted.
          </Typography>
        )}
      </Card>
      <Box
        sx={{
          display: 'grid',
          gridTemplateColumns: { xs: 'minmax(0, 1fr)', lg: 'minmax(0, 3fr) minmax(320px, 2fr)' },
          gap: 2,
          alignItems: 'start',
        }}
      >
        <Stack gap={2}>
          <SectionCard title="Intake">
            <IntakePanel booking={b} intake={intake.data} />
            <ErrorNote error={intake.error} />
          </SectionCard>
          <SectionCard title="Hours">
            <HoursPanel booking={b} entries={entries.data} meId={me.data?.id} isOwner={isOwner} />
            <ErrorNote error={entries.error} />
          </SectionCard>
          <SectionCard title="Extras">
            <ExtrasPanel booking={b} extras={extras.data} isOwner={isOwner} />
            <ErrorNote error={extras.error} />
          </SectionCard>
          <SectionCard title="The rig">
            <ConfigurationSummary booking={b} />
          </SectionCard>
          <SectionCard title={b.firmQuote ? 'Firm quote' : 'Estimate'}>
            <EstimateLines quote={b.firmQuote ?? b.quote} />
          </SectionCard>
          <SectionCard title="Photos">
            <PhotoGrid photos={b.photos} />
          </SectionCard>
          <SectionCard title="Messages with the player">
            {isOwner || (me.data && b.builder?.userId === me.data.id) ? (
              <ConversationPanel bookingId={b.id} otherSide="the player" />
            ) : (
              <Typography level="body-sm">{messageWords.notYourThread}</Typography>
            )}
          </SectionCard>
        </Stack>
        <Stack gap={2}>
          <SectionCard title="Booking">
            <BookingFacts booking={b} />
          </SectionCard>
          <SectionCard title="Money">
            <MoneyFactsTable money={b.money} formatMoney={formatMoney} formatMoment={formatStamp} />
            <Typography level="title-sm" component="h3">
              Checkout attempts
            </Typography>
            <PaymentsList payments={b.payments} />
          </SectionCard>
          <SectionCard title="History: who did what when">
            <Button size="sm" variant="outlined" color="neutral" onClick={() => setNoting(true)} sx={{ alignSelf: 'flex-start' }}>
              Add a note…
            </Button>
            <EventTimeline events={b.events} />
          </SectionCard>
          <SafetyNote />
        </Stack>
      </Box>
      <NoteDialog
        open={noting}
        title={`A note on ${b.reference}`}
        label="Note"
        canTellPlayer
        confirm="Keep the note"
        pending={addNote.isPending}
        error={addNote.error}
        onClose={() => setNoting(false)}
        onConfirm={(note, tellPlayer) =>
          note &&
          addNote.mutate(
            { note, ...(tellPlayer ? { tellPlayer } : {}) },
            {
              onSuccess: () => {
                setNotice(tellPlayer ? `${b.reference}: note sent to the player.` : `${b.reference}: internal note kept.`);
                setNoting(false);
              },
            },
          )
        }
      />
      <RescheduleDialog build={moving} isOwner={isOwner} onClose={() => setMoving(null)} onMoved={setNotice} />
      <CancelBuildDialog booking={cancelling} onClose={() => setCancelling(null)} onCancelled={setNotice} />
      <Notice message={notice} onClose={() => setNotice(null)} />
    </Stack>
  );
}
