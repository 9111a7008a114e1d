import type { SurfaceItem, SurfaceLayout } from '../price-book/types';
import { signalOrder } from './signal-chain';
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
  return packRows(packingItems(devices, spacingMm), widthMm, depthMm, spacingMm, true);
}

interface PackingItem {
  d: RigDevice;
  w: number;
  h: number;
}

/** Devices grown by the spacing, deepest first (widest on a tie): the order the packing places them in. */
const packingItems = (devices: RigDevice[], spacingMm: number): PackingItem[] =>
  devices.map((d) => ({ d, w: d.widthMm + spacingMm, h: d.depthMm + spacingMm })).sort((a, b) => b.h - a.h || b.w - a.w);

/**
 * The skyline packing over items already in order. With `withPlacements` false it only answers
 * whether everything fits (and stops at the first device left over): the smallest-surface search
 * asks that of every smaller surface, and needs no drawing.
 */
function packRows(items: PackingItem[], widthMm: number, depthMm: number, spacingMm: number, withPlacements: boolean): RowLayout {
  const placed: Array<{ d: RigDevice; x: number; offset: number; h: number }> = [];
  let skyline: Segment[] = [{ x: 0, width: widthMm, filled: 0 }];
  const unplaced: string[] = [];
  for (const item of items) {
    let bestX = -1;
    let bestOffset = Infinity;
    for (let i = 0; i < skyline.length; i++) {
      const x = skyline[i].x;
      if (x + item.w > widthMm) break;
      let offset = 0;
      for (let j = i; j < skyline.length && skyline[j].x < x + item.w; j++) if (skyline[j].filled > offset) offset = skyline[j].filled;
      if (offset + item.h <= depthMm && offset < bestOffset) {
        bestX = x;
        bestOffset = offset;
      }
    }
    if (bestX < 0) {
      unplaced.push(item.d.name);
      if (!withPlacements) return { fits: false, placements: [], unplaced };
      continue;
    }
    if (withPlacements) placed.push({ d: item.d, x: bestX, offset: bestOffset, h: item.h });
    skyline = raise(skyline, bestX, item.w, bestOffset + item.h);
  }
  if (!withPlacements) return { fits: unplaced.length === 0, placements: [], unplaced };
  const bands = [...new Set(placed.map((p) => p.offset))].sort((a, b) => a - b);
  const placements = placed.map(({ d, x, offset, h }) => ({
    device: d.name,
    deviceId: d.id,
    number: d.number,
    group: groupOf(d, 'front'),
    row: bands.indexOf(offset),
    x: x + spacingMm / 2,
    // The front edge is y = depthMm in the top view; the first row sits against it.
    y: depthMm - offset - h + spacingMm / 2,
    widthMm: d.widthMm,
    depthMm: d.depthMm,
  }));
  return { fits: unplaced.length === 0, placements, unplaced };
}

const groupOf = (d: RigDevice, switcherRow: SurfaceLayout['switcherRow']): LayoutPlacement['group'] =>
  d.kind === 'treadle' || (d.kind === 'switcher' && switcherRow === 'front') ? 'front' : d.loop !== null ? 'loop' : 'chain';

/** A surface the price book gives no layout for: rows of about 150 mm from its depth, switcher at the front. */
export const defaultSurfaceLayout = (depthMm: number): SurfaceLayout => ({
  rows: Math.max(1, Math.floor(depthMm / 150)),
  tiered: false,
  switcherRow: 'front',
});

/**
 * The layout a builder starts from (common practice, no published source): the signal enters at
 * the right and leaves at the left as seen by the player standing at the board, pedals run in
 * signal order right to left along the back row, then the next row forward; treadles and (where
 * the surface says so) the switcher take the front row, under the player's feet. A tiered
 * board's tiers are its rows and are never exceeded; a flat board takes another row if its depth
 * allows.
 */
