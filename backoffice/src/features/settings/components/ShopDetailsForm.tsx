import Autocomplete from '@mui/joy/Autocomplete';
import Button from '@mui/joy/Button';
import FormControl from '@mui/joy/FormControl';
import FormHelperText from '@mui/joy/FormHelperText';
import FormLabel from '@mui/joy/FormLabel';
import Input from '@mui/joy/Input';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import {
  commonShopLocales,
  countryCodes,
  postalAddressSchema,
  shopDetailsSchema,
  shopTimeZones,
  type ShopDetailsInput,
} from '@loomwright/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useMemo } from 'react';
import { Controller, useForm, type FieldPath } from 'react-hook-form';
import { z } from 'zod';
import { setServerFieldErrors } from '@loomwright/shared/ui';
import { ErrorNote } from 'src/components/ErrorNote';
import { useUpdateSettings } from '../api/update-settings';
import type { SettingsSectionProps } from './settings-section';

const blankAddress = { line1: '', line2: '', city: '', region: '', postalCode: '' };

/**
 * The settings form: the shared schema, except that an address left wholly blank is no address
 * (the API keeps it empty and mails say to ask for it) rather than three "give the street" errors.
 */
const formSchema = shopDetailsSchema.extend({
  postalAddress: z.preprocess(
    (value) =>
      value && typeof value === 'object' && Object.values(value).every((v) => typeof v !== 'string' || v.trim() === '') ? undefined : value,
    postalAddressSchema.optional(),
  ),
});

type FormValues = Omit<ShopDetailsInput, 'postalAddress'> & { postalAddress: typeof blankAddress };

/** The form's fields, as the API names them: a refusal of one stands under it. */
const DETAIL_FIELDS = [
  'name',
  'tagline',
  'contactEmail',
  'countryCode',
  'timezone',
  'locale',
  'postalAddress',
] as const satisfies ReadonlyArray<keyof FormValues>;

const localeNames = new Intl.DisplayNames(['en'], { type: 'language' });
const localeName = (tag: string) => localeNames.of(tag) ?? tag;
const regionNames = new Intl.DisplayNames(['en'], { type: 'region' });
const countryName = (code: string) => {
  try {
    return regionNames.of(code) ?? code;
  } catch {
    return code;
  }
};

