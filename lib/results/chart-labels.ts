/**
 * Placing text on a chart so that labels do not sit on each other or on the data:
 * pure geometry in pixels, for the DO profile (components/results/profile-chart.tsx).
 */

export interface AxisLabel {
  id: string;
  /** Centre of the label along the axis, px. */
  x: number;
  /** Width of its text, px. */
  width: number;
}

export interface PlacedLabel extends AxisLabel {
  /** Row counted from the plot outwards (0 nearest), or null when it is left out. */
  row: number | null;
}

/**
 * Labels centred on their x, each put in the lowest row where it keeps `gap` px clear
 * of the labels already in that row, in order of x; a label no row has room for is
 * left out (row null), so a crowded axis is thinned rather than overprinted. A label
 * is also kept inside [minX, maxX] by sliding it (its x stays its anchor for the tick).
 * Example: three 40 px labels at x 100, 120, 300 with two rows and gap 4 → rows 0, 1, 0;
 * with one row → 0, null, 0.
 */
export function staggerLabels(labels: readonly AxisLabel[], { rows = 2, gap = 4, minX = -Infinity, maxX = Infinity }: { rows?: number; gap?: number; minX?: number; maxX?: number } = {}): PlacedLabel[] {
  const ends: number[] = Array.from({ length: rows }, () => -Infinity);
  const placed = new Map<AxisLabel, number | null>();
  for (const l of [...labels].sort((a, b) => a.x - b.x)) {
    const [left, right] = labelSpan(l, minX, maxX);
    const row = ends.findIndex((end) => left >= end + gap);
    placed.set(l, row === -1 ? null : row);
    if (row !== -1) ends[row] = right;
  }
  return labels.map((l) => ({ ...l, row: placed.get(l) ?? null }));
}

/** Where a label's text runs, px: centred on x, slid inside [minX, maxX] when it fits there. */
export function labelSpan(l: AxisLabel, minX = -Infinity, maxX = Infinity): [number, number] {
  let left = l.x - l.width / 2;
  if (left + l.width > maxX) left = maxX - l.width;
  if (left < minX) left = minX;
  return [left, left + l.width];
}

export interface Box {
  left: number;
  top: number;
  width: number;
  height: number;
}

/** Whether a point lies inside a box widened by `pad` px on every side. */
const inside = (p: { x: number; y: number }, b: Box, pad: number) =>
  p.x >= b.left - pad && p.x <= b.left + b.width + pad && p.y >= b.top - pad && p.y <= b.top + b.height + pad;

/**
 * The first box of `candidates` (in the caller's order of preference) that holds none
 * of `marks` (markers and the data line's points, px) within `pad` px; when every one
 * holds some, the one holding fewest (the first of those). Throws on no candidates.
 * Example: a mark at (10, 10), candidates at left 0 and left 100 (20 × 20) → the second.
 */
export function clearestBox<T extends Box>(candidates: readonly T[], marks: ReadonlyArray<{ x: number; y: number }>, pad = 3): T {
  if (candidates.length === 0) throw new RangeError("clearestBox: no candidate box");
  let best = candidates[0];
  let bestHits = Infinity;
  for (const c of candidates) {
    const hits = marks.reduce((n, m) => n + (inside(m, c, pad) ? 1 : 0), 0);
    if (hits === 0) return c;
    if (hits < bestHits) [best, bestHits] = [c, hits];
  }
  return best;
}

/**
 * Text width estimate, px, for a sans-serif label: `em` × font size per character
 * (0.58 em is a fair average for Source Sans 3 digits and capitals; from measurement
 * in the browser, not a published figure).
 */
export const textWidthPx = (text: string, fontSizePx: number, em = 0.58): number => text.length * fontSizePx * em;
