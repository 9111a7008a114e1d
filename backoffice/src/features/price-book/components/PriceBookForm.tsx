import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import Card from '@mui/joy/Card';
import FormControl from '@mui/joy/FormControl';
import FormHelperText from '@mui/joy/FormHelperText';
import FormLabel from '@mui/joy/FormLabel';
import Input from '@mui/joy/Input';
import Stack from '@mui/joy/Stack';
import Textarea from '@mui/joy/Textarea';
import Typography from '@mui/joy/Typography';
import { builderLevels, priceBookSchema, type PriceBook } from '@loomwright/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useState, type ReactNode } from 'react';
import { useForm, type FieldErrors, type FieldPath, type Resolver, type UseFormReturn } from 'react-hook-form';
import { setServerFieldErrors } from '@loomwright/shared/ui';
import { ErrorNote } from 'src/components/ErrorNote';
import { usePublishPriceBook } from '../api/publish-price-book';
import { ListEditor } from './ListEditor';

const materialFields: Array<[keyof PriceBook['materials'], string, string]> = [
  ['fastenersPerPedalSerial', 'Fasteners per pedal, serial board', '$'],
  ['fastenersPerPedalSwitcher', 'Fasteners per pedal, switcher board', '$'],
  ['hookAndLoopFeetPerPedal', 'Hook-and-loop feet per pedal', 'ft'],
  ['hookAndLoopPricePerFoot', 'Hook-and-loop price per foot', '$'],
  ['cablePricePerFoot', 'Patch cable price per foot', '$'],
  ['plugPrice', 'Plug price (two per patch cable)', '$'],
  ['patchLengthFeet', 'Patch cable length', 'ft'],
  ['spareFeetPerPatch', 'Spare cable per patch', 'ft'],
  ['barrelPlugPrice', 'DC barrel plug per powered device', '$'],
];

/** Every message zod gave, flattened, so the owner sees what to fix in words. */
function messagesOf(errors: FieldErrors, into: string[] = []): string[] {
  for (const value of Object.values(errors)) {
    if (!value) continue;
    if (typeof (value as { message?: unknown }).message === 'string') into.push((value as { message: string }).message);
    else if (typeof value === 'object') messagesOf(value as FieldErrors, into);
  }
  return [...new Set(into)];
}

/** The book's parts, as the publish route names them under `book`: a refusal of one stands under its field. */
const BOOK_FIELDS = [
  'currency',
  'surfaces',
  'cases',
  'materials',
  'labor',
  'functions',
  'levels',
  'depositPolicy',
  'power',
] as const satisfies ReadonlyArray<keyof PriceBook>;

/** One figure of the book: its label, its unit beside it, and what is wrong with it (the browser's check or the API's) below. */
function BookField({
  form,
  name,
  label,
  unit,
  hint,
  disabled,
  width,
}: {
  form: UseFormReturn<PriceBook>;
  name: FieldPath<PriceBook>;
  label: string;
  unit?: string;
  hint?: string;
  disabled: boolean;
  width: number;
}) {
  const { error } = form.getFieldState(name, form.formState);
  const message = error?.message ?? hint;
  return (
    <FormControl disabled={disabled} error={Boolean(error)} sx={{ width }}>
      <FormLabel>{label}</FormLabel>
      <Input {...(unit === '$' ? { startDecorator: '$' } : unit ? { endDecorator: unit } : {})} {...form.register(name)} />
      {message && <FormHelperText>{message}</FormHelperText>}
    </FormControl>
  );
}

function Block({ title, hint, children }: { title: string; hint?: string; children: ReactNode }) {
  return (
    <Card variant="outlined" sx={{ gap: 1 }}>
      <Typography level="title-md" component="h2">
        {title}
      </Typography>
      {hint && <Typography level="body-xs">{hint}</Typography>}
      {children}
    </Card>
  );
}

