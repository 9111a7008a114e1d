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

/**
 * Devices grown by the spacing, deepest first (widest on a tie, else in the chain's order): the
 * order the packing places them in. An insertion sort, stable as Array#sort is: a rig has a few
 * dozen devices at most.
 */
function packingItems(devices: RigDevice[], spacingMm: number): PackingItem[] {
  const items: PackingItem[] = [];
  for (const d of devices) {
    const item = { d, w: d.widthMm + spacingMm, h: d.depthMm + spacingMm };
    let i = items.length;
    while (i > 0 && (items[i - 1].h < item.h || (items[i - 1].h === item.h && items[i - 1].w < item.w))) i--;
    items.splice(i, 0, item);
  }
  return items;
}

/**
 * The skyline, as three parallel lists (start, width, filled depth) of stretches from left to
 * right, with a second set the next skyline is written into. Kept between calls and grown when a
 * rig needs more: the packing runs several times per estimate and a list of objects per placement
 * was most of its cost. Nothing else runs while a packing does, so one set serves every call.
 */
let skyX = new Float64Array(64);
let skyW = new Float64Array(64);
let skyF = new Float64Array(64);
let nextX = new Float64Array(64);
let nextW = new Float64Array(64);
let nextF = new Float64Array(64);

/**
 * The skyline packing over items already in order. With `withPlacements` false it only answers
 * whether everything fits (and stops at the first device left over): the smallest-surface search
 * asks that of every smaller surface, and needs no drawing.
 */
