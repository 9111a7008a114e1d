import { zodResolver } from '@hookform/resolvers/zod';
import Alert from '@mui/joy/Alert';
import Box from '@mui/joy/Box';
import Button from '@mui/joy/Button';
import Card from '@mui/joy/Card';
import FormControl from '@mui/joy/FormControl';
import FormHelperText from '@mui/joy/FormHelperText';
import FormLabel from '@mui/joy/FormLabel';
import Stack from '@mui/joy/Stack';
import Textarea from '@mui/joy/Textarea';
import Typography from '@mui/joy/Typography';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link as RouterLink, Navigate, useLocation, useNavigate, useSearchParams } from 'react-router';
import { CONFIGURATION_PARAM, decodeConfiguration, levelRank, requestNotesSchema, type RequestNotesInput } from '@loomwright/shared';
import { PageLoading } from 'src/components/PageLoading';
import { ShopUnavailable } from 'src/components/ShopUnavailable';
import { useMe } from 'src/features/auth/api/get-me';
import { LeadTime } from 'src/features/bench/components/LeadTime';
import { useCreateBooking } from 'src/features/bookings/api/create-booking';
import { useEstimate } from 'src/features/configurator/api/create-estimate';
import { startCheckout } from 'src/features/payments/api/start-checkout';
import { DepositPolicy } from 'src/features/payments/components/DepositPolicy';
import { formatAmount, formatHours, formatRange } from 'src/lib/format';
import { ApiErrorAlert, setServerFieldErrors } from '@loomwright/shared/ui';

const NOTES_FIELD = ['notes'] as const;

