import Box from '@mui/joy/Box';
import Button from '@mui/joy/Button';
import Card from '@mui/joy/Card';
import Checkbox from '@mui/joy/Checkbox';
import FormControl from '@mui/joy/FormControl';
import FormHelperText from '@mui/joy/FormHelperText';
import FormLabel from '@mui/joy/FormLabel';
import IconButton from '@mui/joy/IconButton';
import Input from '@mui/joy/Input';
import Option from '@mui/joy/Option';
import Select from '@mui/joy/Select';
import Typography from '@mui/joy/Typography';
import { useId, useState } from 'react';
import { Controller, type FieldError, type UseFormReturn } from 'react-hook-form';
import { typicalHardware, type PedalKind } from '@loomwright/shared';
import { optionalNumber, outputName, type PedalForm } from '../lib/pedal-form';
import { ArrowDownIcon, ArrowUpIcon, RemoveIcon } from './icons';

/** The switcher is chosen on the Routing step, so it is not offered as a pedal kind here. */
const kinds = (Object.keys(typicalHardware) as PedalKind[]).filter((k) => k !== 'switcher');

/** One pedal of the list: a one-line summary, and its fields when opened. */
export function PedalRow({
  index,
  total,
  form,
  onMove,
  onRemove,
  startOpen,
}: {
  index: number;
  total: number;
  form: UseFormReturn<PedalForm>;
  onMove: (to: number) => void;
  onRemove: () => void;
  startOpen: boolean;
}) {
  const [open, setOpen] = useState(startOpen);
  const id = useId();
  const { register, control, watch, formState } = form;
  const pedal = watch(`pedals.${index}`);
  const outputs = watch('outputs') ?? [];
  const errors = formState.errors.pedals?.[index];
  const hasErrors = !!errors && Object.keys(errors).length > 0;
  const typical = typicalHardware[pedal?.kind ?? 'other'];
  const name = pedal?.name?.trim() || `Pedal ${index + 1}`;

  const summary = [
    pedal?.kind ? typicalHardware[pedal.kind].label : null,
    pedal?.powered ? `${pedal.voltage ?? 9} V ${pedal.supply === 'ac' ? 'AC' : 'DC'}` : 'no power',
    pedal?.powered ? (pedal.currentMa !== undefined ? `${pedal.currentMa} mA` : 'draw not given') : null,
    pedal?.widthMm && pedal?.depthMm ? `${pedal.widthMm} × ${pedal.depthMm} mm` : null,
    pedal?.powered && pedal.powerOutput !== undefined && outputs[pedal.powerOutput]
      ? `pinned to ${outputs[pedal.powerOutput].label || `output ${pedal.powerOutput + 1}`}`
      : null,
  ]
    .filter(Boolean)
    .join(' · ');

  const numberField = (field: 'currentMa' | 'voltage' | 'widthMm' | 'depthMm', label: string, placeholder: string, error?: FieldError) => (
    <FormControl error={!!error}>
      <FormLabel>{label}</FormLabel>
      <Input
        type="number"
        placeholder={placeholder}
        slotProps={{ input: { inputMode: 'decimal' } }}
        sx={{ fontVariantNumeric: 'tabular-nums' }}
        {...register(`pedals.${index}.${field}`, { setValueAs: optionalNumber })}
      />
      {error ? <FormHelperText>{error.message}</FormHelperText> : null}
    </FormControl>
  );

  return (
    <Card component="li" variant="outlined" sx={{ gap: 1.5, p: 1.5, borderColor: hasErrors ? 'danger.400' : 'neutral.200' }}>
      <Box sx={{ display: 'flex', alignItems: 'center', gap: 1, flexWrap: 'wrap' }}>
        <Typography
          level="body-sm"
          sx={{ fontVariantNumeric: 'tabular-nums', fontWeight: 'lg', color: 'primary.700', minWidth: '1.5rem' }}
          aria-hidden
        >
          {index + 1}
        </Typography>
        <Box sx={{ flex: '1 1 180px', minWidth: 0 }}>
          <Typography level="title-sm" component="h3">
            {name}
          </Typography>
          <Typography level="body-xs" sx={{ fontVariantNumeric: 'tabular-nums' }}>
            {summary}
          </Typography>
          {hasErrors && !open ? (
            <Typography level="body-xs" sx={{ color: 'danger.700', fontWeight: 'md' }}>
              Needs a fix: open it to see what.
            </Typography>
          ) : null}
        </Box>
        <Box sx={{ display: 'flex', gap: 0.5 }}>
          <Button
            size="sm"
            variant={open ? 'solid' : 'outlined'}
            aria-expanded={open}
            aria-controls={`${id}-fields`}
            aria-label={`${open ? 'Done editing' : 'Edit'} ${name}`}
            onClick={() => setOpen((o) => !o)}
          >
            {open ? 'Done' : 'Edit'}
          </Button>
          <IconButton size="sm" variant="outlined" aria-label={`Move ${name} up`} disabled={index === 0} onClick={() => onMove(index - 1)}>
            <ArrowUpIcon />
          </IconButton>
          <IconButton
            size="sm"
            variant="outlined"
            aria-label={`Move ${name} down`}
            disabled={index === total - 1}
            onClick={() => onMove(index + 1)}
          >
            <ArrowDownIcon />
          </IconButton>
          <IconButton size="sm" variant="outlined" color="danger" aria-label={`Remove ${name}`} onClick={onRemove}>
            <RemoveIcon />
          </IconButton>
        </Box>
      </Box>
      <Box
        id={`${id}-fields`}
        hidden={!open}
        sx={{
          display: open ? 'grid' : 'none',
          gap: 1.5,
          gridTemplateColumns: { xs: 'minmax(0, 1fr)', sm: 'repeat(2, minmax(0, 1fr))', lg: 'repeat(4, minmax(0, 1fr))' },
          '& .MuiSelect-root, & .MuiInput-root': { minWidth: 0 },
        }}
      >
        <FormControl error={!!errors?.name} sx={{ gridColumn: { sm: 'span 2' } }}>
          <FormLabel>Name or type</FormLabel>
          <Input placeholder="e.g. fuzz, analog delay" {...register(`pedals.${index}.name`)} />
          {errors?.name ? <FormHelperText>{errors.name.message}</FormHelperText> : null}
        </FormControl>
        <FormControl sx={{ gridColumn: { sm: 'span 2' } }}>
          <FormLabel>Size and sort</FormLabel>
          <Controller
            control={control}
            name={`pedals.${index}.kind`}
            render={({ field }) => (
              <Select value={field.value ?? 'other'} onChange={(_, v) => field.onChange(v ?? undefined)} onBlur={field.onBlur}>
                {kinds.map((k) => (
                  <Option key={k} value={k}>
                    {typicalHardware[k].label} ({typicalHardware[k].widthMm} × {typicalHardware[k].depthMm} mm)
                  </Option>
                ))}
              </Select>
            )}
          />
        </FormControl>
        <Controller
          control={control}
          name={`pedals.${index}.powered`}
          render={({ field }) => (
            <Checkbox
              label="Needs power"
              checked={!!field.value}
              onChange={(e) => field.onChange(e.target.checked)}
              onBlur={field.onBlur}
              sx={{ alignSelf: 'end', pb: 1 }}
            />
          )}
        />
        {numberField('currentMa', 'Current draw (mA)', `typical ${typical.currentMa}`, errors?.currentMa)}
        {numberField('voltage', 'Voltage (V)', '9', errors?.voltage)}
        <FormControl>
          <FormLabel>Plug polarity</FormLabel>
          <Controller
            control={control}
            name={`pedals.${index}.polarity`}
            render={({ field }) => (
              <Select value={field.value ?? 'center_negative'} onChange={(_, v) => field.onChange(v ?? undefined)}>
                <Option value="center_negative">Centre negative (most pedals)</Option>
                <Option value="center_positive">Centre positive</Option>
              </Select>
            )}
          />
        </FormControl>
        <FormControl>
          <FormLabel>Current type</FormLabel>
          <Controller
            control={control}
            name={`pedals.${index}.supply`}
            render={({ field }) => (
              <Select value={field.value ?? 'dc'} onChange={(_, v) => field.onChange(v ?? undefined)}>
                <Option value="dc">DC (most pedals)</Option>
                <Option value="ac">AC</Option>
              </Select>
            )}
          />
        </FormControl>
        <Controller
          control={control}
          name={`pedals.${index}.digital`}
          render={({ field }) => (
            <Checkbox
              label="Digital (wants an output of its own)"
              checked={field.value ?? pedal?.kind === 'large_digital'}
              onChange={(e) => field.onChange(e.target.checked)}
              onBlur={field.onBlur}
              sx={{ alignSelf: 'end', pb: 1 }}
            />
          )}
        />
        <FormControl sx={{ gridColumn: { sm: 'span 2' } }}>
          <FormLabel>Supply output</FormLabel>
          <Controller
            control={control}
            name={`pedals.${index}.powerOutput`}
            render={({ field }) => (
              <Select
                value={field.value ?? -1}
                onChange={(_, v) => field.onChange(v === null || v === -1 ? undefined : v)}
                disabled={!pedal?.powered || outputs.length === 0}
                slotProps={{ button: { 'aria-label': `Supply output for ${name}` } }}
              >
                <Option value={-1}>{outputs.length ? 'Let the plan choose' : 'List your supply below first'}</Option>
                {outputs.map((o, i) => (
                  <Option key={i} value={i}>
                    {outputName(o, i)}
                  </Option>
                ))}
              </Select>
            )}
          />
          <FormHelperText>Pin it to an output you already use for it; the plan keeps your choice and checks it.</FormHelperText>
        </FormControl>
        {numberField('widthMm', 'Width (mm)', String(typical.widthMm), errors?.widthMm)}
        {numberField('depthMm', 'Depth (mm)', String(typical.depthMm), errors?.depthMm)}
        <Typography level="body-xs" sx={{ gridColumn: '1 / -1' }}>
          Leave a figure empty if you don’t know it: we use a typical one for the size you picked and say so. The pedal’s own label or
          manual has the real ones.
        </Typography>
      </Box>
    </Card>
  );
}
