import { zodResolver } from '@hookform/resolvers/zod';
import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import DialogTitle from '@mui/joy/DialogTitle';
import Modal from '@mui/joy/Modal';
import ModalDialog from '@mui/joy/ModalDialog';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { configurationNameFormSchema, type ConfigurationNameForm } from '@loomwright/shared';
import { FormTextField } from '@loomwright/shared/ui';
import { useForm } from 'react-hook-form';

interface Props {
  open: boolean;
  title: string;
  hint?: string;
  submitLabel: string;
  initialName?: string;
  pending: boolean;
  /** The API's words when it refused (a name already taken, say). */
  error?: string | null;
  onSubmit: (name: string) => void;
  onClose: () => void;
}

/** Asks for a configuration's name, with the API's own rule (shared schema) and words. */
export function NameDialog({ open, title, hint, submitLabel, initialName = '', pending, error, onSubmit, onClose }: Props) {
  const { register, handleSubmit, formState } = useForm<ConfigurationNameForm>({
    resolver: zodResolver(configurationNameFormSchema),
    values: { name: initialName },
  });
  return (
    <Modal open={open} onClose={onClose}>
      <ModalDialog aria-labelledby="name-dialog-title" sx={{ width: 'min(440px, 92vw)' }}>
        <DialogTitle id="name-dialog-title">{title}</DialogTitle>
        <form noValidate onSubmit={handleSubmit((values) => onSubmit(values.name))}>
          <Stack gap={2}>
            {hint ? <Typography level="body-sm">{hint}</Typography> : null}
            {error ? (
              <Alert color="danger" role="alert">
                {error}
              </Alert>
            ) : null}
            <FormTextField label="Name" autoFocus registration={register('name')} error={formState.errors.name} />
            <Stack direction="row" gap={1} justifyContent="flex-end">
              <Button variant="plain" color="neutral" onClick={onClose}>
                Cancel
              </Button>
              <Button type="submit" loading={pending}>
                {submitLabel}
              </Button>
            </Stack>
          </Stack>
        </form>
      </ModalDialog>
    </Modal>
  );
}
