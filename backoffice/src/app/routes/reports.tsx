import Card from '@mui/joy/Card';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { PageHeader } from 'src/components/PageHeader';
import { useMe } from 'src/features/auth/api/get-me';
import { DateRangeFields, useDateRange } from 'src/features/exports/components/DateRangeFields';
import { ExportLinks } from 'src/features/exports/components/ExportLinks';
import { HoursSection, OutstandingSection, RevenueSection, UtilisationSection } from 'src/features/reports/components/ReportSections';
import { useShop } from 'src/features/shop/api/get-shop';

export function Component() {
  const me = useMe();
  const shop = useShop();
  const range = useDateRange(shop.data?.timezone);
  if (me.data && me.data.role !== 'owner') {
    return (
      <>
        <PageHeader title="Reports" />
        <Typography>Reports and exports are the owner’s: ask the owner for the figures you need.</Typography>
      </>
    );
  }
  return (
    <Stack gap={2} sx={{ maxWidth: 1180 }}>
      <PageHeader
        title="Reports"
        hint={`Money, hours and bench time for a range of the shop’s days (${shop.data?.timezone ?? 'shop time zone'}). Every figure here adds up from the CSV files below.`}
      />
      <Card variant="outlined">
        <DateRangeFields state={range} />
      </Card>
      <RevenueSection range={range.valid} />
      <OutstandingSection />
      <HoursSection range={range.valid} />
      <UtilisationSection range={range.valid} />
      <Card variant="outlined" component="section" aria-labelledby="exports-title">
        <Typography id="exports-title" level="title-lg" component="h2">
          Exports for the bookkeeper
        </Typography>
        <Typography level="body-sm">
          CSV files in UTF-8 with a header row; amounts as plain decimals, times on the shop’s clock with their UTC offset.
        </Typography>
        <Stack gap={1}>
          <ExportLinks kinds={['bookings', 'payments', 'hours']} range={range.valid} />
        </Stack>
      </Card>
    </Stack>
  );
}
