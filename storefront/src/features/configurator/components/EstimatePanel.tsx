import Box from '@mui/joy/Box';
import Button from '@mui/joy/Button';
import CircularProgress from '@mui/joy/CircularProgress';
import Sheet from '@mui/joy/Sheet';
import Typography from '@mui/joy/Typography';
import { Fragment, useEffect, useState } from 'react';
import type { Catalog } from '@loomwright/shared';
import { LateAlert } from 'src/components/LateAlert';
import { formatHours, formatMoney, formatMoneyRange, formatRateRange } from 'src/lib/format';
import { markEstimateShown, type LiveEstimate } from '../hooks/use-live-estimate';
import { MissingChoices } from './MissingChoices';

/**
 * The live estimate: beside the steps on wide screens, a bottom sheet on phones (one element,
 * laid out by breakpoint, so both show the same figures).
 */
export function EstimatePanel({ live, catalog }: { live: LiveEstimate; catalog: Catalog }) {
  const [open, setOpen] = useState(false);
  const e = live.estimate;
  const currency = e?.currency ?? catalog.currency;

  useEffect(() => {
    if (e) markEstimateShown();
  }, [e]);

  const levelName = e ? (catalog.levels.find((l) => l.code === e.level)?.name ?? e.level) : '';
  const problems = e ? [e.checks?.powerBudget, e.checks?.boardFit].filter((c) => c && c.status === 'problem').length : 0;

  return (
    <Sheet
      component="aside"
      aria-labelledby="estimate-heading"
      variant="outlined"
      sx={{
        borderRadius: { xs: 0, md: 'lg' },
        p: { xs: 1.5, md: 2.5 },
        position: { xs: 'fixed', md: 'sticky' },
        bottom: { xs: 0, md: 'auto' },
        left: { xs: 0, md: 'auto' },
        right: { xs: 0, md: 'auto' },
        top: { md: 24 },
        zIndex: 5,
        boxShadow: { xs: 'lg', md: 'sm' },
        borderWidth: { xs: '1px 0 0 0', md: 1 },
        maxHeight: { xs: open ? '70dvh' : 'none', md: 'calc(100dvh - 48px)' },
        overflowY: 'auto',
        fontVariantNumeric: 'tabular-nums',
      }}
    >
      <Box sx={{ display: 'flex', alignItems: 'center', gap: 1 }}>
        <Box sx={{ flex: 1, minWidth: 0 }}>
          <Typography level="title-sm" component="h2" id="estimate-heading" sx={{ color: 'text.secondary' }}>
            Estimate
          </Typography>
          <Typography level="h3" component="p" data-testid="estimate-total" sx={{ fontSize: { xs: 'lg', md: 'xl2' } }}>
            {e ? formatMoneyRange(e.totalLow, e.totalHigh, currency) : live.missing.length ? 'Not priced yet' : '—'}
          </Typography>
        </Box>
        <Button
          size="sm"
          variant="outlined"
          aria-expanded={open}
          aria-controls="estimate-details"
          onClick={() => setOpen((o) => !o)}
          sx={{ display: { md: 'none' } }}
        >
          {open ? 'Hide details' : 'Details'}
        </Button>
      </Box>
      <Box role="status" aria-live="polite" sx={{ minHeight: 20 }}>
        {live.isUpdating ? (
          <Box sx={{ display: 'flex', alignItems: 'center', gap: 1 }}>
            {/* Joy's spinner (already in every page's first load, with Button) rather than a bar of its own. */}
            <CircularProgress
              size="sm"
              sx={{
                '--CircularProgress-size': '16px',
                '--CircularProgress-trackThickness': '2px',
                '--CircularProgress-progressThickness': '2px',
              }}
              aria-hidden
            />
            <Typography level="body-xs">Updating…</Typography>
          </Box>
        ) : live.error ? null : e ? (
          <Typography level="body-xs">
            Up to date{problems ? ` · ${problems} check${problems > 1 ? 's' : ''} need${problems > 1 ? '' : 's'} a look` : ''}
          </Typography>
        ) : null}
      </Box>
      {live.error ? (
        <LateAlert color="danger" variant="soft" size="sm" sx={{ mt: 1 }} role="alert">
          {`The estimate could not be updated: ${live.error.message}`}
          {e ? ' The figures shown are for your previous choices.' : ''}
        </LateAlert>
      ) : null}
      <Box id="estimate-details" sx={{ display: { xs: open ? 'block' : 'none', md: 'block' }, mt: 1.5 }}>
        {e ? (
          <Box
            component="dl"
            sx={{
              m: 0,
              display: 'grid',
              gridTemplateColumns: 'auto 1fr',
              columnGap: 2,
              rowGap: 0.75,
              '& dd': { m: 0, textAlign: 'right', fontWeight: 'md' },
            }}
          >
            {(
              [
                ['Labor', 'labor', `${formatMoneyRange(e.laborLow, e.laborHigh, currency)} labor (${formatHours(e.laborHours)})`],
                ['Materials', 'materials', formatMoney(e.materialsTotal, currency)],
                ['Rate', 'rate', `${levelName}, ${formatRateRange(e.rate.low, e.rate.high, currency)}`],
                ['Deposit', 'deposit', formatMoney(e.deposit, currency)],
              ] as const
            ).map(([label, id, value]) => (
              <Fragment key={id}>
                <Typography component="dt" level="body-sm">
                  {label}
                </Typography>
                <Typography component="dd" level="body-sm" data-testid={`estimate-${id}`}>
                  {value}
                </Typography>
              </Fragment>
            ))}
          </Box>
        ) : live.missing.length ? (
          <MissingChoices missing={live.missing} size="sm" />
        ) : !live.error ? (
          <Typography level="body-sm">Working out the first figures…</Typography>
        ) : null}
        {e && e.notes.length ? (
          <Box component="ul" sx={{ m: 0, mt: 1.5, pl: 2, display: 'grid', gap: 0.5 }} aria-label="Notes">
            {e.notes.slice(0, 4).map((n) => (
              <Typography component="li" level="body-xs" key={n}>
                {n}
              </Typography>
            ))}
          </Box>
        ) : null}
        {e && e.notes.length > 4 ? (
          <Typography level="body-xs" sx={{ mt: 1 }}>
            {e.notes.length - 4} more {e.notes.length - 4 === 1 ? 'note' : 'notes'} on the Review step.
          </Typography>
        ) : null}
      </Box>
    </Sheet>
  );
}
