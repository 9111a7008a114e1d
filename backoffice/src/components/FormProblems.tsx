import Alert from '@mui/joy/Alert';

/** What the form itself found wrong before sending (the shared schema's words), in one alert; nothing when all is well. */
export function FormProblems({ problems }: { problems: readonly string[] }) {
  if (problems.length === 0) return null;
  return (
    <Alert color="danger" variant="soft" role="alert">
      {problems.join(' ')}
    </Alert>
  );
}
