/**
 * Naming the points of a scatter plot, greedily: points are taken in order
 * of importance, and each name goes to the first free spot of two rings
 * around its point. The near ring (right, left, above, below, then the
 * corners) sets the name beside its point; it is free only when no other
 * point is so close to the name that the reader could pair them wrongly.
 * Two far rings set the name further out, joined to its point by a thin
 * leader that passes no other point and no other name. Every spot must stay inside the
 * bounds, off every point and off every name already set. A name with no free spot is left out (its point
 * keeps its tooltip).
 */

export interface Box {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

export interface Disc {
  x: number;
  y: number;
  r: number;
}

export interface LabelRequest {
  /** The point named, and the room it takes. */
  point: Disc;
  /** Size of the name's box. */
  width: number;
  height: number;
}

export type Anchor = 'start' | 'middle' | 'end';

export interface PlacedLabel {
  box: Box;
  /** How text set in the box is anchored, and at which x. */
  anchor: Anchor;
  textX: number;
  /** Set on the far ring: the leader runs from the point's edge to this point on the box. */
  leaderTo?: { x: number; y: number };
}

export interface PlaceOptions {
  /** Space kept between a name and anything else. Default 2. */
  gap?: number;
  /** On the near ring, no other point may come closer than this to the name. Default 16. */
  near?: number;
  /** Step from the near ring to each far ring. Default 18. */
  far?: number;
  /** Boxes already taken (names or markers placed before). Default: none. */
  taken?: readonly Box[];
  /** Lines drawn over the plot (leaders placed before, say) that no name may cross. Default: none. */
  lines?: readonly { a: { x: number; y: number }; b: { x: number; y: number } }[];
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

/** Distance from (x, y) to the segment from a to b. */
export function distanceToSegment(x: number, y: number, a: { x: number; y: number }, b: { x: number; y: number }): number {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const len2 = dx * dx + dy * dy;
  const t = len2 === 0 ? 0 : Math.min(1, Math.max(0, ((x - a.x) * dx + (y - a.y) * dy) / len2));
  return Math.hypot(x - (a.x + t * dx), y - (a.y + t * dy));
}

/** Whether the segment from a to b passes through box `b` grown by `gap` (Liang–Barsky clipping). */
export function segmentHitsBox(a: { x: number; y: number }, b: { x: number; y: number }, box: Box, gap = 0): boolean {
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

/**
 * Spots around a point at distance `d` from its centre, in order of
 * preference. Names above and below slide sideways to stay inside `bounds`.
 */
function ring(q: LabelRequest, d: number, bounds: Box): PlacedLabel[] {
  const { x, y } = q.point;
  const { width: w, height: h } = q;
  const c = d * 0.75;
  const box = (x0: number, y0: number): Box => ({ x0, y0, x1: x0 + w, y1: y0 + h });
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

function inside(b: Box, bounds: Box): boolean {
  return b.x0 >= bounds.x0 && b.x1 <= bounds.x1 && b.y0 >= bounds.y0 && b.y1 <= bounds.y1;
}

/** The point of `b` nearest to (x, y). */
function nearestOnBox(x: number, y: number, b: Box): { x: number; y: number } {
  return { x: Math.min(b.x1, Math.max(b.x0, x)), y: Math.min(b.y1, Math.max(b.y0, y)) };
}

/**
 * Places the names of `requests`, trying them in `order` (most important
 * first; indices not in `order` get no name). `points` are every point of
 * the plot, named or not. Returns one entry per request, null where the
 * name was left out.
 */
export function placeLabels(
  requests: readonly LabelRequest[],
  order: readonly number[],
  points: readonly Disc[],
  bounds: Box,
  options: PlaceOptions = {},
): (PlacedLabel | null)[] {
  const gap = options.gap ?? 2;
  const near = options.near ?? 16;
  const far = options.far ?? 18;
  const out: (PlacedLabel | null)[] = requests.map(() => null);
  const taken: Box[] = [...(options.taken ?? [])];
  const clearOfPoints = (b: Box, own: Disc, room: number) =>
    points.every((p) => (p === own ? distanceToBox(p.x, p.y, b) >= p.r + gap : distanceToBox(p.x, p.y, b) >= p.r + room));
  const leaders: { a: { x: number; y: number }; b: { x: number; y: number } }[] = [...(options.lines ?? [])];
  const free = (c: PlacedLabel) =>
    inside(c.box, bounds) && !taken.some((b) => overlaps(c.box, b, gap)) && !leaders.some((l) => segmentHitsBox(l.a, l.b, c.box, 1));
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