export function ShopDetailsForm({ settings, canEdit, onSaved }: SettingsSectionProps) {
  const update = useUpdateSettings();
  const form = useForm<FormValues>({ resolver: zodResolver(formSchema) as never });
  const countries = useMemo(() => countryCodes().sort((a, b) => countryName(a).localeCompare(countryName(b), 'en')), []);
  // The shop's own zone stays choosable even where this browser names zones differently.
  const zones = useMemo(() => {
    const list = shopTimeZones();
    return list.includes(settings.timezone) ? list : [...list, settings.timezone].sort();
  }, [settings.timezone]);
  const { reset: resetForm } = form;
  useEffect(() => {
    resetForm({
      name: settings.name,
      tagline: settings.tagline,
      contactEmail: settings.contactEmail,
      countryCode: settings.countryCode,
      timezone: settings.timezone,
      locale: settings.locale,
      postalAddress: settings.postalAddress ?? blankAddress,
    });
  }, [settings, resetForm]);
  const e = form.formState.errors;
  const errorOf = (name: FieldPath<FormValues>) =>
    name.split('.').reduce<unknown>((node, key) => (node as Record<string, unknown> | undefined)?.[key], e) as
      { message?: string } | undefined;
  const field = (
    name: FieldPath<FormValues>,
    label: string,
    options: { hint?: string; list?: string; autoComplete?: string; minWidth?: number } = {},
  ) => (
    <FormControl error={Boolean(errorOf(name))} disabled={!canEdit} sx={{ minWidth: options.minWidth ?? 220, flex: 1 }}>
      <FormLabel>{label}</FormLabel>
      <Input
        {...form.register(name)}
        slotProps={{ input: { ...(options.list ? { list: options.list } : {}), autoComplete: options.autoComplete } }}
      />
      <FormHelperText>{errorOf(name)?.message ?? options.hint}</FormHelperText>
    </FormControl>
  );
  return (
    <Stack
      component="form"
      gap={1}
      noValidate
      onSubmit={form.handleSubmit((values) =>
        update.mutate(values as unknown as ShopDetailsInput, {
          onSuccess: () => onSaved('Shop details saved.'),
          onError: (error) => setServerFieldErrors(error, form.setError, DETAIL_FIELDS),
        }),
      )}
    >
      <Stack direction="row" gap={1.5} flexWrap="wrap">
        {field('name', 'Shop name', { autoComplete: 'organization' })}
        {field('tagline', 'Tagline')}
      </Stack>
      <Stack direction="row" gap={1.5} flexWrap="wrap">
        {field('contactEmail', 'Contact e-mail', { autoComplete: 'email' })}
        <Controller
          control={form.control}
          name="countryCode"
          render={({ field: f, fieldState }) => (
            <FormControl error={Boolean(fieldState.error)} disabled={!canEdit} sx={{ minWidth: 220, flex: 1 }}>
              <FormLabel>Country</FormLabel>
              <Autocomplete
                options={countries}
                value={f.value ?? null}
                onChange={(_event, value) => f.onChange(value ?? '')}
                onBlur={f.onBlur}
                getOptionLabel={(code) => `${countryName(code)} (${code})`}
                disableClearable
                slotProps={{ input: { 'aria-label': 'Country' } }}
              />
              <FormHelperText>
                {fieldState.error?.message ?? 'The bench skips this country’s public holidays; the paper size follows it.'}
              </FormHelperText>
            </FormControl>
          )}
        />
        <Controller
          control={form.control}
          name="timezone"
          render={({ field: f, fieldState }) => (
            <FormControl error={Boolean(fieldState.error)} disabled={!canEdit} sx={{ minWidth: 220, flex: 1 }}>
              <FormLabel>Time zone</FormLabel>
              <Autocomplete
                options={zones}
                value={f.value ?? null}
                onChange={(_event, value) => f.onChange(value ?? '')}
                onBlur={f.onBlur}
                getOptionLabel={(zone) => zone.replace(/_/g, ' ')}
                disableClearable
                slotProps={{ input: { 'aria-label': 'Time zone' } }}
              />
              <FormHelperText>
                {fieldState.error?.message ?? 'Every date and time in both apps, the mails and the paper is shown in this zone.'}
              </FormHelperText>
            </FormControl>
          )}
        />
        {field('locale', 'Language and region', {
          hint: 'How money, dates and times are written everywhere, e.g. en-US or de-DE.',
          list: 'shop-locales',
        })}
      </Stack>
      <datalist id="shop-locales">
        {commonShopLocales.map((tag) => (
          <option key={tag} value={tag}>
            {localeName(tag)}
          </option>
        ))}
      </datalist>
      <Typography level="title-sm" component="h3" sx={{ mt: 1 }}>
        Postal address
      </Typography>
      <Typography level="body-xs">
        Where players ship or drop off their pedals. The scheduled e-mail, its calendar file and the build sheet print it; until it is
        filled in, the mail tells players to ask for it.
      </Typography>
      <Stack direction="row" gap={1.5} flexWrap="wrap">
        {field('postalAddress.line1', 'Street and number', { autoComplete: 'address-line1', minWidth: 260 })}
        {field('postalAddress.line2', 'Second address line', { hint: 'Optional: unit, floor or building.', autoComplete: 'address-line2' })}
      </Stack>
      <Stack direction="row" gap={1.5} flexWrap="wrap">
        {field('postalAddress.city', 'Town or city', { autoComplete: 'address-level2', minWidth: 180 })}
        {field('postalAddress.region', 'State or region', {
          hint: 'Optional where the country has none.',
          autoComplete: 'address-level1',
          minWidth: 160,
        })}
        {field('postalAddress.postalCode', 'Postal code', { autoComplete: 'postal-code', minWidth: 140 })}
      </Stack>
      <Typography level="body-xs">Currency: {settings.currency} (set by the price book).</Typography>
      <ErrorNote error={update.error} fields={DETAIL_FIELDS} />
      {canEdit && (
        <Stack direction="row">
          <Button type="submit" loading={update.isPending}>
            Save shop details
          </Button>
        </Stack>
      )}
    </Stack>
  );
}