export function signalFlowLayout(
  chain: SignalChain,
  widthMm: number,
  depthMm: number,
  surfaceLayout: SurfaceLayout,
  spacingMm = SPACING_MM,
): RowLayout {
  return flowRows(inSignalOrder(chain), widthMm, depthMm, surfaceLayout, spacingMm, true);
}

/** The chain's devices in signal order (switcher loops after the switcher). */
function inSignalOrder(chain: SignalChain): RigDevice[] {
  const byId = new Map(chain.devices.map((d) => [d.id, d]));
  return signalOrder(chain)
    .map((id) => byId.get(id)!)
    .filter(Boolean);
}

/** The signal-order layout over devices already in signal order; `withPlacements` false answers only whether it fits. */
function flowRows(
  ordered: RigDevice[],
  widthMm: number,
  depthMm: number,
  surfaceLayout: SurfaceLayout,
  spacingMm: number,
  withPlacements: boolean,
): RowLayout {
  // Each footprint is grown by the spacing, half on each side; at the board's edges that half
  // may reach the rim, so the grown boxes fill an area one spacing wider and deeper.
  const W = widthMm + spacingMm;
  const D = depthMm + spacingMm;
  const front = ordered.filter((d) => groupOf(d, surfaceLayout.switcherRow) === 'front');
  const backSwitcher = surfaceLayout.switcherRow === 'back' ? ordered.filter((d) => d.kind === 'switcher') : [];
  const rest = [...backSwitcher, ...ordered.filter((d) => !front.includes(d) && !backSwitcher.includes(d))];
  const restRows = Math.max(1, surfaceLayout.rows - (front.length ? 1 : 0));

  // Rows from the back; each filled from the right.
  const rows: RigDevice[][] = [];
  let used = Infinity;
  for (const d of rest) {
    const w = d.widthMm + spacingMm;
    if (used + w > W) {
      rows.push([]);
      used = 0;
    }
    rows[rows.length - 1].push(d);
    used += w;
  }
  if (front.length) rows.push(front);
  const unplaced: string[] = [];
  const height = (row: RigDevice[]) => Math.max(0, ...row.map((d) => d.depthMm + spacingMm));
  const frontHeight = front.length ? height(front) : 0;
  const placements: LayoutPlacement[] = [];
  let top = 0;
  rows.forEach((row, r) => {
    const isFront = front.length > 0 && r === rows.length - 1;
    const h = height(row);
    const tooMany = !isFront && surfaceLayout.tiered && r >= restRows;
    const tooDeep = isFront ? top + h > D : top + h + frontHeight > D;
    let x = W;
    for (const d of row) {
      const w = d.widthMm + spacingMm;
      if (tooMany || tooDeep || x - w < -0.001) {
        unplaced.push(d.name);
        continue;
      }
      x -= w;
      if (!withPlacements) continue;
      placements.push({
        device: d.name,
        deviceId: d.id,
        number: d.number,
        group: groupOf(d, surfaceLayout.switcherRow),
        // Rows numbered from the front (0) to the back, as the packed layout numbers them.
        row: rows.length - 1 - r,
        x,
        // The front row sits against the front edge (y = depthMm); the others stack from the back.
        y: isFront ? depthMm - d.depthMm : top,
        widthMm: d.widthMm,
        depthMm: d.depthMm,
      });
    }
    if (!isFront && !tooMany && !tooDeep) top += h;
  });
  return { fits: unplaced.length === 0, placements, unplaced };
}

/**
 * The skyline after a device of `width` at `x` fills it up to `filled`. Segments stay in order
 * from left to right and neighbours of equal height merge, so the list stays short.
 */
