/** Counting links between numbered members: an unordered pair → weight tally. */

/** Weights of unordered pairs of member indices (0-based, below `size`). */
export interface PairTally {
  add(a: number, b: number, by?: number): void;
  /** Every pair with a positive weight, `a < b`, ordered by a then b. */
  pairs(): { a: number; b: number; weight: number }[];
}

export function pairTally(size: number): PairTally {
  const weights = new Map<number, number>();
  return {
    add(a, b, by = 1) {
      if (a === b) return;
      const key = a < b ? a * size + b : b * size + a;
      weights.set(key, (weights.get(key) ?? 0) + by);
    },
    pairs() {
      return [...weights.entries()]
        .filter(([, w]) => w > 0)
        .sort((x, y) => x[0] - y[0])
        .map(([key, weight]) => ({ a: Math.floor(key / size), b: key % size, weight }));
    },
  };
}
