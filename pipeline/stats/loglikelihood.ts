/**
 * Log-likelihood G² of a word's frequency in two corpora, in the two-cell
 * form (Rayson & Garside 2000): only the word's own counts are compared with
 * their expected values; the "all other words" cells of Dunning's (1993)
 * four-cell contingency table are left out.
 *
 *   E₁ = c(a + b) / (c + d)      E₂ = d(a + b) / (c + d)
 *   G² = 2 [a ln(a / E₁) + b ln(b / E₂)]      (0 · ln 0 taken as 0)
 *
 * a, b: the word's frequency in corpus 1 and 2; c, d: the corpus sizes in tokens.
 */
export function logLikelihood(a: number, sizeA: number, b: number, sizeB: number): number {
  const total = sizeA + sizeB;
  if (!(total > 0) || a + b === 0) return 0;
  const e1 = (sizeA * (a + b)) / total;
  const e2 = (sizeB * (a + b)) / total;
  const g2 = 2 * (term(a, e1) + term(b, e2));
  // Rounding may leave a tiny negative value when the two rates are equal.
  return g2 > 0 ? g2 : 0;
}

function term(observed: number, expected: number): number {
  return observed > 0 ? observed * Math.log(observed / expected) : 0;
}
