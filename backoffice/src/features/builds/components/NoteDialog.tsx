import Checkbox from '@mui/joy/Checkbox';
import DialogContent from '@mui/joy/DialogContent';
import DialogTitle from '@mui/joy/DialogTitle';
import FormControl from '@mui/joy/FormControl';
import FormHelperText from '@mui/joy/FormHelperText';
import FormLabel from '@mui/joy/FormLabel';
import Modal from '@mui/joy/Modal';
import ModalDialog from '@mui/joy/ModalDialog';
import Sheet from '@mui/joy/Sheet';
import Textarea from '@mui/joy/Textarea';
import Typography from '@mui/joy/Typography';
import { useEffect, useState, type ReactNode } from 'react';
import type { ZodType } from 'zod';
import { bookingWords } from '@loomwright/shared';
import { ErrorNote } from 'src/components/ErrorNote';
import { DialogButtons } from 'src/components/DialogButtons';

/**
 * Confirm one move of a build, with a note (optional) or a reason (required). With
 * `canTellPlayer`, the note stays internal unless "Tell the player" is ticked, and then the
 * dialog shows the exact words the player will read. `rule` is the API's own rule for the text
 * (the field of its shared request schema), so the dialog refuses what the API refuses, in its words.
 */
export function NoteDialog({
  open,
  title,
  children,
  label,
  required = false,
  rule,
  confirm,
  pending,
  error,
  onConfirm,
  onClose,
  canTellPlayer = false,
}: {
  open: boolean;
  title: string;
  children?: ReactNode;
  label: string;
  required?: boolean;
  rule?: ZodType;
  confirm: string;
  pending: boolean;
  error: Error | null;
  onConfirm: (note: string, tellPlayer: boolean) => void;
  onClose: () => void;
  canTellPlayer?: boolean;
}) {
  const [note, setNote] = useState('');
  const [tell, setTell] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  useEffect(() => {
    if (open) {
      setNote('');
      setTell(false);
      setProblem(null);
    }
  }, [open]);
  const submit = () => {
    const text = note.trim();
    const checked = rule?.safeParse(text);
    if (checked && !checked.success) return setProblem(checked.error.issues[0]?.message ?? bookingWords.reasonRequired);
    if (required && !text) return setProblem(bookingWords.reasonRequired);
    if (tell && !text) return setProblem(bookingWords.tellPlayerNeedsNote);
    onConfirm(text, canTellPlayer && tell);
  };
  return (
    <Modal open={open} onClose={onClose}>
      <ModalDialog sx={{ width: 'min(520px, 96vw)' }}>
        <DialogTitle component="h2">{title}</DialogTitle>
        <DialogContent sx={{ gap: 1.5 }}>
          {children}
          <FormControl error={problem !== null} required={required}>
            <FormLabel>{label}</FormLabel>
            <Textarea minRows={2} value={note} onChange={(event) => setNote(event.target.value)} />
            {problem && <FormHelperText>{problem}</FormHelperText>}
            {canTellPlayer && !tell && <FormHelperText>Internal: only the shop sees this note.</FormHelperText>}
          </FormControl>
          {canTellPlayer && (
            <Checkbox
              label="Tell the player (by e-mail and on their build page)"
              checked={tell}
              onChange={(event) => setTell(event.target.checked)}
            />
          )}
          {canTellPlayer && tell && (
            <Sheet variant="soft" sx={{ p: 1.5, borderRadius: 'sm' }} aria-label="Words the player will read">
              <Typography level="body-xs">The player will read exactly:</Typography>
              <Typography sx={{ whiteSpace: 'pre-wrap' }}>
                {note.trim() ? `From your builder: ${note.trim()}` : '(write the note above)'}
              </Typography>
            </Sheet>
          )}
          <ErrorNote error={error} />
        </DialogContent>
        <DialogButtons onConfirm={submit} pending={pending} onCancel={onClose}>
          {confirm}
        </DialogButtons>
      </ModalDialog>
    </Modal>
  );
}
