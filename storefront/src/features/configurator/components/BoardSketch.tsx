import Box from '@mui/joy/Box';
import Typography from '@mui/joy/Typography';
import type { BoardFit } from '@loomwright/shared';

/**
 * A plain top view of the board: the usable surface and each pedal where the row layout puts it.
 * The drawing is decoration for sighted players; the same facts are in the words beside it.
 */
export function BoardSketch({ fit, surfaceName }: { fit: BoardFit; surfaceName: string }) {
  const w = fit.usableWidthMm;
  const d = fit.usableDepthMm;
  const pad = 12;
  return (
    <Box>
      <Box
        component="svg"
        viewBox={`${-pad} ${-pad} ${w + pad * 2} ${d + pad * 2}`}
        role="img"
        aria-label={`Top view of the ${surfaceName}, ${w} by ${d} mm, with ${fit.layout.length} pedals laid out in rows${
          fit.unplaced.length ? `; ${fit.unplaced.length} do not fit` : ''
        }`}
        sx={{ width: '100%', maxHeight: 320, display: 'block' }}
      >
        <Box component="rect" x={-pad / 2} y={-pad / 2} width={w + pad} height={d + pad} rx={14} sx={{ fill: 'var(--joy-palette-neutral-800)' }} />
        {/* slats of the surface */}
        {Array.from({ length: Math.max(1, Math.floor(d / 60)) }, (_, i) => (
          <Box
            component="line"
            key={i}
            x1={0}
            x2={w}
            y1={((i + 1) * d) / (Math.floor(d / 60) + 1)}
            y2={((i + 1) * d) / (Math.floor(d / 60) + 1)}
            sx={{ stroke: 'var(--joy-palette-neutral-700)', strokeWidth: 2 }}
          />
        ))}
        {fit.layout.map((p, i) => (
          <g key={`${p.device}-${i}`}>
            <Box
              component="rect"
              x={p.x}
              y={p.y}
              width={p.widthMm}
              height={p.depthMm}
              rx={6}
              sx={{
                fill: i % 2 ? 'var(--joy-palette-primary-100)' : 'var(--joy-palette-accent-100)',
                stroke: 'var(--joy-palette-neutral-900)',
                strokeWidth: 1.5,
              }}
            />
            <Box
              component="text"
              x={p.x + p.widthMm / 2}
              y={p.y + p.depthMm / 2}
              textAnchor="middle"
              dominantBaseline="middle"
              sx={{ fill: 'var(--joy-palette-neutral-900)', fontSize: Math.min(16, Math.max(9, p.widthMm / 6)), fontWeight: 600 }}
            >
              {p.device.length > p.widthMm / 7 ? `${p.device.slice(0, Math.max(3, Math.floor(p.widthMm / 8)))}…` : p.device}
            </Box>
          </g>
        ))}
      </Box>
      <Typography level="body-xs" sx={{ mt: 0.5 }}>
        A first layout in rows, from the pedal sizes you gave (or typical ones). The builder settles the final layout with you.
      </Typography>
    </Box>
  );
}
