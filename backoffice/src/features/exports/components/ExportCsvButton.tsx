import Button from '@mui/joy/Button';
import DialogContent from '@mui/joy/DialogContent';
import DialogTitle from '@mui/joy/DialogTitle';
import Modal from '@mui/joy/Modal';
import ModalClose from '@mui/joy/ModalClose';
import ModalDialog from '@mui/joy/ModalDialog';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import type { ExportKind } from '@loomwright/shared';
import { useState } from 'react';
import { useMe } from 'src/features/auth/api/get-me';
import { useShop } from 'src/features/shop/api/get-shop';
import { DateRangeFields, useDateRange } from './DateRangeFields';
import { ExportLinks } from './ExportLinks';

/**
 * "Export CSV…" beside a page's title: the owner picks a range of the shop's days and downloads
 * the files that page is about. Builders do not see it (exports are the owner's).
 */
export function ExportCsvButton({ kinds, label = 'Export CSV…' }: { kinds: ExportKind[]; label?: string }) {
  const me = useMe();
  const shop = useShop();
  const [open, setOpen] = useState(false);
  const range = useDateRange(shop.data?.timezone);
  if (me.data?.role !== 'owner') return null;
  return (
    <>
      <Button variant="outlined" color="neutral" size="sm" onClick={() => setOpen(true)}>
        {label}
      </Button>
      <Modal open={open} onClose={() => setOpen(false)}>
        <ModalDialog sx={{ width: 'min(560px, 96vw)' }}>
          <ModalClose />
          <DialogTitle component="h2">Export to a spreadsheet</DialogTitle>
          <DialogContent sx={{ gap: 2 }}>
            <Typography level="body-sm">
              CSV files in UTF-8 with a header row, amounts as plain decimals ({shop.data?.currency ?? 'USD'}), times on the shop’s clock (
              {shop.data?.timezone ?? 'shop time zone'}) with their UTC offset. Both days are included.
            </Typography>
            <DateRangeFields state={range} />
            <Stack gap={1}>
              <ExportLinks kinds={kinds} range={range.valid} />
            </Stack>
          </DialogContent>
        </ModalDialog>
      </Modal>
    </>
  );
}
