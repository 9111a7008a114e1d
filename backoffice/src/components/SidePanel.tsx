import DialogContent from '@mui/joy/DialogContent';
import DialogTitle from '@mui/joy/DialogTitle';
import Drawer from '@mui/joy/Drawer';
import ModalClose from '@mui/joy/ModalClose';
import Sheet from '@mui/joy/Sheet';
import type { ReactNode } from 'react';

/** Details beside a table: opens from the right, closes with Escape or its close button. */
export function SidePanel({
  open,
  onClose,
  title,
  children,
}: {
  open: boolean;
  onClose: () => void;
  title: ReactNode;
  children: ReactNode;
}) {
  return (
    <Drawer
      anchor="right"
      open={open}
      onClose={onClose}
      size="lg"
      variant="plain"
      slotProps={{
        content: { sx: { bgcolor: 'transparent', p: { md: 2, sm: 0 }, boxShadow: 'none', width: { xs: '100%', md: 640 } } },
      }}
    >
      <Sheet sx={{ borderRadius: 'md', p: 2, display: 'flex', flexDirection: 'column', gap: 2, height: '100%', overflow: 'auto' }}>
        <DialogTitle component="h2" sx={{ pr: 5 }}>
          {title}
        </DialogTitle>
        <ModalClose aria-label="Close the details" />
        <DialogContent sx={{ gap: 2 }}>{children}</DialogContent>
      </Sheet>
    </Drawer>
  );
}
