import Snackbar from '@mui/joy/Snackbar';

/** A short confirmation after an action, in words; it leaves by itself. */
export function Notice({ message, onClose }: { message: string | null; onClose: () => void }) {
  return (
    <Snackbar
      open={Boolean(message)}
      onClose={onClose}
      autoHideDuration={6000}
      variant="soft"
      color="success"
      anchorOrigin={{ vertical: 'bottom', horizontal: 'center' }}
      role="status"
    >
      {message}
    </Snackbar>
  );
}
