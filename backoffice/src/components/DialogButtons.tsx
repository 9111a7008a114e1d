import Button, { type ButtonProps } from '@mui/joy/Button';
import DialogActions from '@mui/joy/DialogActions';
import type { ReactNode } from 'react';

interface Props {
  /** The words of the dialog's one action ("Move the build"). */
  children: ReactNode;
  /** What the action does; left out where the dialog is a form and the action submits it. */
  onConfirm?: () => void;
  color?: ButtonProps['color'];
  pending: boolean;
  disabled?: boolean;
  /** The words of the way out, which changes nothing ("Keep the build"). */
  cancelLabel?: string;
  onCancel: () => void;
  /** Room above the buttons, where they close a form rather than the dialog's content. */
  spaced?: boolean;
}

/** A dialog's footer: its one action first (busy while it runs), then the way out that changes nothing. */
export function DialogButtons({
  children,
  onConfirm,
  color = 'accent',
  pending,
  disabled,
  cancelLabel = 'Cancel',
  onCancel,
  spaced,
}: Props) {
  return (
    <DialogActions sx={spaced ? { mt: 1.5 } : undefined}>
      <Button type={onConfirm ? 'button' : 'submit'} color={color} loading={pending} disabled={disabled} onClick={onConfirm}>
        {children}
      </Button>
      <Button variant="plain" color="neutral" onClick={onCancel}>
        {cancelLabel}
      </Button>
    </DialogActions>
  );
}
