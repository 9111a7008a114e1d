import Box from '@mui/joy/Box';
import Chip from '@mui/joy/Chip';
import List from '@mui/joy/List';
import ListItem from '@mui/joy/ListItem';
import Typography from '@mui/joy/Typography';
import type { PowerBudget } from '@loomwright/shared';
import { CheckStatusChip } from './CheckStatus';
import { formatQuantity } from 'src/lib/format';

const watts = (w: number) => `${formatQuantity(w)} W`;

/**
 * The power plan: which output feeds which pedal, each output's load against its rating as a bar
 * and in words, what the player pinned, and what would fix a plan that cannot be made.
 */
export function PowerBudgetView({ budget, heading = 'Power plan' }: { budget: PowerBudget; heading?: string }) {
  const byName = new Map(budget.assignments.map((a) => [a.device, a]));
  return (
    <Box data-testid="power-plan">
      <Box sx={{ display: 'flex', alignItems: 'center', gap: 1, flexWrap: 'wrap' }}>
        <Typography level="title-md" component="h3">
          {heading}
        </Typography>
        <CheckStatusChip status={budget.status} />
      </Box>
      <Typography level="body-sm" sx={{ mt: 0.5, fontVariantNumeric: 'tabular-nums' }}>
        The pedals draw {budget.totalDrawMa} mA in all ({watts(budget.totalDrawW)}, at P = V × I)
        {budget.totalRatingMa !== null
          ? `; the supply is rated ${budget.totalRatingMa} mA (${watts(budget.totalRatingW ?? 0)}), leaving ${budget.totalHeadroomMa} mA (${watts(budget.totalHeadroomW ?? 0)}).`
          : '. List your supply’s outputs to plan which output feeds which pedal.'}
        {budget.supplyListed && budget.unassigned.length === 0
          ? ` The plan uses ${budget.outputsUsed} of ${budget.outputs.length} outputs${budget.spareOutputs ? `, leaving ${budget.spareOutputs} free for later` : ''}. Digital and high-draw pedals (over ${budget.rules.highDrawMa} mA) get outputs of their own; analog pedals share at most ${budget.rules.maxDaisyChain} to an output.`
          : ''}
      </Typography>
      {budget.fixes.length ? (
        <Box
          role="alert"
          sx={{ mt: 1.5, p: 1.5, borderRadius: 'sm', border: '1px solid', borderColor: 'danger.300', bgcolor: 'danger.50' }}
        >
          <Typography level="title-sm" component="p" sx={{ color: 'danger.800' }}>
            What would fix it
          </Typography>
          <List size="sm" marker="disc" sx={{ pl: 2, '--List-padding': '0' }}>
            {budget.fixes.map((f) => (
              <ListItem key={f}>{f}</ListItem>
            ))}
          </List>
        </Box>
      ) : null}
      {budget.outputs.length > 0 ? (
        <Box
          component="ul"
          sx={{ listStyle: 'none', p: 0, m: 0, mt: 1.5, display: 'grid', gap: 1.5 }}
          aria-label="Supply outputs and what each feeds"
        >
          {budget.outputs.map((o) => {
            const share = o.ratingMa > 0 ? Math.min(1, o.loadMa / o.ratingMa) : 1;
            const over = o.flags.length > 0;
            return (
              <Box component="li" key={o.output} data-testid={`power-output-${o.output}`}>
                <Typography level="body-sm" sx={{ fontWeight: 'md', fontVariantNumeric: 'tabular-nums' }}>
                  {o.label}: {o.voltage} V {o.supply.toUpperCase()}
                  {o.isolated ? ', isolated' : ''} — {o.loadMa} of {o.ratingMa} mA
                  {o.headroomMa >= 0 ? `, ${o.headroomMa} mA spare` : `, over by ${-o.headroomMa} mA`}
                  {over ? ' — not safe as planned' : ''}
                </Typography>
                <Box
                  aria-hidden
                  sx={{
                    mt: 0.5,
                    height: 10,
                    borderRadius: 'sm',
                    bgcolor: 'neutral.200',
                    overflow: 'hidden',
                    border: '1px solid',
                    borderColor: 'neutral.400',
                  }}
                >
                  <Box sx={{ height: '100%', width: `${share * 100}%`, bgcolor: over ? 'danger.500' : 'primary.500' }} />
                </Box>
                {o.devices.length ? (
                  <Box sx={{ mt: 0.5, display: 'flex', gap: 0.5, flexWrap: 'wrap' }}>
                    {o.devices.map((name) => {
                      const a = byName.get(name);
                      return (
                        <Chip key={name} size="sm" variant={a?.pinned ? 'solid' : 'soft'} color="neutral">
                          {name} {a ? `${a.currentMa} mA` : ''}
                          {a?.pinned ? ' · your choice' : ''}
                          {a?.reversingLead ? ' · reversing lead' : ''}
                        </Chip>
                      );
                    })}
                    {o.devices.length > 1 ? (
                      <Typography level="body-xs" sx={{ alignSelf: 'center' }}>
                        daisy chain
                      </Typography>
                    ) : null}
                  </Box>
                ) : (
                  <Typography level="body-xs" sx={{ mt: 0.25 }}>
                    Free
                  </Typography>
                )}
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
          {budget.warnings.map((w) => (
            <ListItem key={w}>{w}</ListItem>
          ))}
        </List>
      ) : null}
    </Box>
  );
}
