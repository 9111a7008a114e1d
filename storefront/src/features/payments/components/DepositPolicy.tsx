import Typography from '@mui/joy/Typography';
import { useDepositPolicy } from 'src/features/payments/api/get-deposit-policy';

/** The shop's own words on the deposit, shown before anyone pays. */
export function DepositPolicy() {
  const policy = useDepositPolicy();
  if (policy.isPending) return <Typography level="body-sm">Loading the deposit policy…</Typography>;
  if (policy.error)
    return (
      <Typography level="body-sm" color="danger">
        The deposit policy could not be loaded: {policy.error.message}
      </Typography>
    );
  return <Typography level="body-sm">{policy.data.description}</Typography>;
}
