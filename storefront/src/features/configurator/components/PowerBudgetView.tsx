import Box from '@mui/joy/Box';
import List from '@mui/joy/List';
import ListItem from '@mui/joy/ListItem';
import Typography from '@mui/joy/Typography';
import type { PowerBudget } from '@loomwright/shared';
import { CheckStatusChip } from './CheckStatus';

const watts = (w: number) => `${Number(w.toFixed(2))} W`;

/** Load against rating for each output of the player's supply, as a bar and in words. */
export function PowerBudgetView({ budget }: { budget: PowerBudget }) {
  return (
    <Box>
      <Box sx={{ display: 'flex', alignItems: 'center', gap: 1, flexWrap: 'wrap' }}>
        <Typography level="title-md" component="h3">Power budget</Typography>
        <CheckStatusChip status={budget.status} />
      </Box>
      <Typography level="body-sm" sx={{ mt: 0.5, fontVariantNumeric: 'tabular-nums' }}>
        The pedals draw {budget.totalDrawMa} mA in all ({watts(budget.totalDrawW)})
        {budget.totalRatingMa !== null
          ? `; the supply is rated ${budget.totalRatingMa} mA (${watts(budget.totalRatingW ?? 0)}), leaving ${budget.totalHeadroomMa} mA (${watts(budget.totalHeadroomW ?? 0)}).`
          : '. List your supply’s outputs to check them against its ratings.'}
      </Typography>
      {budget.outputs.length > 0 ? (
        <Box component="ul" sx={{ listStyle: 'none', p: 0, m: 0, mt: 1.5, display: 'grid', gap: 1.5 }}>
          {budget.outputs.map((o) => {
            const share = o.ratingMa > 0 ? Math.min(1, o.loadMa / o.ratingMa) : 1;
            const over = o.loadMa > o.ratingMa || o.flags.length > 0;
            return (
              <Box component="li" key={o.output}>
                <Typography level="body-sm" sx={{ fontWeight: 'md', fontVariantNumeric: 'tabular-nums' }}>
                  {o.label}: {o.voltage} V {o.supply.toUpperCase()}
                  {o.isolated ? ', isolated' : ''} — {o.loadMa} of {o.ratingMa} mA
                  {o.headroomMa >= 0 ? `, ${o.headroomMa} mA spare` : `, over by ${-o.headroomMa} mA`}
                </Typography>
                <Box
                  aria-hidden
                  sx={{ mt: 0.5, height: 10, borderRadius: 'sm', bgcolor: 'neutral.200', overflow: 'hidden', border: '1px solid', borderColor: 'neutral.400' }}
                >
                  <Box sx={{ height: '100%', width: `${share * 100}%`, bgcolor: over ? 'danger.500' : 'primary.500' }} />
                </Box>
                {o.devices.length ? (
                  <Typography level="body-xs" sx={{ mt: 0.25 }}>Feeds {o.devices.join(', ')}</Typography>
                ) : null}
                {o.flags.map((flag) => (
                  <Typography key={flag} level="body-xs" sx={{ color: 'danger.700', fontWeight: 'md' }}>
                    {flag}
                  </Typography>
                ))}
              </Box>
            );
          })}
        </Box>
      ) : null}
      {budget.unassigned.length || budget.warnings.length ? (
        <List size="sm" marker="disc" sx={{ mt: 1, pl: 2, '--List-padding': '0' }}>
          {budget.unassigned.map((u) => (
            <ListItem key={`u-${u.device}`}>{u.device}: {u.reason}</ListItem>
          ))}
          {budget.warnings.map((w) => (
            <ListItem key={w}>{w}</ListItem>
          ))}
        </List>
      ) : null}
    </Box>
  );
}
