import Box from '@mui/joy/Box';
import Button from '@mui/joy/Button';
import Card from '@mui/joy/Card';
import Checkbox from '@mui/joy/Checkbox';
import FormControl from '@mui/joy/FormControl';
import FormHelperText from '@mui/joy/FormHelperText';
import FormLabel from '@mui/joy/FormLabel';
import IconButton from '@mui/joy/IconButton';
import Input from '@mui/joy/Input';
import Typography from '@mui/joy/Typography';
import { Controller, useFieldArray, type UseFormReturn } from 'react-hook-form';
import { optionalNumber, type PedalForm } from '../lib/pedal-form';
import { PlusIcon, RemoveIcon } from './icons';

/** The player's own supply, output by output (optional: without it we only total the draw). */
export function PowerOutputsFields({ form }: { form: UseFormReturn<PedalForm> }) {
  const { control, register, formState } = form;
  const outputs = useFieldArray({ control, name: 'outputs' });
  return (
    <Box component="section" aria-labelledby="supply-heading">
      <Typography level="title-lg" component="h3" id="supply-heading">
        Your power supply (optional)
      </Typography>
      <Typography level="body-sm" sx={{ mt: 0.5, mb: 2, maxWidth: 640 }}>
        List each output as printed on the supply: its voltage and its current rating in mA. An <b>isolated output</b> has its own ground,
        separate from the other outputs; it keeps digital pedals from adding hum to the rest.
      </Typography>
      <Box component="ol" sx={{ listStyle: 'none', p: 0, m: 0, display: 'grid', gap: 1 }} aria-label="Supply outputs">
        {outputs.fields.map((field, index) => {
          const errors = formState.errors.outputs?.[index];
          const n = index + 1;
          return (
            <Card
              component="li"
              key={field.id}
              variant="outlined"
              sx={{
                p: 1.5,
                display: 'grid',
                gap: 1.5,
                gridTemplateColumns: { xs: 'repeat(2, minmax(0, 1fr))', md: 'minmax(0, 2fr) minmax(0, 1fr) minmax(0, 1fr) auto auto' },
                '& .MuiInput-root': { minWidth: 0 },
                alignItems: 'end',
              }}
            >
              <FormControl sx={{ gridColumn: { xs: '1 / -1', md: 'auto' } }}>
                <FormLabel>Output {n} name</FormLabel>
                <Input
                  placeholder={`Output ${n}`}
                  {...register(`outputs.${index}.label`, { setValueAs: (v) => (v === '' ? undefined : v) })}
                />
              </FormControl>
              <FormControl error={!!errors?.voltage}>
                <FormLabel>Voltage (V)</FormLabel>
                <Input type="number" {...register(`outputs.${index}.voltage`, { setValueAs: optionalNumber })} />
                {errors?.voltage ? <FormHelperText>{errors.voltage.message}</FormHelperText> : null}
              </FormControl>
              <FormControl error={!!errors?.currentMa}>
                <FormLabel>Rating (mA)</FormLabel>
                <Input type="number" {...register(`outputs.${index}.currentMa`, { setValueAs: optionalNumber })} />
                {errors?.currentMa ? <FormHelperText>{errors.currentMa.message}</FormHelperText> : null}
              </FormControl>
              <Controller
                control={control}
                name={`outputs.${index}.isolated`}
                render={({ field: f }) => (
                  <Checkbox label="Isolated" checked={!!f.value} onChange={(e) => f.onChange(e.target.checked)} sx={{ pb: 1 }} />
                )}
              />
              <IconButton variant="outlined" color="danger" aria-label={`Remove output ${n}`} onClick={() => outputs.remove(index)}>
                <RemoveIcon />
              </IconButton>
            </Card>
          );
        })}
      </Box>
      <Button
        variant="outlined"
        startDecorator={<PlusIcon />}
        sx={{ mt: 1.5 }}
        onClick={() => outputs.append({ voltage: 9, currentMa: 500, isolated: true })}
      >
        Add a supply output
      </Button>
    </Box>
  );
}
