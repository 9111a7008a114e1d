import Typography from '@mui/joy/Typography';

export function Component() {
  return <Typography level="h3" component="h1">Coming next</Typography>;
}
