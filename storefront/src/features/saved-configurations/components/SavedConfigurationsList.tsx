import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import DialogActions from '@mui/joy/DialogActions';
import DialogContent from '@mui/joy/DialogContent';
import DialogTitle from '@mui/joy/DialogTitle';
import Modal from '@mui/joy/Modal';
import ModalDialog from '@mui/joy/ModalDialog';
import Stack from '@mui/joy/Stack';
import Table from '@mui/joy/Table';
import Typography from '@mui/joy/Typography';
import { useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { Link as RouterLink, useNavigate } from 'react-router';
import { CONFIGURATION_PARAM, encodeConfiguration, type SavedConfigurationSummary } from '@loomwright/shared';
import { ApiErrorAlert, PageLoading } from '@loomwright/shared/ui';
import { formatMoment } from 'src/lib/format';
import { useDeleteConfiguration } from '../api/delete-configuration';
import { useDuplicateConfiguration } from '../api/duplicate-configuration';
import { savedConfigurationQueryOptions } from '../api/get-saved-configuration';
import { useSavedConfigurations } from '../api/get-saved-configurations';
import { useUpdateConfiguration } from '../api/update-configuration';
import { SAVED_PARAM } from './KeepConfiguration';
import { NameDialog } from './NameDialog';

/** The player's saved configurations: open one in the configurator, rename, duplicate or delete it. */
export function SavedConfigurationsList({ surfaceName }: { surfaceName: (id: string) => string }) {
  const list = useSavedConfigurations();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const rename = useUpdateConfiguration();
  const duplicate = useDuplicateConfiguration();
  const remove = useDeleteConfiguration();
  const [renaming, setRenaming] = useState<SavedConfigurationSummary | null>(null);
  const [deleting, setDeleting] = useState<SavedConfigurationSummary | null>(null);
  const [opening, setOpening] = useState<string | null>(null);
  const [openError, setOpenError] = useState<string | null>(null);

  if (list.isPending) return <PageLoading label="Loading your configurations…" />;
  if (list.isError) return <ApiErrorAlert error={list.error} />;

  const open = async (row: SavedConfigurationSummary) => {
    setOpening(row.id);
    setOpenError(null);
    try {
      const saved = await queryClient.fetchQuery(savedConfigurationQueryOptions(row.id));
      const params = new URLSearchParams({
        step: 'review',
        [CONFIGURATION_PARAM]: encodeConfiguration(saved.configuration),
        [SAVED_PARAM]: saved.id,
      });
      navigate(`/configure?${params.toString()}`);
    } catch (error) {
      setOpenError((error as Error).message);
    } finally {
      setOpening(null);
    }
  };

  const problem = openError ?? duplicate.error?.message ?? remove.error?.message;
  if (list.data.length === 0) {
    return (
      <Stack gap={1} alignItems="flex-start">
        <Typography>
          You have not saved a configuration yet. On the Review step of the configurator, choose “Save under a name…”.
        </Typography>
        <Button component={RouterLink} to="/configure" color="accent">
          Configure a board
        </Button>
      </Stack>
    );
  }
  return (
    <Stack gap={2}>
      {problem ? (
        <Alert color="danger" role="alert">
          {problem}
        </Alert>
      ) : null}
      {duplicate.isSuccess ? (
        <Alert color="success" variant="soft" role="status">
          Copied as “{duplicate.data.name}”.
        </Alert>
      ) : null}
      <Table aria-label="Saved boards" sx={{ '& td': { verticalAlign: 'top' } }}>
        <thead>
          <tr>
            <th style={{ width: '34%' }}>Name</th>
            <th>Board</th>
            <th>Last saved</th>
            <th style={{ width: '32%' }}>Actions</th>
          </tr>
        </thead>
        <tbody>
          {list.data.map((row) => (
            <tr key={row.id}>
              <td>
                <Typography fontWeight="lg">{row.name}</Typography>
              </td>
              <td>
                {surfaceName(row.surfaceId)}
                <Typography level="body-xs">
                  {row.pedalCount} {row.pedalCount === 1 ? 'pedal' : 'pedals'},{' '}
                  {row.routing === 'switcher' ? 'through a loop switcher' : 'in series'}
                </Typography>
              </td>
              <td>{formatMoment(row.updatedAt)}</td>
              <td>
                <Stack direction="row" gap={0.5} flexWrap="wrap">
                  <Button size="sm" loading={opening === row.id} onClick={() => void open(row)} aria-label={`Open ${row.name}`}>
                    Open
                  </Button>
                  <Button size="sm" variant="outlined" onClick={() => setRenaming(row)} aria-label={`Rename ${row.name}`}>
                    Rename
                  </Button>
                  <Button
                    size="sm"
                    variant="outlined"
                    loading={duplicate.isPending && duplicate.variables?.id === row.id}
                    onClick={() => duplicate.mutate({ id: row.id })}
                    aria-label={`Duplicate ${row.name}`}
                  >
                    Duplicate
                  </Button>
                  <Button size="sm" variant="plain" color="danger" onClick={() => setDeleting(row)} aria-label={`Delete ${row.name}`}>
                    Delete
                  </Button>
                </Stack>
              </td>
            </tr>
          ))}
        </tbody>
      </Table>

      <NameDialog
        open={!!renaming}
        title="Rename the configuration"
        submitLabel="Rename"
        initialName={renaming?.name}
        pending={rename.isPending}
        error={rename.error?.message}
        onSubmit={(name) => rename.mutate({ id: renaming!.id, name }, { onSuccess: () => setRenaming(null) })}
        onClose={() => {
          setRenaming(null);
          rename.reset();
        }}
      />
      <Modal open={!!deleting} onClose={() => setDeleting(null)}>
        <ModalDialog role="alertdialog" aria-labelledby="delete-title">
          <DialogTitle id="delete-title">Delete “{deleting?.name}”?</DialogTitle>
          <DialogContent>The saved configuration goes from your account. Builds you already requested keep their own copy.</DialogContent>
          <DialogActions>
            <Button
              color="danger"
              loading={remove.isPending}
              onClick={() => remove.mutate(deleting!.id, { onSuccess: () => setDeleting(null) })}
            >
              Delete
            </Button>
            <Button variant="plain" color="neutral" onClick={() => setDeleting(null)}>
              Keep it
            </Button>
          </DialogActions>
        </ModalDialog>
      </Modal>
    </Stack>
  );
}
