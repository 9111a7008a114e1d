import Box from '@mui/joy/Box';
import FormControl from '@mui/joy/FormControl';
import FormHelperText from '@mui/joy/FormHelperText';
import FormLabel from '@mui/joy/FormLabel';
import Input from '@mui/joy/Input';
import Option from '@mui/joy/Option';
import Select from '@mui/joy/Select';
import Typography from '@mui/joy/Typography';
import { useState } from 'react';
import { switcherInputSchema, typicalHardware, type RigConfiguration, type SwitcherInput } from '@loomwright/shared';
import { outputName } from '../lib/pedal-form';

type NumberField = 'currentMa' | 'voltage';

/**
 * The player's own switcher: its draw and voltage from its label, and the output it should take.
 * Each figure is checked with the API's own schema, so a bad one is refused here in the same words.
 */
export function SwitcherPowerFields({
  configuration,
  update,
}: {
  configuration: RigConfiguration;
  update: (change: (c: RigConfiguration) => RigConfiguration) => void;
}) {
  const own = configuration.routing.switcher ?? {};
  const outputs = configuration.powerSupply?.outputs ?? [];
  const [text, setText] = useState<Record<NumberField, string>>({
    currentMa: own.currentMa?.toString() ?? '',
    voltage: own.voltage?.toString() ?? '',
  });
  const [errors, setErrors] = useState<Partial<Record<NumberField, string>>>({});

  const set = (patch: Partial<SwitcherInput>) =>
    update((c) => {
      const next: SwitcherInput = { ...(c.routing.switcher ?? {}), ...patch };
      for (const key of Object.keys(next) as Array<keyof SwitcherInput>) if (next[key] === undefined) delete next[key];
      return { ...c, routing: { ...c.routing, switcher: next } };
    });

  const change = (field: NumberField, value: string) => {
    setText((t) => ({ ...t, [field]: value }));
    if (value.trim() === '') {
      setErrors((e) => ({ ...e, [field]: undefined }));
      return set({ [field]: undefined });
    }
    const parsed = switcherInputSchema.shape[field].safeParse(Number(value));
    if (!parsed.success) return setErrors((e) => ({ ...e, [field]: parsed.error.issues[0]?.message }));
    setErrors((e) => ({ ...e, [field]: undefined }));
    set({ [field]: parsed.data });
  };

  return (
    <Box component="fieldset" sx={{ border: 0, p: 0, m: 0, mt: 4 }}>
      <Typography component="legend" level="title-lg">
        Your switcher’s power
      </Typography>
      <Typography level="body-sm" sx={{ mb: 2, maxWidth: 640 }}>
        A switcher is digital, so it gets a supply output of its own. Its label or manual gives its draw; without it we plan
        {` ${typicalHardware.switcher.currentMa} mA`} (a typical figure).
      </Typography>
      <Box
        sx={{
          display: 'grid',
          gap: 1.5,
          gridTemplateColumns: { xs: 'minmax(0, 1fr)', sm: 'repeat(2, minmax(0, 1fr))', md: 'repeat(3, minmax(0, 1fr))' },
          maxWidth: 720,
          '& .MuiSelect-root, & .MuiInput-root': { minWidth: 0 },
        }}
      >
        <FormControl error={!!errors.currentMa}>
          <FormLabel>Switcher draw (mA)</FormLabel>
          <Input
            type="number"
            value={text.currentMa}
            placeholder={`typical ${typicalHardware.switcher.currentMa}`}
            onChange={(e) => change('currentMa', e.target.value)}
            slotProps={{ input: { inputMode: 'decimal' } }}
          />
          {errors.currentMa ? <FormHelperText>{errors.currentMa}</FormHelperText> : null}
        </FormControl>
        <FormControl error={!!errors.voltage}>
          <FormLabel>Switcher voltage (V)</FormLabel>
          <Input
            type="number"
            value={text.voltage}
            placeholder="9"
            onChange={(e) => change('voltage', e.target.value)}
            slotProps={{ input: { inputMode: 'decimal' } }}
          />
          {errors.voltage ? <FormHelperText>{errors.voltage}</FormHelperText> : null}
        </FormControl>
        <FormControl sx={{ gridColumn: { sm: '1 / -1', md: 'auto' }, minWidth: 0 }}>
          <FormLabel>Supply output</FormLabel>
          <Select
            value={own.powerOutput ?? -1}
            onChange={(_, v) => set({ powerOutput: v === null || v === -1 ? undefined : v })}
            disabled={outputs.length === 0}
            slotProps={{ button: { 'aria-label': 'Supply output for the switcher' } }}
          >
            <Option value={-1}>{outputs.length ? 'Let the plan choose' : 'List your supply on the Pedals step'}</Option>
            {outputs.map((o, i) => (
              <Option key={i} value={i}>
                {outputName(o, i)}
              </Option>
            ))}
          </Select>
        </FormControl>
      </Box>
    </Box>
  );
}
