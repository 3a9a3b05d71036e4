/**
 * Setting names beside the points of a plot, in two dimensions: the
 * geometry they are judged by (boxes, discs, segments) and the two ways the
 * charts place them.
 *
 * Eight positions (network names and keys, `placeEightWays` and
 * `placeAllEightWays`). Each name tries the eight positions around its point
 * (the "8-position model" of cartographic point labelling; Christensen,
 * Marks & Shieber 1995, "An empirical study of algorithms for point-feature
 * label placement", ACM Transactions on Graphics 14(3)) and takes, greedily,
 * a free one, points placed in the order given (most important first). A
 * position is free when its box stays inside the bounds and overlaps no
 * label already placed and no point's disc. Among free positions, the one
 * crossed by the fewest lines wins, ties going to the earlier position in
 * the order of preference (right, left, the four corners, above, below), so
 * labels keep off the links of a network where they can. A name left without
 * a place then takes a position blocked by exactly one placed name, when that
 * name can move to another free position.
 *
 * Rings (scatter names and notes, `placeInRings`). Points are taken in
 * order of importance, and each name goes to the first free spot of rings
 * around its point. The near ring (right, left, above, below, then the
 * corners) sets the name beside its point; it is free only when no other
 * point is so close to the name that the reader could pair them wrongly.
 * Two far rings set the name further out, joined to its point by a thin
 * leader that passes no other point and no other name. Every spot must stay
 * inside the bounds, off every point and off every name already set. A name
 * with no free spot is left out (its point keeps its tooltip).
 */

