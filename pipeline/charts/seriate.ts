/**
 * Seriation: an order of the rows (or columns) of a matrix that puts similar
 * ones next to each other, so blocks show up in a heatmap.
 *
 * Method: average-linkage agglomerative clustering (UPGMA; Sokal & Michener
 * 1958) on the rows' profiles, then the leaves of the tree read left to
 * right. Each merge lays its two halves out in whichever of the four
 * orientations (each half as is or reversed) puts the two closest end
 * leaves side by side — the "flipping" rule of Gruvaeus & Wainer 1972
 * ("Two additions to hierarchical cluster analysis", British Journal of
 * Mathematical and Statistical Psychology 25). Profiles are the rows
 * scaled to unit length, compared by Euclidean distance, so two rows with
 * the same shape but different totals count as alike.
 *
 * Deterministic: ties between pairs go to the pair of earliest clusters, ties
 * between orientations to the first in the order above; at the end the order
 * is turned so that the row given first of its two ends comes first.
 */

export interface Merge {
  /** Leaves of the two clusters joined, each in its laid-out order. */
  a: number[];
  b: number[];
  /** Average distance between their members: the height of the join. */
  height: number;
}

export interface Clustering {
  /** Leaf indices in display order. */
  order: number[];
  /** The joins in the order they were made. */
  merges: Merge[];
}

/** Euclidean distance of two equal-length vectors. */
function euclid(a: readonly number[], b: readonly number[]): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += (a[i] - b[i]) ** 2;
  return Math.sqrt(s);
}

/** `v` scaled to unit Euclidean length; a zero vector stays zero. */
export function unitProfile(v: readonly number[]): number[] {
  const len = Math.hypot(...v);
  return len > 0 ? v.map((x) => x / len) : v.map(() => 0);
}

/**
 * Average-linkage clustering of `n` items given their distances (symmetric,
 * zero diagonal), with the leaf order laid out by flipping (see the file
 * comment).
 */
export function averageLinkage(dist: readonly (readonly number[])[]): Clustering {
  const n = dist.length;
  if (n === 0) return { order: [], merges: [] };
  interface Cluster {
    leaves: number[];
    alive: boolean;
  }
  const clusters: Cluster[] = Array.from({ length: n }, (_, i) => ({ leaves: [i], alive: true }));
  // d[i][j]: average distance between clusters i and j (grows as clusters are added).
  const d: number[][] = dist.map((row) => [...row]);
  const merges: Merge[] = [];
  for (let step = 1; step < n; step++) {
    let best: [number, number] | null = null;
    let bestD = Infinity;
    for (let i = 0; i < clusters.length; i++) {
      if (!clusters[i].alive) continue;
      for (let j = i + 1; j < clusters.length; j++) {
        if (!clusters[j].alive) continue;
        if (d[i][j] < bestD - 1e-12) {
          bestD = d[i][j];
          best = [i, j];
        }
      }
    }
    const [i, j] = best!;
    const A = clusters[i].leaves;
    const B = clusters[j].leaves;
    const rA = [...A].reverse();
    const rB = [...B].reverse();
    const options: [number[], number[]][] = [
      [A, B],
      [A, rB],
      [rA, B],
      [rA, rB],
    ];
    let pick = options[0];
    let pickD = Infinity;
    for (const o of options) {
      const gap = dist[o[0][o[0].length - 1]][o[1][0]];
      if (gap < pickD - 1e-12) {
        pickD = gap;
        pick = o;
      }
    }
    merges.push({ a: pick[0], b: pick[1], height: bestD });
    const k = clusters.length;
    clusters[i].alive = false;
    clusters[j].alive = false;
    clusters.push({ leaves: [...pick[0], ...pick[1]], alive: true });
    const row: number[] = new Array(k + 1).fill(0);
    for (let m = 0; m < k; m++) {
      if (!clusters[m].alive) continue;
      row[m] = (A.length * d[i][m] + B.length * d[j][m]) / (A.length + B.length);
      d[m].push(row[m]);
    }
    for (let m = 0; m < k; m++) if (!clusters[m].alive) d[m].push(0);
    d.push(row);
  }
  const order = clusters[clusters.length - 1].leaves;
  if (order.length > 1 && order[0] > order[order.length - 1]) order.reverse();
  return { order, merges };
}

/** Indices of `rows` in seriated order (see the file comment). */
export function seriate(rows: readonly (readonly number[])[]): number[] {
  const profiles = rows.map(unitProfile);
  const dist = profiles.map((a) => profiles.map((b) => euclid(a, b)));
  return averageLinkage(dist).order;
}
