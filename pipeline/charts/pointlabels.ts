/**
 * Two-dimensional label placement for point features: each label tries the
 * eight positions around its point (the "8-position model" of cartographic
 * point labelling; Christensen, Marks & Shieber 1995, "An empirical study of
 * algorithms for point-feature label placement", ACM Transactions on
 * Graphics 14(3)) and takes, greedily, a free one, points placed in the
 * order given (most important first).
 *
 * A position is free when its box stays inside the bounds and overlaps no
 * label already placed and no point's disc. Among free positions, the one
 * crossed by the fewest lines wins, ties going to the earlier position in
 * the order of preference (right, left, the four corners, above, below),
 * so labels keep off the links of a network where they can.
 */

export interface Rect {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface Disc {
  x: number;
  y: number;
  r: number;
}

export interface Segment {
  x1: number;
  y1: number;
  x2: number;
  y2: number;
}

/** Names of the eight positions, in order of preference. */
export const POSITIONS = ['E', 'W', 'NE', 'SE', 'NW', 'SW', 'N', 'S'] as const;
export type Position = (typeof POSITIONS)[number];

/** Whether two rectangles overlap, with `pad` of clearance required between them. */
export function rectsOverlap(a: Rect, b: Rect, pad = 0): boolean {
  return a.x < b.x + b.width + pad && b.x < a.x + a.width + pad && a.y < b.y + b.height + pad && b.y < a.y + a.height + pad;
}

/** Whether a disc and a rectangle overlap, with `pad` of clearance. */
export function discOverlapsRect(d: Disc, b: Rect, pad = 0): boolean {
  const nx = Math.max(b.x, Math.min(d.x, b.x + b.width));
  const ny = Math.max(b.y, Math.min(d.y, b.y + b.height));
  return Math.hypot(d.x - nx, d.y - ny) < d.r + pad;
}

/** Whether a segment crosses or lies inside a rectangle (Liang–Barsky clipping). */
export function segmentHitsRect(s: Segment, b: Rect): boolean {
  const dx = s.x2 - s.x1;
  const dy = s.y2 - s.y1;
  let t0 = 0;
  let t1 = 1;
  const edges: [number, number][] = [
    [-dx, s.x1 - b.x],
    [dx, b.x + b.width - s.x1],
    [-dy, s.y1 - b.y],
    [dy, b.y + b.height - s.y1],
  ];
  for (const [p, q] of edges) {
    if (p === 0) {
      if (q < 0) return false;
      continue;
    }
    const t = q / p;
    if (p < 0) t0 = Math.max(t0, t);
    else t1 = Math.min(t1, t);
    if (t0 > t1) return false;
  }
  return true;
}

/** The rectangle of a `width` × `height` label at `pos` around a disc, `gap` away from its edge. */
export function candidateRect(d: Disc, pos: Position, width: number, height: number, gap: number): Rect {
  const off = d.r + gap;
  const diag = d.r * Math.SQRT1_2 + gap * 0.5;
  switch (pos) {
    case 'E':
      return { x: d.x + off, y: d.y - height / 2, width, height };
    case 'W':
      return { x: d.x - off - width, y: d.y - height / 2, width, height };
    case 'NE':
      return { x: d.x + diag, y: d.y - diag - height, width, height };
    case 'SE':
      return { x: d.x + diag, y: d.y + diag, width, height };
    case 'NW':
      return { x: d.x - diag - width, y: d.y - diag - height, width, height };
    case 'SW':
      return { x: d.x - diag - width, y: d.y + diag, width, height };
    case 'N':
      return { x: d.x - width / 2, y: d.y - off - height, width, height };
    default:
      return { x: d.x - width / 2, y: d.y + off, width, height };
  }
}

export interface PlaceRequest {
  /** The point's disc (the label goes around it). */
  disc: Disc;
  width: number;
  height: number;
}

export interface PlaceContext {
  bounds: Rect;
  /** Every point's disc: no label may cover one. */
  discs: readonly Disc[];
  /** Lines a label should keep off where it can. */
  segments: readonly Segment[];
  /** Rectangles already taken. Placed labels are added to it. */
  taken: Rect[];
  /** Gap between a disc's edge and its label. */
  gap: number;
  /** Clearance kept between labels, and between a label and any disc. */
  pad: number;
}

function inside(b: Rect, bounds: Rect): boolean {
  return b.x >= bounds.x && b.y >= bounds.y && b.x + b.width <= bounds.x + bounds.width && b.y + b.height <= bounds.y + bounds.height;
}

/**
 * The best free position for one label, or null when all eight collide. The
 * chosen rectangle is added to `ctx.taken`.
 */
export function placeLabel(req: PlaceRequest, ctx: PlaceContext): { pos: Position; rect: Rect } | null {
  let best: { pos: Position; rect: Rect; hits: number } | null = null;
  for (const pos of POSITIONS) {
    const rect = candidateRect(req.disc, pos, req.width, req.height, ctx.gap);
    if (!inside(rect, ctx.bounds)) continue;
    if (ctx.taken.some((t) => rectsOverlap(t, rect, ctx.pad))) continue;
    if (ctx.discs.some((d) => discOverlapsRect(d, rect, ctx.pad))) continue;
    const hits = ctx.segments.filter((s) => segmentHitsRect(s, rect)).length;
    if (!best || hits < best.hits) best = { pos, rect, hits };
    if (hits === 0) break;
  }
  if (!best) return null;
  ctx.taken.push(best.rect);
  return { pos: best.pos, rect: best.rect };
}

/**
 * Places every label in order (see `placeLabel`), then repairs: a label left
 * without a place takes a position blocked by exactly one placed label when
 * that label can move to another free position. Returns one placement (or
 * null) per request.
 */
export function placeAll(reqs: readonly PlaceRequest[], ctx: PlaceContext): ({ pos: Position; rect: Rect } | null)[] {
  const out = reqs.map((r) => placeLabel(r, ctx));
  const drop = (rect: Rect) => {
    const k = ctx.taken.indexOf(rect);
    if (k >= 0) ctx.taken.splice(k, 1);
  };
  out.forEach((placed, i) => {
    if (placed) return;
    for (const pos of POSITIONS) {
      const rect = candidateRect(reqs[i].disc, pos, reqs[i].width, reqs[i].height, ctx.gap);
      if (!inside(rect, ctx.bounds) || ctx.discs.some((d) => discOverlapsRect(d, rect, ctx.pad))) continue;
      const blockers = ctx.taken.filter((t) => rectsOverlap(t, rect, ctx.pad));
      if (blockers.length !== 1) continue;
      const j = out.findIndex((o) => o !== null && o.rect === blockers[0]);
      if (j < 0) continue;
      const old = out[j]!;
      drop(old.rect);
      ctx.taken.push(rect);
      const moved = placeLabel(reqs[j], ctx);
      if (moved) {
        out[i] = { pos, rect };
        out[j] = moved;
        return;
      }
      drop(rect);
      ctx.taken.push(old.rect);
    }
  });
  return out;
}
