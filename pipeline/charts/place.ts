/**
 * One-dimensional placement: spreading labels apart without overlap, and
 * thinning tick labels that would collide.
 */

/**
 * Positions as close as possible to `targets`, at least `gap` apart, inside
 * [lo, hi] when there is room. Overlapping labels are merged into clusters
 * centred on the mean of their targets, then clamped into range, repeatedly
 * until no clusters overlap. Returns positions in the order of `targets`.
 */
export function spreadApart(targets: readonly number[], gap: number, lo: number, hi: number): number[] {
  const order = targets.map((t, i) => ({ t, i })).sort((a, b) => a.t - b.t || a.i - b.i);
  interface Cluster {
    members: { t: number; i: number }[];
    start: number;
  }
  const place = (c: Cluster): void => {
    const n = c.members.length;
    const mean = c.members.reduce((s, m) => s + m.t, 0) / n;
    let start = mean - ((n - 1) * gap) / 2;
    const span = (n - 1) * gap;
    if (start + span > hi) start = hi - span;
    if (start < lo) start = lo;
    c.start = start;
  };
  const stack: Cluster[] = [];
  for (const m of order) {
    const c: Cluster = { members: [m], start: m.t };
    place(c);
    stack.push(c);
    while (stack.length > 1) {
      const b = stack[stack.length - 1];
      const a = stack[stack.length - 2];
      if (a.start + (a.members.length - 1) * gap + gap <= b.start + 1e-9) break;
      stack.pop();
      a.members.push(...b.members);
      place(a);
    }
  }
  const out = new Array<number>(targets.length);
  for (const c of stack) c.members.forEach((m, k) => (out[m.i] = c.start + k * gap));
  return out;
}

export interface LabelSpan {
  /** Centre of the label along the axis. */
  at: number;
  /** Width of the label along the axis. */
  width: number;
}

/** Whether two centred labels keep at least `gap` between them. */
function clear(a: LabelSpan, b: LabelSpan, gap: number): boolean {
  return Math.abs(b.at - a.at) >= (a.width + b.width) / 2 + gap;
}

/**
 * Indices of the labels to keep when showing every k-th one, with the
 * smallest k for which no two kept labels collide. Keeps regular rhythm,
 * which suits evenly spaced ticks.
 */
export function thinEvenly(labels: readonly LabelSpan[], gap: number): number[] {
  for (let step = 1; step <= Math.max(1, labels.length); step++) {
    const kept: number[] = [];
    for (let i = 0; i < labels.length; i += step) kept.push(i);
    if (kept.every((k, j) => j === 0 || clear(labels[kept[j - 1]], labels[k], gap))) return kept;
  }
  return labels.length ? [0] : [];
}

/**
 * Indices of the labels to keep, left to right, dropping any label that
 * would collide with the last one kept. Suits unevenly spaced ticks.
 */
export function thinGreedy(labels: readonly LabelSpan[], gap: number): number[] {
  const order = labels.map((l, i) => i).sort((a, b) => labels[a].at - labels[b].at || a - b);
  const kept: number[] = [];
  for (const i of order) {
    if (kept.length === 0 || clear(labels[kept[kept.length - 1]], labels[i], gap)) kept.push(i);
  }
  return kept.sort((a, b) => a - b);
}