export function Component() {
  const [params] = useSearchParams();
  const location = useLocation();
  const navigate = useNavigate();
  const encoded = params.get(CONFIGURATION_PARAM) ?? '';
  const configuration = decodeConfiguration(encoded);
  const me = useMe();
  // The whole answer (view `full`): the same cache entry the configurator's Review step filled.
  const estimate = useEstimate(encoded, me.data ? configuration : undefined, 'full');
  const create = useCreateBooking();
  const [redirecting, setRedirecting] = useState(false);
  const [checkoutProblem, setCheckoutProblem] = useState<{ bookingId: string; message: string } | null>(null);
  const form = useForm<RequestNotesInput>({ resolver: zodResolver(requestNotesSchema), defaultValues: { notes: '' } });

  if (me.isPending) return <PageLoading />;
  // Not knowing who is here (the shop is down) is not the same as nobody signed in.
  if (me.isError && !me.data) return <ShopUnavailable error={me.error} />;
  if (!me.data) return <Navigate to={`/sign-in?next=${encodeURIComponent(location.pathname + location.search)}`} replace />;
  if (!configuration) {
    return (
      <Alert color="warning" role="alert" sx={{ maxWidth: 720, mx: 'auto' }}>
        This link does not carry a board configuration. Open the configurator, build your rig, then choose “Request this build” on the
        Review step.
        <Button component={RouterLink} to="/configure" variant="plain">
          Go to Configure
        </Button>
      </Alert>
    );
  }
  if (me.data.role !== 'customer') {
    return (
      <Alert color="warning" role="alert" sx={{ maxWidth: 720, mx: 'auto' }}>
        You are signed in as shop staff; builds are requested from a player's account.
      </Alert>
    );
  }

  const submit = form.handleSubmit(({ notes }) =>
    create.mutate(
      { configuration, notes: notes.trim() || undefined },
      {
        onSuccess: async (booking) => {
          try {
            setRedirecting(true);
            const { url } = await startCheckout(booking.id);
            window.location.assign(url);
          } catch (error) {
            setRedirecting(false);
            setCheckoutProblem({ bookingId: booking.id, message: (error as Error).message });
          }
        },
        onError: (error) => setServerFieldErrors(error, form.setError, NOTES_FIELD),
      },
    ),
  );
  const e = estimate.data;
  const { errors } = form.formState;

  return (
    <Stack gap={3} sx={{ maxWidth: 720, mx: 'auto' }}>
      <Typography level="h1" sx={{ fontSize: 'xl2' }}>
        Request this build
      </Typography>
      <Card variant="outlined">
        <Typography level="title-md" component="h2">
          Your estimate
        </Typography>
        {estimate.isPending && <Typography>Pricing your board…</Typography>}
        {estimate.error && (
          <Alert color="danger" role="alert">
            {estimate.error.message}{' '}
            <Button component={RouterLink} to={`/configure?${CONFIGURATION_PARAM}=${encoded}`} variant="plain">
              Back to Configure
            </Button>
          </Alert>
        )}
        {e && (
          <Box
            component="dl"
            sx={{ display: 'grid', gridTemplateColumns: 'auto 1fr', columnGap: 2, rowGap: 0.5, m: 0, fontVariantNumeric: 'tabular-nums' }}
          >
            <Typography component="dt">Total</Typography>
            <Typography component="dd" level="title-lg" sx={{ m: 0 }}>
              {formatRange(e.totalLow, e.totalHigh, e.currency)}
            </Typography>
            <Typography component="dt">Labor</Typography>
            <Typography component="dd" sx={{ m: 0 }}>
              {formatRange(e.laborLow, e.laborHigh, e.currency)} ({formatHours(e.laborHours)})
            </Typography>
            <Typography component="dt">Materials</Typography>
            <Typography component="dd" sx={{ m: 0 }}>
              {formatAmount(e.materialsTotal, e.currency)}
            </Typography>
            <Typography component="dt">Deposit now</Typography>
            <Typography component="dd" level="title-md" sx={{ m: 0 }}>
              {formatAmount(e.deposit, e.currency)}
            </Typography>
          </Box>
        )}
        <Typography level="body-xs">
          The shop prices your request again when it arrives, from the same price book; the firm total follows the builder who takes it on.
        </Typography>
      </Card>

      {e && (
        <Card variant="outlined">
          <Typography level="title-md" component="h2">
            Bench time
          </Typography>
          <LeadTime hours={e.laborHours} level={levelRank(e.minimumLevel) > levelRank(e.level) ? e.minimumLevel : e.level} />
        </Card>
      )}

      <Card variant="outlined">
        <Typography level="title-md" component="h2">
          Deposit
        </Typography>
        <DepositPolicy />
        <Typography level="body-xs">
          We re-terminate the low-voltage DC leads of your supply only. Anything on the mains side (the supply's mains lead, a power inlet
          on the case) is work for a qualified electrician under your local electrical codes.
        </Typography>
      </Card>

      <Stack component="form" gap={2} noValidate onSubmit={submit}>
        <FormControl error={!!errors.notes}>
          <FormLabel>Notes for the shop (optional)</FormLabel>
          <Textarea
            minRows={3}
            {...form.register('notes')}
            placeholder="Pedal order, how you use the board, anything the builder should know."
          />
          {errors.notes && <FormHelperText>{errors.notes.message}</FormHelperText>}
        </FormControl>
        <Button
          type="submit"
          color="accent"
          size="lg"
          loading={create.isPending || redirecting}
          disabled={!e}
          sx={{ alignSelf: 'flex-start' }}
        >
          Request build and pay deposit
        </Button>
        <Typography level="body-xs">You pay on the payment provider's secure page and come back here afterwards.</Typography>
      </Stack>
      <ApiErrorAlert error={create.error} fields={NOTES_FIELD} />
      {checkoutProblem && (
        <Alert color="warning" role="alert">
          Your request is saved, but the payment page could not be opened: {checkoutProblem.message}
          <Button variant="plain" onClick={() => navigate(`/builds/${checkoutProblem.bookingId}`)}>
            Open the build to pay
          </Button>
        </Alert>
      )}
    </Stack>
  );
}
