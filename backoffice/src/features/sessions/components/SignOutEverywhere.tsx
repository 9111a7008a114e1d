import Button from '@mui/joy/Button';
import DialogContent from '@mui/joy/DialogContent';
import DialogTitle from '@mui/joy/DialogTitle';
import Modal from '@mui/joy/Modal';
import ModalDialog from '@mui/joy/ModalDialog';
import Typography from '@mui/joy/Typography';
import { useState } from 'react';
import { ErrorNote } from 'src/components/ErrorNote';
import { useEndSessions } from 'src/features/sessions/api/end-sessions';
import { useSessions } from 'src/features/sessions/api/get-sessions';
import { DialogButtons } from 'src/components/DialogButtons';

const devices = (n: number) => (n === 1 ? 'one device' : `${n} devices`);

/**
 * The owner's way to end every session of a person (a lost phone, a shared computer, someone who
 * left the team): a button, a confirmation that says what happens, and the outcome in words.
 */
export function SignOutEverywhere({ userId, name, onDone }: { userId: string; name: string; onDone: (message: string) => void }) {
  const [open, setOpen] = useState(false);
  const sessions = useSessions(userId, open);
  const end = useEndSessions();
  const live = sessions.data?.sessions.length;
  const close = () => {
    setOpen(false);
    end.reset();
  };
  const confirm = () =>
    end.mutate(userId, {
      onSuccess: ({ ended }) => {
        close();
        onDone(ended === 0 ? `${name} was not signed in anywhere.` : `${name} is signed out of ${devices(ended)}.`);
      },
    });
  return (
    <>
      <Button size="sm" variant="outlined" color="neutral" onClick={() => setOpen(true)} aria-label={`Sign ${name} out everywhere`}>
        Sign out everywhere
      </Button>
      <Modal open={open} onClose={close}>
        <ModalDialog sx={{ width: 'min(480px, 96vw)' }} role="alertdialog">
          <DialogTitle component="h2">Sign {name} out of every device?</DialogTitle>
          <DialogContent sx={{ gap: 1.5 }}>
            <Typography>
              {live === undefined
                ? 'Checking where they are signed in…'
                : live === 0
                  ? 'They are not signed in anywhere right now.'
                  : `They are signed in on ${devices(live)} now.`}{' '}
              Each device will have to sign in again with the password; nothing else about the account changes.
            </Typography>
            <ErrorNote error={sessions.error ?? end.error} />
          </DialogContent>
          <DialogButtons onConfirm={confirm} pending={end.isPending} onCancel={close}>
            Sign out everywhere
          </DialogButtons>
        </ModalDialog>
      </Modal>
    </>
  );
}
