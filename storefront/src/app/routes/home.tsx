import Box from '@mui/joy/Box';
import Button from '@mui/joy/Button';
import Card from '@mui/joy/Card';
import Grid from '@mui/joy/Grid';
import Typography from '@mui/joy/Typography';
import { Link as RouterLink } from 'react-router';
import { useShop } from 'src/features/shop/api/get-shop';

const steps = [
  {
    title: 'Describe your rig',
    text: 'Pick a board and a case, list your pedals, choose serial or a loop switcher, and add what you need: stereo, four-cable, wet/dry/wet.',
  },
  {
    title: 'See the price as you go',
    text: 'Materials plus bench hours at the builder level you choose. The estimate updates with every change.',
  },
  {
    title: 'Book bench time',
    text: 'Pay a deposit to hold your place. We set a bench date, tell you when to ship your pedals, and keep you posted until the board comes back.',
  },
];

export function Component() {
  const shop = useShop();
  return (
    <Box sx={{ maxWidth: 1080, mx: 'auto' }}>
      <Box sx={{ py: { xs: 2, md: 6 }, maxWidth: 720 }}>
        <Typography level="h1" sx={{ fontSize: { xs: 'xl2', md: 'xl3' } }}>
          {shop.data?.tagline ?? 'Hand-wired pedalboards, built to tour.'}
        </Typography>
        <Typography level="body-lg" sx={{ mt: 2, mb: 4 }}>
          Send us your pedals and power supply; we mount them, make every patch cable to length, tidy the power and return a board that is
          ready for the road.
        </Typography>
        <Button component={RouterLink} to="/configure" size="lg" color="accent">
          Start configuring your board
        </Button>
      </Box>
      <Grid container spacing={2} sx={{ mt: 2 }}>
        {steps.map((step, index) => (
          <Grid key={step.title} xs={12} md={4}>
            <Card variant="outlined" sx={{ height: '100%' }}>
              <Typography level="body-sm" sx={{ color: 'primary.700', fontWeight: 'lg' }}>
                Step {index + 1}
              </Typography>
              <Typography level="title-lg" component="h2">
                {step.title}
              </Typography>
              <Typography>{step.text}</Typography>
            </Card>
          </Grid>
        ))}
      </Grid>
    </Box>
  );
}
