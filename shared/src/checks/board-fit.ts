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

/**
 * A plain row layout (first-fit decreasing by depth): devices sorted deepest first fill rows from
 * the front edge, each new row behind the last. Not an optimal packing, which is why the area
 * bound is reported beside it: above the bound nothing fits, below it a builder may still find a
 * tighter layout than rows.
 */
export function rowLayout(devices: RigDevice[], widthMm: number, depthMm: number, spacingMm = SPACING_MM): RowLayout {
  const items = devices
    .map((d) => ({ d, w: d.widthMm + spacingMm, h: d.depthMm + spacingMm }))
    .sort((a, b) => b.h - a.h || b.w - a.w);
  const rows: Array<{ depth: number; used: number; offset: number }> = [];
  const placements: LayoutPlacement[] = [];
  const unplaced: string[] = [];
  for (const item of items) {
    let row = rows.findIndex((r) => r.used + item.w <= widthMm && item.h <= r.depth);
    if (row < 0) {
      const offset = rows.reduce((s, r) => s + r.depth, 0);
      if (item.w > widthMm || offset + item.h > depthMm) {
        unplaced.push(item.d.name);
        continue;
      }
      rows.push({ depth: item.h, used: 0, offset });
      row = rows.length - 1;
    }
    const r = rows[row];
    placements.push({
      device: item.d.name,
      row,
      x: r.used + spacingMm / 2,
      // Rows fill from the front (the player's side, y = depthMm) towards the back (y = 0).
      y: depthMm - r.offset - item.h + spacingMm / 2,
      widthMm: item.d.widthMm,
      depthMm: item.d.depthMm,
    });
    r.used += item.w;
  }
  return { fits: unplaced.length === 0, placements, unplaced };
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

  const smallest = [...surfaces]
    .sort((a, b) => a.widthMm * a.depthMm - b.widthMm * b.depthMm || Number(a.price) - Number(b.price))
    .find((s) => areaWithSpacing(devices, spacingMm) <= s.widthMm * s.depthMm && rowLayout(devices, s.widthMm, s.depthMm, spacingMm).fits);

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
