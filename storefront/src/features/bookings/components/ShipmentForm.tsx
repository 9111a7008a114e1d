import { zodResolver } from '@hookform/resolvers/zod';
import Button from '@mui/joy/Button';
import FormControl from '@mui/joy/FormControl';
import FormHelperText from '@mui/joy/FormHelperText';
import FormLabel from '@mui/joy/FormLabel';
import Input from '@mui/joy/Input';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { useForm } from 'react-hook-form';
import { shipmentSchema, type ShipmentInput } from '@loomwright/shared';
import { useRecordShipment } from 'src/features/bookings/api/record-shipment';
import { ApiErrorAlert, setServerFieldErrors } from '@loomwright/shared/ui';

const FIELDS = ['carrier', 'tracking'] as const;

export function ShipmentForm({ bookingId, current }: { bookingId: string; current: { carrier: string; tracking: string } | null }) {
  const record = useRecordShipment();
  const form = useForm<ShipmentInput>({ resolver: zodResolver(shipmentSchema), defaultValues: current ?? { carrier: '', tracking: '' } });
  const { errors } = form.formState;
  return (
    <Stack
      component="form"
      gap={1.5}
      noValidate
      onSubmit={form.handleSubmit((values) =>
        record.mutate({ id: bookingId, ...values }, { onError: (error) => setServerFieldErrors(error, form.setError, FIELDS) }),
      )}
    >
      <Typography level="body-sm">
        Pack each pedal separately, take out any batteries, and label the power supply and any switcher. Unplug the supply from the mains
        before packing; never ship anything still connected.
      </Typography>
      <Stack direction={{ xs: 'column', sm: 'row' }} gap={1.5}>
        <FormControl error={!!errors.carrier} sx={{ flex: 1 }}>
          <FormLabel>Carrier</FormLabel>
          <Input {...form.register('carrier')} placeholder="Parcel post" />
          {errors.carrier && <FormHelperText>{errors.carrier.message}</FormHelperText>}
        </FormControl>
        <FormControl error={!!errors.tracking} sx={{ flex: 1 }}>
          <FormLabel>Tracking number</FormLabel>
          <Input {...form.register('tracking')} />
          {errors.tracking && <FormHelperText>{errors.tracking.message}</FormHelperText>}
        </FormControl>
      </Stack>
      <Button type="submit" variant="outlined" loading={record.isPending} sx={{ alignSelf: 'flex-start' }}>
        {current ? 'Update tracking' : 'Save tracking'}
      </Button>
      {record.isSuccess && (
        <Typography role="status" level="body-sm">
          Saved. The shop will check the parcel in when it arrives.
        </Typography>
      )}
      <ApiErrorAlert error={record.error} fields={FIELDS} />
    </Stack>
  );
}