function raise(skyline: Segment[], x: number, width: number, filled: number): Segment[] {
  const end = x + width;
  const out: Segment[] = [];
  // Appends a stretch, merging it into the last one when they touch at the same height.
  const put = (sx: number, sw: number, sf: number) => {
    const last = out.length > 0 ? out[out.length - 1] : undefined;
    if (last !== undefined && last.filled === sf && last.x + last.width === sx) last.width += sw;
    else out.push({ x: sx, width: sw, filled: sf });
  };
  let placed = false;
  for (const s of skyline) {
    const sEnd = s.x + s.width;
    if (sEnd <= x) put(s.x, s.width, s.filled);
    else if (s.x >= end) {
      if (!placed) put(x, width, filled);
      placed = true;
      put(s.x, s.width, s.filled);
    } else {
      if (s.x < x) put(s.x, x - s.x, s.filled);
      if (sEnd > end) {
        if (!placed) put(x, width, filled);
        placed = true;
        put(end, sEnd - end, s.filled);
      }
    }
  }
  if (!placed) put(x, width, filled);
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
  const surfaceLayout = surface.layout ?? defaultSurfaceLayout(surface.depthMm);
  // The signal order and the packing order do not depend on the surface: worked out once.
  const ordered = inSignalOrder(chain);
  let items: PackingItem[] | undefined;
  const packingOrder = () => (items ??= packingItems(devices, spacingMm));
  const flow = flowRows(ordered, surface.widthMm, surface.depthMm, surfaceLayout, spacingMm, true);
  const packed = flow.fits ? flow : packRows(packingOrder(), surface.widthMm, surface.depthMm, spacingMm, true);
  const layout = flow.fits || !packed.fits ? flow : packed;
  const layoutFits = areaFits && (flow.fits || packed.fits);

  // Smallest by area first; the chosen surface's own layout is already known.
  const smallest = [...surfaces]
    .sort((a, b) => a.widthMm * a.depthMm - b.widthMm * b.depthMm || Number(a.price) - Number(b.price))
    .find((s) =>
      s.id === surface.id
        ? layoutFits
        : requiredAreaMm2 <= s.widthMm * s.depthMm &&
          (flowRows(ordered, s.widthMm, s.depthMm, s.layout ?? defaultSurfaceLayout(s.depthMm), spacingMm, false).fits ||
            packRows(packingOrder(), s.widthMm, s.depthMm, spacingMm, false).fits),
    );

  const warnings: string[] = [];
  if (!areaFits) {
    warnings.push(
      `The pedals need about ${Math.round(requiredAreaMm2 / 100) / 100} dm² with room for plugs, more than the ${surface.name}'s ${Math.round(usableAreaMm2 / 100) / 100} dm².`,
    );
  } else if (!flow.fits && packed.fits) {
    warnings.push(
      `In signal order the pedals do not fit the ${surface.name}'s ${surfaceLayout.rows} ${surfaceLayout.tiered ? 'tiers' : 'rows'}; the drawing packs them tighter, out of signal order, and the builder settles the layout with you.`,
    );
  } else if (!layoutFits) {
    warnings.push(
      `A layout in rows does not fit on the ${surface.name} (${layout.unplaced.join(', ')} left over); a builder may still find a tighter layout.`,
    );
  }
  if (!layoutFits) {
    warnings.push(
      smallest
        ? `The smallest surface that holds them in rows is the ${smallest.name}.`
        : 'No surface in the price book holds them in rows; ask about a custom surface.',
    );
  }
  if (devices.some((d) => d.footprintFromMemory)) {
    warnings.push(TYPICAL_FOOTPRINTS_WARNING);
  }
  const fillRatio = Math.round((requiredAreaMm2 / usableAreaMm2) * 1000) / 1000;
  return {
    status: !areaFits ? 'problem' : !layoutFits ? 'warning' : 'ok',
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
    layoutKind: layout === flow ? 'signal' : 'packed',
    rows: surfaceLayout.rows,
    tiered: surfaceLayout.tiered,
    unplaced: layout.unplaced,
    smallestFittingSurfaceId: smallest?.id ?? null,
    warnings,
  };
}

/** Said when some pedals have no size of their own (the typical sizes are from memory, see typical-hardware.ts). */
export const TYPICAL_FOOTPRINTS_WARNING = 'Some footprints are typical sizes; give each pedal its own size for a firm fit check.';
