import Button from '@mui/joy/Button';
import FormControl from '@mui/joy/FormControl';
import FormHelperText from '@mui/joy/FormHelperText';
import FormLabel from '@mui/joy/FormLabel';
import Input from '@mui/joy/Input';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { commonShopLocales, shopDetailsSchema, type ShopDetailsInput, type ShopSettingsView } from '@loomwright/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect } from 'react';
import { useForm } from 'react-hook-form';
import { ErrorNote } from 'src/components/ErrorNote';
import { useUpdateSettings } from '../api/update-settings';

type Details = ShopDetailsInput;

const localeNames = new Intl.DisplayNames(['en'], { type: 'language' });
const localeName = (tag: string) => localeNames.of(tag) ?? tag;

export function ShopDetailsForm({ settings, canEdit, onSaved }: { settings: ShopSettingsView; canEdit: boolean; onSaved: (m: string) => void }) {
  const update = useUpdateSettings();
  const form = useForm<Details>({ resolver: zodResolver(shopDetailsSchema) });
  useEffect(() => {
    form.reset({
      name: settings.name,
      tagline: settings.tagline,
      contactEmail: settings.contactEmail,
      countryCode: settings.countryCode,
      timezone: settings.timezone,
      locale: settings.locale,
    });
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [settings]);
  const e = form.formState.errors;
  const field = (name: keyof Details, label: string, hint?: string, list?: string) => (
    <FormControl error={Boolean(e[name])} disabled={!canEdit} sx={{ minWidth: 220, flex: 1 }}>
      <FormLabel>{label}</FormLabel>
      <Input {...form.register(name)} slotProps={{ input: list ? { list } : {} }} />
      <FormHelperText>{e[name]?.message ?? hint}</FormHelperText>
    </FormControl>
  );
  return (
    <Stack component="form" gap={1} noValidate onSubmit={form.handleSubmit((values) => update.mutate(values, { onSuccess: () => onSaved('Shop details saved.') }))}>
      <Stack direction="row" gap={1.5} flexWrap="wrap">
        {field('name', 'Shop name')}
        {field('tagline', 'Tagline')}
      </Stack>
      <Stack direction="row" gap={1.5} flexWrap="wrap">
        {field('contactEmail', 'Contact e-mail')}
        {field('countryCode', 'Country for public holidays', 'Two letters (ISO 3166), e.g. US. The bench skips this country’s public holidays.')}
        {field('timezone', 'Time zone', 'An IANA name, e.g. America/Chicago.')}
        {field('locale', 'Language and region', 'How money, dates and times are written everywhere, e.g. en-US or de-DE.', 'shop-locales')}
      </Stack>
      <datalist id="shop-locales">
        {commonShopLocales.map((tag) => (
          <option key={tag} value={tag}>
            {localeName(tag)}
          </option>
        ))}
      </datalist>
      <Typography level="body-xs">Currency: {settings.currency} (set by the price book).</Typography>
      <ErrorNote error={update.error} />
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
