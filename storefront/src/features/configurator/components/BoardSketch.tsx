import Box from '@mui/joy/Box';
import Typography from '@mui/joy/Typography';
import type { BoardFit, LayoutPlacement } from '@loomwright/shared';

/** Fill and outline per group; the legend names each, so colour is never the only signal (the key says the same in words). */
const groupStyle: Record<LayoutPlacement['group'], { fill: string; dash?: string; label: string }> = {
  chain: { fill: 'var(--joy-palette-primary-100)', label: 'In the main chain' },
  loop: { fill: 'var(--joy-palette-accent-100)', dash: '6 4', label: 'In a switcher loop (dashed outline)' },
  front: { fill: 'var(--joy-palette-neutral-200)', label: 'Front row: switcher and treadles' },
};

/**
 * A top view of the board as the player stands at it: the signal enters at the right and leaves at
 * the left. Each pedal carries its signal number; the key beside it gives the full names, so the
 * drawing reads at any width. The same numbers run through the cable list and the build sheet.
 */
export function BoardSketch({ fit, surfaceName }: { fit: BoardFit; surfaceName: string }) {
  const w = fit.usableWidthMm;
  const d = fit.usableDepthMm;
  const pad = 12;
  const bottom = 44;
  const key = [...fit.layout].sort((a, b) => a.number - b.number);
  const groups = (Object.keys(groupStyle) as Array<LayoutPlacement['group']>).filter((g) => fit.layout.some((p) => p.group === g));
  return (
    <Box>
      <Box
        component="svg"
        viewBox={`${-pad - 30} ${-pad} ${w + pad * 2 + 60} ${d + pad * 2 + bottom}`}
        role="img"
        aria-label={`Top view of the ${surfaceName}, ${w} by ${d} mm, with ${fit.layout.length} pedals numbered in signal order, input at the right${
          fit.unplaced.length ? `; ${fit.unplaced.length} do not fit` : ''
        }`}
        sx={{ width: '100%', maxHeight: 340, display: 'block' }}
      >
        <Box
          component="rect"
          x={-pad / 2}
          y={-pad / 2}
          width={w + pad}
          height={d + pad}
          rx={14}
          sx={{ fill: 'var(--joy-palette-neutral-800)' }}
        />
        {fit.tiered
          ? Array.from({ length: Math.max(0, fit.rows - 1) }, (_, i) => (
              <Box
                component="line"
                key={i}
                x1={0}
                x2={w}
                y1={((i + 1) * d) / fit.rows}
                y2={((i + 1) * d) / fit.rows}
                sx={{ stroke: 'var(--joy-palette-neutral-500)', strokeWidth: 3 }}
              />
            ))
          : null}
        {fit.layout.map((p) => {
          const style = groupStyle[p.group];
          const size = Math.max(18, Math.min(40, p.widthMm / 2.5, p.depthMm / 2));
          return (
            <g key={p.deviceId}>
              <Box
                component="rect"
                x={p.x}
                y={p.y}
                width={p.widthMm}
                height={p.depthMm}
                rx={6}
                strokeDasharray={style.dash}
                sx={{ fill: style.fill, stroke: 'var(--joy-palette-neutral-900)', strokeWidth: 2 }}
              />
              <Box
                component="text"
                x={p.x + p.widthMm / 2}
                y={p.y + p.depthMm / 2}
                textAnchor="middle"
                dominantBaseline="central"
                sx={{ fill: 'var(--joy-palette-neutral-900)', fontSize: size, fontWeight: 700, fontVariantNumeric: 'tabular-nums' }}
              >
                {p.number}
              </Box>
            </g>
          );
        })}
        <Box
          component="text"
          x={w + pad + 4}
          y={d / 2}
          textAnchor="middle"
          dominantBaseline="central"
          transform={`rotate(90 ${w + pad + 4} ${d / 2})`}
          sx={{ fill: 'var(--joy-palette-neutral-800)', fontSize: 20, fontWeight: 700 }}
        >
          IN from guitar
        </Box>
        <Box
          component="text"
          x={-pad - 4}
          y={d / 2}
          textAnchor="middle"
          dominantBaseline="central"
          transform={`rotate(-90 ${-pad - 4} ${d / 2})`}
          sx={{ fill: 'var(--joy-palette-neutral-800)', fontSize: 20, fontWeight: 700 }}
        >
          OUT to amp
        </Box>
        <Box
          component="text"
          x={w / 2}
          y={d + pad + 26}
          textAnchor="middle"
          sx={{ fill: 'var(--joy-palette-neutral-800)', fontSize: 20, fontWeight: 600 }}
        >
          Your side (where you stand)
        </Box>
      </Box>
      {groups.length > 1 ? (
        <Box component="ul" aria-label="Legend" sx={{ listStyle: 'none', p: 0, m: 0, mt: 1, display: 'flex', gap: 2, flexWrap: 'wrap' }}>
          {groups.map((g) => (
            <Box component="li" key={g} sx={{ display: 'flex', alignItems: 'center', gap: 0.75 }}>
              <Box component="svg" width={18} height={14} aria-hidden>
                <rect
                  x={1}
                  y={1}
                  width={16}
                  height={12}
                  rx={2}
                  fill={groupStyle[g].fill}
                  stroke="var(--joy-palette-neutral-900)"
                  strokeWidth={1.5}
                  strokeDasharray={groupStyle[g].dash ? '3 2' : undefined}
                />
              </Box>
              <Typography level="body-xs">{groupStyle[g].label}</Typography>
            </Box>
          ))}
        </Box>
      ) : null}
      <Box
        component="ol"
        aria-label="Key to the drawing"
        data-testid="layout-key"
        sx={{ m: 0, mt: 1, pl: 0, listStyle: 'none', columnWidth: '12rem', columnGap: 2 }}
      >
        {key.map((p) => (
          <Typography component="li" level="body-sm" key={p.deviceId} sx={{ breakInside: 'avoid', fontVariantNumeric: 'tabular-nums' }}>
            <b>{p.number}</b> {p.device}
          </Typography>
        ))}
      </Box>
      <Typography level="body-xs" sx={{ mt: 0.5 }}>
        {fit.layoutKind === 'signal'
          ? `A first layout in signal order on the ${fit.tiered ? `board's ${fit.rows} tiers` : 'board'}, from the pedal sizes you gave (or typical ones). Move pedals up or down your list to change the order; the builder settles the final layout with you.`
          : 'In signal order they do not fit, so this layout packs them tighter. The builder settles the final layout with you.'}
      </Typography>
    </Box>
  );
}
