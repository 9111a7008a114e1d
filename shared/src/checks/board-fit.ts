import type { SurfaceItem } from '../price-book/types';
import type { BoardFit, LayoutPlacement, RigDevice, SignalChain } from './types';

/**
 * Room around each footprint for side jacks, right-angle plugs and cable bends: 15 mm added to
 * each dimension (common practice, no published source).
 */
export const SPACING_MM = 15;

interface RowLayout {
  fits: boolean;
  placements: LayoutPlacement[];
  unplaced: string[];
}

interface Segment {
  x: number;
  width: number;
  /** How far from the front edge this stretch of the board is already filled. */
  filled: number;
}

/**
 * A plain layout in rows from the front edge (the player's side) towards the back: devices,
 * deepest first, each go where they sit closest to the front, leftmost on a tie (a skyline
 * packing), so shallow pedals stack in two rows beside a deep treadle. Not an optimal packing,
 * which is why the area bound is reported beside it: above the bound nothing fits, below it a
 * builder may still find a tighter layout.
 */
export function rowLayout(devices: RigDevice[], widthMm: number, depthMm: number, spacingMm = SPACING_MM): RowLayout {
  const items = devices
    .map((d) => ({ d, w: d.widthMm + spacingMm, h: d.depthMm + spacingMm }))
    .sort((a, b) => b.h - a.h || b.w - a.w);
  let skyline: Segment[] = [{ x: 0, width: widthMm, filled: 0 }];
  const placed: Array<{ d: RigDevice; x: number; offset: number; h: number }> = [];
  const unplaced: string[] = [];
  for (const item of items) {
    let best: { x: number; offset: number } | null = null;
    for (let i = 0; i < skyline.length; i++) {
      const x = skyline[i].x;
      if (x + item.w > widthMm) break;
      let offset = 0;
      for (let j = i; j < skyline.length && skyline[j].x < x + item.w; j++) offset = Math.max(offset, skyline[j].filled);
      if (offset + item.h <= depthMm && (!best || offset < best.offset)) best = { x, offset };
    }
    if (!best) {
      unplaced.push(item.d.name);
      continue;
    }
    placed.push({ d: item.d, x: best.x, offset: best.offset, h: item.h });
    skyline = raise(skyline, best.x, item.w, best.offset + item.h);
  }
  const bands = [...new Set(placed.map((p) => p.offset))].sort((a, b) => a - b);
  const placements = placed.map(({ d, x, offset, h }) => ({
    device: d.name,
    row: bands.indexOf(offset),
    x: x + spacingMm / 2,
    // The front edge is y = depthMm in the top view; the first row sits against it.
    y: depthMm - offset - h + spacingMm / 2,
    widthMm: d.widthMm,
    depthMm: d.depthMm,
  }));
  return { fits: unplaced.length === 0, placements, unplaced };
}

/**
 * The skyline after a device of `width` at `x` fills it up to `filled`. Segments stay in order
 * from left to right and neighbours of equal height merge, so the list stays short.
 */
function raise(skyline: Segment[], x: number, width: number, filled: number): Segment[] {
  const end = x + width;
  const out: Segment[] = [];
  const push = (s: Segment) => {
    const last = out[out.length - 1];
    if (last && last.filled === s.filled && last.x + last.width === s.x) last.width += s.width;
    else out.push({ x: s.x, width: s.width, filled: s.filled });
  };
  let placed = false;
  const place = () => {
    if (!placed) push({ x, width, filled });
    placed = true;
  };
  for (const s of skyline) {
    const sEnd = s.x + s.width;
    if (sEnd <= x) push(s);
    else if (s.x >= end) {
      place();
      push(s);
    } else {
      if (s.x < x) push({ x: s.x, width: x - s.x, filled: s.filled });
      if (sEnd > end) {
        place();
        push({ x: end, width: sEnd - end, filled: s.filled });
      }
    }
  }
  place();
  return out;
}

const areaWithSpacing = (devices: RigDevice[], spacingMm: number) =>
  devices.reduce((s, d) => s + (d.widthMm + spacingMm) * (d.depthMm + spacingMm), 0);

/** Every device on the chain sits on the surface; the supply goes underneath and takes no room. */
export function boardFitOf(chain: SignalChain, surface: SurfaceItem, surfaces: SurfaceItem[], spacingMm = SPACING_MM): BoardFit {
  const devices = chain.devices;
  const footprintAreaMm2 = devices.reduce((s, d) => s + d.widthMm * d.depthMm, 0);
  const requiredAreaMm2 = areaWithSpacing(devices, spacingMm);
  const usableAreaMm2 = surface.widthMm * surface.depthMm;
  const areaFits = requiredAreaMm2 <= usableAreaMm2;
  const layout = rowLayout(devices, surface.widthMm, surface.depthMm, spacingMm);
  const layoutFits = areaFits && layout.fits;

  // Smallest by area first; the chosen surface's own layout is already known.
  const smallest = [...surfaces]
    .sort((a, b) => a.widthMm * a.depthMm - b.widthMm * b.depthMm || Number(a.price) - Number(b.price))
    .find((s) =>
      s.id === surface.id
        ? layoutFits
        : requiredAreaMm2 <= s.widthMm * s.depthMm && rowLayout(devices, s.widthMm, s.depthMm, spacingMm).fits,
    );

  const warnings: string[] = [];
  if (!areaFits) {
    warnings.push(
      `The pedals need about ${Math.round(requiredAreaMm2 / 100) / 100} dm² with room for plugs, more than the ${surface.name}'s ${Math.round(usableAreaMm2 / 100) / 100} dm².`,
    );
  } else if (!layout.fits) {
    warnings.push(`A plain row layout does not fit on the ${surface.name} (${layout.unplaced.join(', ')} left over); a builder may still find a tighter layout.`);
  }
  if (!layoutFits) {
    warnings.push(smallest ? `The smallest surface that holds them in rows is the ${smallest.name}.` : 'No surface in the price book holds them in rows; ask about a custom surface.');
  }
  if (devices.some((d) => d.footprintFromMemory)) {
    warnings.push('Some footprints are typical sizes (from memory); give each pedal its own size for a firm fit check.');
  }
  const fillRatio = Math.round((requiredAreaMm2 / usableAreaMm2) * 1000) / 1000;
  return {
    status: !areaFits ? 'problem' : !layout.fits ? 'warning' : 'ok',
    surfaceId: surface.id,
    usableWidthMm: surface.widthMm,
    usableDepthMm: surface.depthMm,
    spacingMm,
    footprintAreaMm2,
    requiredAreaMm2,
    usableAreaMm2,
    fillRatio,
    areaFits,
    layoutFits,
    layout: layout.placements,
    unplaced: layout.unplaced,
    smallestFittingSurfaceId: smallest?.id ?? null,
    warnings,
  };
}
