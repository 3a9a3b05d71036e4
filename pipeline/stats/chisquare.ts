/**
 * Critical values of the χ² distribution with one degree of freedom, as used
 * to read a log-likelihood G² (which follows χ²(1) asymptotically), with the
 * significance band a value falls in.
 */

/** The levels a G² is read against, strictest first, with their χ²(1) critical values. */
export const CHI2_1DF_CRITICAL: readonly { p: SignificanceLevel; critical: number }[] = Object.freeze([
  { p: 0.0001, critical: 15.13 },
  { p: 0.001, critical: 10.83 },
  { p: 0.01, critical: 6.63 },
  { p: 0.05, critical: 3.84 },
]);

export type SignificanceLevel = 0.0001 | 0.001 | 0.01 | 0.05;

/** The band a statistic falls in: the strictest level whose critical value it reaches. */
export type SignificanceBand = 'p < 0.0001' | 'p < 0.001' | 'p < 0.01' | 'p < 0.05' | 'n.s.';

/** The χ²(1) critical value of a significance level; 0 for a level of 1 (no threshold). */
export function criticalValue(p: SignificanceLevel | 1): number {
  if (p === 1) return 0;
  const row = CHI2_1DF_CRITICAL.find((r) => r.p === p);
  if (!row) throw new RangeError(`no χ²(1) critical value is tabled for p = ${p}: use 0.05, 0.01, 0.001 or 0.0001`);
  return row.critical;
}

/** The significance band of a χ²(1)-distributed statistic such as G². */
export function significanceBand(statistic: number): SignificanceBand {
  for (const row of CHI2_1DF_CRITICAL) if (statistic >= row.critical) return `p < ${row.p}` as SignificanceBand;
  return 'n.s.';
}