/** A box by its edges: x0 ≤ x1, y0 ≤ y1. */
export interface Box {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

/** A point and the room it takes. */
export interface Disc {
  x: number;
  y: number;
  r: number;
}

export interface Point {
  x: number;
  y: number;
}

/** A straight line from `a` to `b`. */
export interface Segment {
  a: Point;
  b: Point;
}

/* ---------- geometry ---------- */

/** The box of a rectangle given by its corner and size. */
export function boxOf(r: { x: number; y: number; width: number; height: number }): Box {
  return { x0: r.x, y0: r.y, x1: r.x + r.width, y1: r.y + r.height };
}

/** Whether two boxes overlap once each is grown by `gap`. */
export function overlaps(a: Box, b: Box, gap = 0): boolean {
  return a.x0 < b.x1 + gap && b.x0 < a.x1 + gap && a.y0 < b.y1 + gap && b.y0 < a.y1 + gap;
}

/** Distance from a point to the nearest point of a box (0 inside it). */
export function distanceToBox(x: number, y: number, b: Box): number {
  const dx = Math.max(b.x0 - x, 0, x - b.x1);
  const dy = Math.max(b.y0 - y, 0, y - b.y1);
  return Math.hypot(dx, dy);
}

/** Whether a disc and a box overlap, with `pad` of clearance. */
export function discOverlaps(d: Disc, b: Box, pad = 0): boolean {
  return distanceToBox(d.x, d.y, b) < d.r + pad;
}

/** Distance from (x, y) to the segment from a to b. */
export function distanceToSegment(x: number, y: number, a: Point, b: Point): number {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const len2 = dx * dx + dy * dy;
  const t = len2 === 0 ? 0 : Math.min(1, Math.max(0, ((x - a.x) * dx + (y - a.y) * dy) / len2));
  return Math.hypot(x - (a.x + t * dx), y - (a.y + t * dy));
}

/** Whether the segment from a to b crosses or lies inside `box` grown by `gap` (Liang–Barsky clipping). */
export function segmentHitsBox(a: Point, b: Point, box: Box, gap = 0): boolean {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  let t0 = 0;
  let t1 = 1;
  const edges: [number, number][] = [
    [-dx, a.x - (box.x0 - gap)],
    [dx, box.x1 + gap - a.x],
    [-dy, a.y - (box.y0 - gap)],
    [dy, box.y1 + gap - a.y],
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

function inside(b: Box, bounds: Box): boolean {
  return b.x0 >= bounds.x0 && b.x1 <= bounds.x1 && b.y0 >= bounds.y0 && b.y1 <= bounds.y1;
}

/** A box of the given size with its top-left corner at (x0, y0). */
function sized(x0: number, y0: number, width: number, height: number): Box {
  return { x0, y0, x1: x0 + width, y1: y0 + height };
}

/* ---------- eight positions ---------- */

/** Names of the eight positions, in order of preference. */
export const POSITIONS = ['E', 'W', 'NE', 'SE', 'NW', 'SW', 'N', 'S'] as const;
export type Position = (typeof POSITIONS)[number];

/** The box of a `width` × `height` label at `pos` around a disc, `gap` away from its edge. */
export function positionBox(d: Disc, pos: Position, width: number, height: number, gap: number): Box {
  const off = d.r + gap;
  const diag = d.r * Math.SQRT1_2 + gap * 0.5;
  switch (pos) {
    case 'E':
      return sized(d.x + off, d.y - height / 2, width, height);
    case 'W':
      return sized(d.x - off - width, d.y - height / 2, width, height);
    case 'NE':
      return sized(d.x + diag, d.y - diag - height, width, height);
    case 'SE':
      return sized(d.x + diag, d.y + diag, width, height);
    case 'NW':
      return sized(d.x - diag - width, d.y - diag - height, width, height);
    case 'SW':
      return sized(d.x - diag - width, d.y + diag, width, height);
    case 'N':
      return sized(d.x - width / 2, d.y - off - height, width, height);
    default:
      return sized(d.x - width / 2, d.y + off, width, height);
  }
}

export interface PositionRequest {
  /** The point's disc (the label goes around it). */
  disc: Disc;
  width: number;
  height: number;
}

export interface PositionContext {
  bounds: Box;
  /** Every point's disc: no label may cover one. */
  discs: readonly Disc[];
  /** Lines a label should keep off where it can. */
  segments: readonly Segment[];
  /** Boxes already taken. Placed labels are added to it. */
  taken: Box[];
  /** Gap between a disc's edge and its label. */
  gap: number;
  /** Clearance kept between labels, and between a label and any disc. */
  pad: number;
}

/** The best free position for one label, or null when all eight collide. The chosen box is added to `ctx.taken`. */
export function placeEightWays(req: PositionRequest, ctx: PositionContext): { pos: Position; box: Box } | null {
  let best: { pos: Position; box: Box; hits: number } | null = null;
  for (const pos of POSITIONS) {
    const box = positionBox(req.disc, pos, req.width, req.height, ctx.gap);
    if (!inside(box, ctx.bounds)) continue;
    if (ctx.taken.some((t) => overlaps(t, box, ctx.pad))) continue;
    if (ctx.discs.some((d) => discOverlaps(d, box, ctx.pad))) continue;
    const hits = ctx.segments.filter((s) => segmentHitsBox(s.a, s.b, box)).length;
    if (!best || hits < best.hits) best = { pos, box, hits };
    if (hits === 0) break;
  }
  if (!best) return null;
  ctx.taken.push(best.box);
  return { pos: best.pos, box: best.box };
}

/**
 * Places every label in order (see `placeEightWays`), then repairs: a label
 * left without a place takes a position blocked by exactly one placed label
 * when that label can move to another free position. Returns one placement
 * (or null) per request.
 */
export function placeAllEightWays(reqs: readonly PositionRequest[], ctx: PositionContext): ({ pos: Position; box: Box } | null)[] {
  const out = reqs.map((r) => placeEightWays(r, ctx));
  const drop = (box: Box) => {
    const k = ctx.taken.indexOf(box);
    if (k >= 0) ctx.taken.splice(k, 1);
  };
  out.forEach((placed, i) => {
    if (placed) return;
    for (const pos of POSITIONS) {
      const box = positionBox(reqs[i].disc, pos, reqs[i].width, reqs[i].height, ctx.gap);
      if (!inside(box, ctx.bounds) || ctx.discs.some((d) => discOverlaps(d, box, ctx.pad))) continue;
      const blockers = ctx.taken.filter((t) => overlaps(t, box, ctx.pad));
      if (blockers.length !== 1) continue;
      const j = out.findIndex((o) => o !== null && o.box === blockers[0]);
      if (j < 0) continue;
      const old = out[j]!;
      drop(old.box);
      ctx.taken.push(box);
      const moved = placeEightWays(reqs[j], ctx);
      if (moved) {
        out[i] = { pos, box };
        out[j] = moved;
        return;
      }
      drop(box);
      ctx.taken.push(old.box);
    }
  });
  return out;
}

/* ---------- rings ---------- */

export interface RingRequest {
  /** The point named, and the room it takes. */
  point: Disc;
  /** Size of the name's box. */
  width: number;
  height: number;
}

export type Anchor = 'start' | 'middle' | 'end';

export interface RingPlace {
  box: Box;
  /** How text set in the box is anchored, and at which x. */
  anchor: Anchor;
  textX: number;
  /** Set on the far ring: the leader runs from the point's edge to this point on the box. */
  leaderTo?: Point;
}

export interface RingOptions {
  /** Space kept between a name and anything else. Default 2. */
  gap?: number;
  /** On the near ring, no other point may come closer than this to the name. Default 16. */
  near?: number;
  /** Step from the near ring to each far ring. Default 18. */
  far?: number;
  /** Boxes already taken (names or markers placed before). Default: none. */
  taken?: readonly Box[];
  /** Lines drawn over the plot (leaders placed before, say) that no name may cross. Default: none. */
  lines?: readonly Segment[];
}

/**
 * Spots around a point at distance `d` from its centre, in order of
 * preference. Names above and below slide sideways to stay inside `bounds`.
 */
function ring(q: RingRequest, d: number, bounds: Box): RingPlace[] {
  const { x, y } = q.point;
  const { width: w, height: h } = q;
  const c = d * 0.75;
  const box = (x0: number, y0: number): Box => sized(x0, y0, w, h);
  const centred = Math.min(Math.max(x - w / 2, bounds.x0), bounds.x1 - w);
  return [
    { box: box(x + d, y - h / 2), anchor: 'start', textX: x + d },
    { box: box(x - d - w, y - h / 2), anchor: 'end', textX: x - d },
    { box: box(centred, y - d - h), anchor: 'middle', textX: centred + w / 2 },
    { box: box(centred, y + d), anchor: 'middle', textX: centred + w / 2 },
    { box: box(x + c, y - c - h), anchor: 'start', textX: x + c },
    { box: box(x - c - w, y - c - h), anchor: 'end', textX: x - c },
    { box: box(x + c, y + c), anchor: 'start', textX: x + c },
    { box: box(x - c - w, y + c), anchor: 'end', textX: x - c },
  ];
}

/** The point of `b` nearest to (x, y). */
function nearestOnBox(x: number, y: number, b: Box): Point {
  return { x: Math.min(b.x1, Math.max(b.x0, x)), y: Math.min(b.y1, Math.max(b.y0, y)) };
}

/**
 * Places the names of `requests`, trying them in `order` (most important
 * first; indices not in `order` get no name). `points` are every point of
 * the plot, named or not. Returns one entry per request, null where the
 * name was left out.
 */
export function placeInRings(
  requests: readonly RingRequest[],
  order: readonly number[],
  points: readonly Disc[],
  bounds: Box,
  options: RingOptions = {},
): (RingPlace | null)[] {
  const gap = options.gap ?? 2;
  const near = options.near ?? 16;
  const far = options.far ?? 18;
  const out: (RingPlace | null)[] = requests.map(() => null);
  const taken: Box[] = [...(options.taken ?? [])];
  const clearOfPoints = (b: Box, own: Disc, room: number) =>
    points.every((p) => (p === own ? distanceToBox(p.x, p.y, b) >= p.r + gap : distanceToBox(p.x, p.y, b) >= p.r + room));
  const leaders: Segment[] = [...(options.lines ?? [])];
  const free = (c: RingPlace) => inside(c.box, bounds) && !taken.some((b) => overlaps(c.box, b, gap)) && !leaders.some((l) => segmentHitsBox(l.a, l.b, c.box, 1));
  for (const i of order) {
    const q = requests[i];
    if (!q) continue;
    const own = q.point;
    const d = own.r + gap + 1;
    let spot = ring(q, d, bounds).find((c) => free(c) && clearOfPoints(c.box, own, near));
    // Then the far rings, with a leader: one and two steps out.
    for (let k = 1; !spot && k <= 2; k++) {
      spot = ring(q, d + k * far, bounds)
        .map((c) => ({ ...c, leaderTo: nearestOnBox(own.x, own.y, c.box) }))
        .find(
          (c) =>
            free(c) &&
            clearOfPoints(c.box, own, gap + 1) &&
            points.every((p) => p === own || distanceToSegment(p.x, p.y, own, c.leaderTo) >= p.r + 1) &&
            !taken.some((b) => segmentHitsBox(own, c.leaderTo, b, 1)),
        );
    }
    if (spot) {
      out[i] = spot;
      taken.push(spot.box);
      if (spot.leaderTo) leaders.push({ a: own, b: spot.leaderTo });
    }
  }
  return out;
}
