import Chip from '@mui/joy/Chip';
import type { CheckStatus } from '@loomwright/shared';
import { CautionIcon, CheckIcon, InfoIcon } from './icons';

const words: Record<CheckStatus, { label: string; color: 'success' | 'warning' | 'danger' | 'neutral' }> = {
  ok: { label: 'OK', color: 'success' },
  warning: { label: 'Worth a look', color: 'warning' },
  problem: { label: 'Problem', color: 'danger' },
  unknown: { label: 'Not enough figures', color: 'neutral' },
};

/** A check's verdict in a word first, an icon second, colour last. */
export function CheckStatusChip({ status }: { status: CheckStatus }) {
  const { label, color } = words[status];
  const Icon = status === 'ok' ? CheckIcon : status === 'unknown' ? InfoIcon : CautionIcon;
  return (
    <Chip size="sm" variant="soft" color={color} startDecorator={<Icon />}>
      {label}
    </Chip>
  );
}
