import { zodResolver } from '@hookform/resolvers/zod';
import Alert from '@mui/joy/Alert';
import Box from '@mui/joy/Box';
import Button from '@mui/joy/Button';
import Divider from '@mui/joy/Divider';
import FormControl from '@mui/joy/FormControl';
import FormHelperText from '@mui/joy/FormHelperText';
import FormLabel from '@mui/joy/FormLabel';
import IconButton from '@mui/joy/IconButton';
import Input from '@mui/joy/Input';
import Radio from '@mui/joy/Radio';
import RadioGroup from '@mui/joy/RadioGroup';
import Typography from '@mui/joy/Typography';
import { useEffect } from 'react';
import { useFieldArray, useForm } from 'react-hook-form';
import { applyForm, formFromConfiguration, optionalNumber, pedalFormSchema, type PedalForm } from '../../lib/pedal-form';
import { pedalsFromCount } from '../../lib/configuration';
import { BoardFitView } from '../BoardFitView';
import { MinusIcon, PlusIcon } from '../icons';
import { PedalRow } from '../PedalRow';
import { PowerBudgetView } from '../PowerBudgetView';
import { PowerCautions } from '../PowerCautions';
import { PowerOutputsFields } from '../PowerOutputsFields';
import { StepHeading } from '../StepHeading';
import type { StepProps } from './step-props';

export default function PedalsStep({ catalog, configuration, update, live, setLeaveGuard }: StepProps) {
  const form = useForm<PedalForm>({
    resolver: zodResolver(pedalFormSchema),
    defaultValues: formFromConfiguration(configuration),
    mode: 'onChange',
  });
  const { control, register, watch, setValue, getValues, trigger, formState } = form;
  const pedals = useFieldArray({ control, name: 'pedals' });
  const mode = watch('mode');
  const switcher = configuration.routing.mode === 'switcher';

  // Every valid change goes straight into the configuration (and so the URL and the estimate).
  useEffect(() => {
    const subscription = watch((values) => {
      const parsed = pedalFormSchema.safeParse(values);
      if (parsed.success) update((c) => applyForm(c, parsed.data));
    });
    return () => subscription.unsubscribe();
  }, [watch, update]);

  useEffect(() => {
    setLeaveGuard(() => trigger(undefined, { shouldFocus: true }));
    return () => setLeaveGuard(null);
  }, [setLeaveGuard, trigger]);

  const switchMode = (next: 'count' | 'list') => {
    if (next === 'list' && getValues('pedals').length === 0) {
      setValue('pedals', pedalsFromCount(getValues('pedalCount') || 1), { shouldValidate: true });
    }
    if (next === 'count') setValue('pedalCount', getValues('pedals').length || getValues('pedalCount') || 1, { shouldValidate: true });
    setValue('mode', next, { shouldValidate: true });
  };

  const count = watch('pedalCount');
  const checks = live.estimate?.checks;

  return (
    <>
      <StepHeading title="Your pedals and their power">
        Tell us what goes on the board. A quick count is enough for a first price; list each pedal to check its power and fit with your own
        figures.
      </StepHeading>

      <Box sx={{ mb: 3 }}>
        <Typography id="pedal-mode-label" level="title-sm" component="p" sx={{ mb: 1 }}>
          How do you want to describe them?
        </Typography>
        <RadioGroup
          aria-labelledby="pedal-mode-label"
          orientation="horizontal"
          value={mode}
          onChange={(e) => switchMode(e.target.value as 'count' | 'list')}
          sx={{ gap: 3, flexWrap: 'wrap' }}
        >
          <Radio value="count" label="Quick count" disabled={switcher} />
          <Radio value="list" label="List each pedal" />
        </RadioGroup>
        {switcher ? (
          <Typography level="body-sm" sx={{ mt: 0.5 }}>
            A switcher board needs the list, so we know which pedals sit in loops.
          </Typography>
        ) : null}
      </Box>

      {mode === 'count' ? (
        <FormControl error={!!formState.errors.pedalCount} sx={{ maxWidth: 360 }}>
          <FormLabel>Number of pedals</FormLabel>
          <Box sx={{ display: 'flex', gap: 1, alignItems: 'center' }}>
            <IconButton
              variant="outlined"
              aria-label="One pedal fewer"
              disabled={!count || count <= 1}
              onClick={() => setValue('pedalCount', Math.max(1, (count || 1) - 1), { shouldValidate: true })}
            >
              <MinusIcon />
            </IconButton>
            <Input
              type="number"
              slotProps={{ input: { min: 1, max: 60, inputMode: 'numeric' } }}
              sx={{ width: 96, fontVariantNumeric: 'tabular-nums' }}
              {...register('pedalCount', { setValueAs: optionalNumber })}
            />
            <IconButton
              variant="outlined"
              aria-label="One pedal more"
              onClick={() => setValue('pedalCount', Math.min(60, (count || 0) + 1), { shouldValidate: true })}
            >
              <PlusIcon />
            </IconButton>
          </Box>
          <FormHelperText>
            {formState.errors.pedalCount?.message ?? 'Priced as plain powered pedals, one after another in series.'}
          </FormHelperText>
        </FormControl>
      ) : (
        <Box>
          <Box component="ol" sx={{ listStyle: 'none', p: 0, m: 0, display: 'grid', gap: 1.5 }} aria-label="Your pedals, in signal order">
            {pedals.fields.map((field, index) => (
              <PedalRow
                key={field.id}
                index={index}
                total={pedals.fields.length}
                form={form}
                onMove={(to) => pedals.move(index, to)}
                onRemove={() => pedals.remove(index)}
                startOpen={field.name === ''}
              />
            ))}
          </Box>
          {formState.errors.pedals?.message || formState.errors.pedals?.root?.message ? (
            <Typography role="alert" sx={{ color: 'danger.700', mt: 1 }}>
              {formState.errors.pedals?.message ?? formState.errors.pedals?.root?.message}
            </Typography>
          ) : null}
          <Button
            variant="outlined"
            startDecorator={<PlusIcon />}
            sx={{ mt: 2 }}
            onClick={() =>
              pedals.append(
                { name: '', kind: 'compact', powered: true, inLoop: false },
                { shouldFocus: true, focusName: `pedals.${pedals.fields.length}.name` },
              )
            }
          >
            Add a pedal
          </Button>
        </Box>
      )}

      <Divider sx={{ my: 4 }} />
      <PowerOutputsFields form={form} />

      <Box sx={{ mt: 3, display: 'grid', gap: 3 }}>
        {checks?.powerBudget ? (
          <Box aria-live="polite">
            <PowerBudgetView budget={checks.powerBudget} />
          </Box>
        ) : null}
        <PowerCautions />
        {checks?.boardFit ? (
          <>
            <Divider />
            <BoardFitView fit={checks.boardFit} catalog={catalog} />
          </>
        ) : null}
        {live.error && !checks ? (
          <Alert color="danger" variant="soft">
            The checks could not be run: {live.error.message}
          </Alert>
        ) : null}
      </Box>
    </>
  );
}
