/**
 * Equal-interval classes for a colour scale: round class limits ("nice"
 * steps of 1, 2 or 5 × 10ⁿ, from d3-array's tickStep) that cover the data in
 * at most a given number of classes.
 */

import { tickStep } from 'd3-array';

export interface Classes {
  /** Class limits, ascending: class i holds [limits[i], limits[i + 1]), the last one closed. */
  limits: number[];
  /** The class of a value (clamped into range). */
  classOf: (v: number) => number;
}

/**
 * Classes over `values` (finite ones only; empty → one class [0, 1]). The
 * lower end is 0 when no value is negative. With `integer`, limits are whole
 * numbers (steps of at least 1).
 */
export function equalClasses(values: readonly number[], maxClasses: number, integer: boolean): Classes {
  const finite = values.filter(Number.isFinite);
  let lo = finite.length ? Math.min(...finite) : 0;
  const hi = finite.length ? Math.max(...finite) : 1;
  if (lo > 0) lo = 0;
  if (hi === lo) {
    const limits = [lo, integer ? lo + 1 : lo + (lo === 0 ? 1 : Math.abs(lo))];
    return { limits, classOf: () => 0 };
  }
  for (let want = maxClasses; want >= 1; want--) {
    let step = tickStep(lo, hi, want);
    if (integer) step = Math.max(1, Math.round(step));
    const start = Math.floor(lo / step + 1e-9) * step;
    const k = Math.max(1, Math.ceil((hi - start) / step - 1e-9));
    if (k > maxClasses) continue;
    const limits = Array.from({ length: k + 1 }, (_, i) => clean(start + i * step));
    return {
      limits,
      classOf: (v: number) => Math.min(k - 1, Math.max(0, Math.floor((v - start) / step + 1e-9))),
    };
  }
  // Unreachable for maxClasses ≥ 1 (one class always covers the data); kept for the type checker.
  return { limits: [lo, hi], classOf: () => 0 };
}

/** Removes float noise from a limit (0.30000000000000004 → 0.3). */
function clean(v: number): number {
  return Number(v.toPrecision(12));
}
