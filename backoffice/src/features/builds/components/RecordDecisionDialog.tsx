import DialogContent from '@mui/joy/DialogContent';
import DialogTitle from '@mui/joy/DialogTitle';
import FormControl from '@mui/joy/FormControl';
import FormLabel from '@mui/joy/FormLabel';
import Input from '@mui/joy/Input';
import Modal from '@mui/joy/Modal';
import ModalDialog from '@mui/joy/ModalDialog';
import Radio from '@mui/joy/Radio';
import RadioGroup from '@mui/joy/RadioGroup';
import Textarea from '@mui/joy/Textarea';
import { decidedViaWords, recordedViaValues, type RecordedVia } from '@loomwright/shared';
import { useEffect, useState } from 'react';
import { ErrorNote } from 'src/components/ErrorNote';
import { useRecordDecision } from '../api/record-decision';
import { DialogButtons } from 'src/components/DialogButtons';

/** The player said yes or no by phone, in person or by e-mail: the shop records who said it, and how. */
export function RecordDecisionDialog({
  bookingId,
  target,
  what,
  playerName,
  onClose,
  onDone,
}: {
  bookingId: string;
  target: { extraId: string } | { layout: true } | null;
  what: string;
  playerName: string;
  onClose: () => void;
  onDone: (message: string) => void;
}) {
  const record = useRecordDecision(bookingId);
  const [approve, setApprove] = useState<'yes' | 'no'>('yes');
  const [via, setVia] = useState<RecordedVia>('phone');
  const [givenBy, setGivenBy] = useState(playerName);
  const [comment, setComment] = useState('');
  const resetRecord = record.reset;
  useEffect(() => {
    if (target) {
      setApprove('yes');
      setVia('phone');
      setGivenBy(playerName);
      setComment('');
      resetRecord();
    }
  }, [target, playerName, resetRecord]);
  return (
    <Modal open={target !== null} onClose={onClose}>
      <ModalDialog sx={{ width: 'min(520px, 96vw)' }}>
        <DialogTitle component="h2">Record the player&apos;s answer — {what}</DialogTitle>
        <DialogContent sx={{ gap: 1.5 }}>
          <FormControl>
            <FormLabel>Their answer</FormLabel>
            <RadioGroup orientation="horizontal" value={approve} onChange={(e) => setApprove(e.target.value as 'yes' | 'no')}>
              <Radio value="yes" label="Approved" />
              <Radio value="no" label="Declined" />
            </RadioGroup>
          </FormControl>
          <FormControl>
            <FormLabel>How it reached us</FormLabel>
            <RadioGroup orientation="horizontal" value={via} onChange={(e) => setVia(e.target.value as RecordedVia)}>
              {recordedViaValues.map((v) => (
                <Radio key={v} value={v} label={decidedViaWords[v]} />
              ))}
            </RadioGroup>
          </FormControl>
          <FormControl required>
            <FormLabel>Who gave the answer</FormLabel>
            <Input value={givenBy} onChange={(e) => setGivenBy(e.target.value)} />
          </FormControl>
          <FormControl>
            <FormLabel>Comment (kept in the history)</FormLabel>
            <Textarea minRows={2} value={comment} onChange={(e) => setComment(e.target.value)} />
          </FormControl>
          <ErrorNote error={record.error} />
        </DialogContent>
        <DialogButtons
          pending={record.isPending}
          onCancel={onClose}
          onConfirm={() =>
            target &&
            record.mutate(
              {
                target,
                body: {
                  approve: approve === 'yes',
                  via,
                  givenBy: givenBy.trim(),
                  ...(comment.trim() ? { comment: comment.trim() } : {}),
                },
              },
              {
                onSuccess: () =>
                  onDone(`${what}: ${approve === 'yes' ? 'approved' : 'declined'} by ${givenBy.trim()} ${decidedViaWords[via]}, recorded.`),
              },
            )
          }
        >
          Record the answer
        </DialogButtons>
      </ModalDialog>
    </Modal>
  );
}
