import Alert from '@mui/joy/Alert';

/** An API error in words: what happened (the server's own sentence) and what to do next. */
export function ErrorNote({ error, action }: { error: Error | null | undefined; action?: string }) {
  if (!error) return null;
  return (
    <Alert color="danger" variant="soft" role="alert">
      {error.message}
      {action ? ` ${action}` : ''}
    </Alert>
  );
}
