/**
 * A small seeded pseudo-random number generator, so that methods which draw
 * random numbers (the Louvain method visits nodes in a random order) give the
 * same answer on every build.
 *
 * Mulberry32 (Tommy Ettinger, 2017, public domain): a 32-bit state advanced by
 * the odd constant 0x6D2B79F5 and mixed by two multiply–xorshift rounds.
 */

/** A generator of numbers in [0, 1), fully determined by the 32-bit `seed`. */
export function seededRandom(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let z = state;
    z = Math.imul(z ^ (z >>> 15), z | 1);
    z ^= z + Math.imul(z ^ (z >>> 7), z | 61);
    return ((z ^ (z >>> 14)) >>> 0) / 4294967296;
  };
}
