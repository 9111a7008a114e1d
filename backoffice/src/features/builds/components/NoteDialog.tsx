import Button from '@mui/joy/Button';
import DialogActions from '@mui/joy/DialogActions';
import DialogContent from '@mui/joy/DialogContent';
import DialogTitle from '@mui/joy/DialogTitle';
import FormControl from '@mui/joy/FormControl';
import FormHelperText from '@mui/joy/FormHelperText';
import FormLabel from '@mui/joy/FormLabel';
import Modal from '@mui/joy/Modal';
import ModalDialog from '@mui/joy/ModalDialog';
import Textarea from '@mui/joy/Textarea';
import { useEffect, useState, type ReactNode } from 'react';
import { ErrorNote } from 'src/components/ErrorNote';

/** Confirm one move of a build, with a note (optional) or a reason (required). */
export function NoteDialog({
  open,
  title,
  children,
  label,
  required = false,
  confirm,
  pending,
  error,
  onConfirm,
  onClose,
}: {
  open: boolean;
  title: string;
  children?: ReactNode;
  label: string;
  required?: boolean;
  confirm: string;
  pending: boolean;
  error: Error | null;
  onConfirm: (note: string) => void;
  onClose: () => void;
}) {
  const [note, setNote] = useState('');
  const [missing, setMissing] = useState(false);
  useEffect(() => {
    if (open) {
      setNote('');
      setMissing(false);
    }
  }, [open]);
  const submit = () => {
    if (required && note.trim().length < 3) return setMissing(true);
    onConfirm(note.trim());
  };
  return (
    <Modal open={open} onClose={onClose}>
      <ModalDialog sx={{ width: 'min(520px, 96vw)' }}>
        <DialogTitle component="h2">{title}</DialogTitle>
        <DialogContent sx={{ gap: 1.5 }}>
          {children}
          <FormControl error={missing} required={required}>
            <FormLabel>{label}</FormLabel>
            <Textarea minRows={2} value={note} onChange={(event) => setNote(event.target.value)} />
            {missing && <FormHelperText>Write a reason of at least a few words.</FormHelperText>}
          </FormControl>
          <ErrorNote error={error} />
        </DialogContent>
        <DialogActions>
          <Button color="accent" loading={pending} onClick={submit}>
            {confirm}
          </Button>
          <Button variant="plain" color="neutral" onClick={onClose}>
            Cancel
          </Button>
        </DialogActions>
      </ModalDialog>
    </Modal>
  );
}