function packRows(items: PackingItem[], widthMm: number, depthMm: number, spacingMm: number, withPlacements: boolean): RowLayout {
  // Each placement adds at most two stretches.
  const room = 2 * items.length + 2;
  if (skyX.length < room) {
    skyX = new Float64Array(room);
    skyW = new Float64Array(room);
    skyF = new Float64Array(room);
    nextX = new Float64Array(room);
    nextW = new Float64Array(room);
    nextF = new Float64Array(room);
  }
  const placed: Array<{ d: RigDevice; x: number; offset: number; h: number }> = [];
  skyX[0] = 0;
  skyW[0] = widthMm;
  skyF[0] = 0;
  let length = 1;
  const unplaced: string[] = [];
  for (const item of items) {
    const { w, h } = item;
    let bestX = -1;
    let bestOffset = Infinity;
    // The leftmost of the lowest places the device fits. A place's height only grows as more of
    // the skyline under it is read, so reading stops once it is no lower than the best so far,
    // and the search ends at a place on the front edge itself (nothing is lower).
    for (let i = 0; i < length && bestOffset > 0; i++) {
      const x = skyX[i];
      const xEnd = x + w;
      if (xEnd > widthMm) break;
      let offset = 0;
      for (let j = i; j < length && skyX[j] < xEnd && offset < bestOffset; j++) if (skyF[j] > offset) offset = skyF[j];
      if (offset + h <= depthMm && offset < bestOffset) {
        bestX = x;
        bestOffset = offset;
      }
    }
    if (bestX < 0) {
      unplaced.push(item.d.name);
      if (!withPlacements) return { fits: false, placements: [], unplaced };
      continue;
    }
    if (withPlacements) placed.push({ d: item.d, x: bestX, offset: bestOffset, h });
    length = raise(length, bestX, w, bestOffset + h);
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
  return flowRows(flowOrder(inSignalOrder(chain), surfaceLayout.switcherRow), widthMm, depthMm, surfaceLayout, spacingMm);
}

/** The chain's devices in signal order (switcher loops after the switcher). */
function inSignalOrder(chain: SignalChain): RigDevice[] {
  const byId = new Map<string, RigDevice>();
  for (const d of chain.devices) byId.set(d.id, d);
  const ordered: RigDevice[] = [];
  for (const id of signalOrder(chain)) {
    const d = byId.get(id);
    if (d) ordered.push(d);
  }
  return ordered;
}

/** The devices of the front row (treadles, and the switcher where the surface puts it there) and the rest, back row first. */
interface FlowOrder {
  front: RigDevice[];
  rest: RigDevice[];
}

/** The signal order split into the front row and the rest (a back-row switcher first), for one switcher position. */
function flowOrder(ordered: RigDevice[], switcherRow: SurfaceLayout['switcherRow']): FlowOrder {
  const front = ordered.filter((d) => groupOf(d, switcherRow) === 'front');
  const backSwitcher = switcherRow === 'back' ? ordered.filter((d) => d.kind === 'switcher') : [];
  const rest = [...backSwitcher, ...ordered.filter((d) => !front.includes(d) && !backSwitcher.includes(d))];
  return { front, rest };
}

/** flowRows' answer to "does it fit", without drawing anything: the smallest-surface search asks it of each smaller surface. */
function flowFits({ front, rest }: FlowOrder, widthMm: number, depthMm: number, surfaceLayout: SurfaceLayout, spacingMm: number): boolean {
  // The same rows, heights and sums as flowRows, in the same order, stopping at the first device left over.
  const W = widthMm + spacingMm;
  const D = depthMm + spacingMm;
  const restRows = Math.max(1, surfaceLayout.rows - (front.length ? 1 : 0));
  let frontHeight = 0;
  for (const d of front) frontHeight = Math.max(frontHeight, d.depthMm + spacingMm);
  let top = 0;
  let row = -1;
  let rowHeight = 0;
  let used = Infinity;
  let x = W;
  // A row is judged once its height is known: on a tiered board past its tiers, or too deep with the front row, nothing in it fits.
  const rowFits = () => !(surfaceLayout.tiered && row >= restRows) && !(top + rowHeight + frontHeight > D);
  for (const d of rest) {
    const w = d.widthMm + spacingMm;
    if (used + w > W) {
      if (row >= 0) {
        if (!rowFits()) return false;
        top += rowHeight;
      }
      row += 1;
      rowHeight = 0;
      used = 0;
      x = W;
    }
    used += w;
    rowHeight = Math.max(rowHeight, d.depthMm + spacingMm);
    if (x - w < -0.001) return false;
    x -= w;
  }
  if (row >= 0) {
    if (!rowFits()) return false;
    top += rowHeight;
  }
  if (front.length === 0) return true;
  if (top + frontHeight > D) return false;
  x = W;
  for (const d of front) {
    const w = d.widthMm + spacingMm;
    if (x - w < -0.001) return false;
    x -= w;
  }
  return true;
}

/** The signal-order layout over devices already in signal order, with its drawing. */
function flowRows(
  { front, rest }: FlowOrder,
  widthMm: number,
  depthMm: number,
  surfaceLayout: SurfaceLayout,
  spacingMm: number,
): RowLayout {
  // Each footprint is grown by the spacing, half on each side; at the board's edges that half
  // may reach the rim, so the grown boxes fill an area one spacing wider and deeper.
  const W = widthMm + spacingMm;
  const D = depthMm + spacingMm;
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
 * The skyline after a device of `width` at `x` fills it up to `filled`, written into the second
 * set of lists, which then becomes the skyline; answers its length. Stretches stay in order from
 * left to right and neighbours of equal height merge, so the list stays short.
 */
function raise(length: number, x: number, width: number, filled: number): number {
  const end = x + width;
  let out = 0;
  let placed = false;
  for (let i = 0; i < length; i++) {
    const sx = skyX[i];
    const sw = skyW[i];
    const sf = skyF[i];
    const sEnd = sx + sw;
    if (sEnd <= x) out = put(out, sx, sw, sf);
    else if (sx >= end) {
      if (!placed) out = put(out, x, width, filled);
      placed = true;
      out = put(out, sx, sw, sf);
    } else {
      if (sx < x) out = put(out, sx, x - sx, sf);
      if (sEnd > end) {
        if (!placed) out = put(out, x, width, filled);
        placed = true;
        out = put(out, end, sEnd - end, sf);
      }
    }
  }
  if (!placed) out = put(out, x, width, filled);
  const [x0, w0, f0] = [skyX, skyW, skyF];
  skyX = nextX;
  skyW = nextW;
  skyF = nextF;
  nextX = x0;
  nextW = w0;
  nextF = f0;
  return out;
}

/** Appends a stretch to the next skyline (of `out` stretches so far), merging it into the last one when they touch at the same height. */
function put(out: number, sx: number, sw: number, sf: number): number {
  if (out > 0 && nextF[out - 1] === sf && nextX[out - 1] + nextW[out - 1] === sx) {
    nextW[out - 1] += sw;
    return out;
  }
  nextX[out] = sx;
  nextW[out] = sw;
  nextF[out] = sf;
  return out + 1;
}

/**
 * A book's surfaces from the smallest area up (the cheaper first on a tie), sorted once per list: a
 * published book is never changed in place, so its list keeps its order.
 */
const sortedSurfaces = new WeakMap<SurfaceItem[], SurfaceItem[]>();
function bySize(surfaces: SurfaceItem[]): SurfaceItem[] {
  let sorted = sortedSurfaces.get(surfaces);
  if (!sorted) {
    sorted = [...surfaces].sort((a, b) => a.widthMm * a.depthMm - b.widthMm * b.depthMm || Number(a.price) - Number(b.price));
    sortedSurfaces.set(surfaces, sorted);
  }
  return sorted;
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
  // The signal order (split for each place a surface may put the switcher) and the packing order
  // do not depend on the surface: worked out once, when first asked for.
  const ordered = inSignalOrder(chain);
  const orders: Partial<Record<SurfaceLayout['switcherRow'], FlowOrder>> = {};
  const flowOrderFor = (layout: SurfaceLayout) => (orders[layout.switcherRow] ??= flowOrder(ordered, layout.switcherRow));
  let items: PackingItem[] | undefined;
  const packingOrder = () => (items ??= packingItems(devices, spacingMm));
  const flow = flowRows(flowOrderFor(surfaceLayout), surface.widthMm, surface.depthMm, surfaceLayout, spacingMm);
  const packed = flow.fits ? flow : packRows(packingOrder(), surface.widthMm, surface.depthMm, spacingMm, true);
  const layout = flow.fits || !packed.fits ? flow : packed;
  const layoutFits = areaFits && (flow.fits || packed.fits);

  // Smallest by area first; the chosen surface's own layout is already known.
  const smallest = bySize(surfaces).find((s) => {
    if (s.id === surface.id) return layoutFits;
    if (requiredAreaMm2 > s.widthMm * s.depthMm) return false;
    const layout = s.layout ?? defaultSurfaceLayout(s.depthMm);
    return (
      flowFits(flowOrderFor(layout), s.widthMm, s.depthMm, layout, spacingMm) ||
      packRows(packingOrder(), s.widthMm, s.depthMm, spacingMm, false).fits
    );
  });

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