export function PriceBookForm({
  book,
  version,
  canEdit,
  onPublished,
}: {
  book: PriceBook;
  version: number;
  canEdit: boolean;
  onPublished: (m: string) => void;
}) {
  const publish = usePublishPriceBook();
  const form = useForm<PriceBook>({ resolver: zodResolver(priceBookSchema) as unknown as Resolver<PriceBook>, defaultValues: book });
  const [notes, setNotes] = useState('');
  // Reset when a different book arrives (a publish); useForm's reset keeps one identity.
  const { reset: resetForm } = form;
  useEffect(() => resetForm(book), [book, resetForm]);
  const disabled = !canEdit;
  const editor = { control: form.control, register: form.register, disabled };
  const descriptionError = form.formState.errors.depositPolicy?.description;
  const problems = messagesOf(form.formState.errors);
  const levelOptions = builderLevels.map((l) => ({ value: l, label: l }));

  const submit = form.handleSubmit((values) =>
    publish.mutate(
      { book: values, notes },
      {
        onSuccess: (published) => {
          setNotes('');
          onPublished(`Price book version ${published.version} is published; new estimates use it.`);
        },
        onError: (error) => setServerFieldErrors(error, form.setError, BOOK_FIELDS, { from: 'book' }),
      },
    ),
  );

  return (
    <Stack component="form" gap={2} noValidate onSubmit={submit}>
      <Alert variant="soft" color="primary">
        Publishing saves a new version (now version {version}). Quotes already given keep the version they were priced from, so nothing a
        player has been told changes.
      </Alert>
      <Block
        title="Deposit policy"
        hint="A share of the high end of the estimate, never below the minimum; the player reads the description before paying."
      >
        <Stack direction="row" gap={1.5} flexWrap="wrap">
          <BookField form={form} name="depositPolicy.percent" label="Share (%)" unit="%" disabled={disabled} width={140} />
          <BookField form={form} name="depositPolicy.minimum" label="Minimum" unit="$" disabled={disabled} width={160} />
          <FormControl disabled={disabled} error={Boolean(descriptionError)} sx={{ flex: 1, minWidth: 280 }}>
            <FormLabel>What the player reads</FormLabel>
            <Textarea minRows={2} {...form.register('depositPolicy.description')} />
            {descriptionError && <FormHelperText>{descriptionError.message}</FormHelperText>}
          </FormControl>
        </Stack>
      </Block>
      <Block title="Labor hours" hint="Hours per device; functions carry their own hours below.">
        <Stack direction="row" gap={1.5} flexWrap="wrap">
          <BookField
            form={form}
            name="labor.hoursPerDeviceSerial"
            label="Per device, serial board"
            unit="h"
            disabled={disabled}
            width={220}
          />
          <BookField
            form={form}
            name="labor.hoursPerDeviceSwitcher"
            label="Per device through switcher loops"
            unit="h"
            hint="Both ends of every loop are cabled."
            disabled={disabled}
            width={260}
          />
        </Stack>
      </Block>
      <Block
        title="Levels and hourly rates"
        hint="The estimate shows the level's range; a firm quote uses the assigned builder's own rate."
      >
        <ListEditor
          list="levels"
          {...editor}
          fixedRows
          fields={[
            { name: 'code', label: 'Level', kind: 'select', options: levelOptions, width: 150 },
            { name: 'name', label: 'Name', kind: 'text' },
            { name: 'rateLow', label: 'Rate from', kind: 'money', width: 130 },
            { name: 'rateHigh', label: 'Rate to', kind: 'money', width: 130 },
            { name: 'description', label: 'Description', kind: 'text', width: '34%' },
          ]}
        />
      </Block>
      <Block title="Materials rates">
        <Stack direction="row" gap={1.5} flexWrap="wrap">
          {materialFields.map(([name, label, unit]) => (
            <BookField key={name} form={form} name={`materials.${name}`} label={label} unit={unit} disabled={disabled} width={220} />
          ))}
        </Stack>
      </Block>
      <Block title="Board surfaces" hint="Usable mounting area in millimetres.">
        <ListEditor
          list="surfaces"
          {...editor}
          blank={() => ({ id: '', name: '', description: '', widthMm: 610, depthMm: 320, price: '0.00', custom: false })}
          fields={[
            { name: 'id', label: 'Id', kind: 'text', width: 130 },
            { name: 'name', label: 'Name', kind: 'text' },
            { name: 'widthMm', label: 'Width mm', kind: 'int', width: 100 },
            { name: 'depthMm', label: 'Depth mm', kind: 'int', width: 100 },
            { name: 'price', label: 'Price', kind: 'money', width: 120 },
            { name: 'custom', label: 'Hand-made', kind: 'bool', width: 90 },
          ]}
        />
      </Block>
      <Block title="Cases" hint="A soft bag is allowed but flagged as not recommended for a loaded board.">
        <ListEditor
          list="cases"
          {...editor}
          blank={() => ({
            id: '',
            name: '',
            kind: 'hard_case',
            description: '',
            price: '0.00',
            notRecommended: false,
            caution: null,
            fitsSurfaceIds: [],
          })}
          fields={[
            { name: 'id', label: 'Id', kind: 'text', width: 130 },
            { name: 'name', label: 'Name', kind: 'text' },
            {
              name: 'kind',
              label: 'Kind',
              kind: 'select',
              width: 140,
              options: [
                { value: 'hard_case', label: 'Hard case' },
                { value: 'road_case', label: 'Road case' },
                { value: 'soft_bag', label: 'Soft bag' },
              ],
            },
            { name: 'price', label: 'Price', kind: 'money', width: 120 },
            { name: 'notRecommended', label: 'Not recommended', kind: 'bool', width: 120 },
          ]}
        />
      </Block>
      <Block title="Functions" hint="Added work such as stereo outputs or a four-cable hookup; wet/dry/wet counts as two functions.">
        <ListEditor
          list="functions"
          {...editor}
          blank={() => ({ id: '', code: '', name: '', description: '', laborHours: '1', functionCount: 1, extraPatchCables: 0 })}
          fields={[
            { name: 'code', label: 'Code', kind: 'text', width: 130 },
            { name: 'name', label: 'Name', kind: 'text' },
            { name: 'laborHours', label: 'Labor h', kind: 'text', width: 90 },
            { name: 'functionCount', label: 'Counts as', kind: 'int', width: 90 },
            { name: 'extraPatchCables', label: 'Extra patches', kind: 'int', width: 100 },
          ]}
        />
      </Block>
      {canEdit && (
        <Card variant="outlined" sx={{ gap: 1 }}>
          <FormControl>
            <FormLabel>What changed (kept with the version)</FormLabel>
            <Input value={notes} onChange={(e) => setNotes(e.target.value)} placeholder="Cable price up 10 cents a foot" />
          </FormControl>
          {problems.length > 0 && (
            <Alert color="danger" variant="soft" role="alert">
              <Stack>
                <Typography level="title-sm">Fix these before publishing:</Typography>
                {problems.map((p) => (
                  <Typography key={p} level="body-sm">
                    {p}
                  </Typography>
                ))}
              </Stack>
            </Alert>
          )}
          <ErrorNote error={publish.error} fields={BOOK_FIELDS} fieldsFrom="book" />
          <Stack direction="row" gap={1}>
            <Button type="submit" color="accent" loading={publish.isPending}>
              Publish as version {version + 1}
            </Button>
            <Button variant="plain" color="neutral" onClick={() => form.reset(book)}>
              Discard changes
            </Button>
          </Stack>
        </Card>
      )}
    </Stack>
  );
}
