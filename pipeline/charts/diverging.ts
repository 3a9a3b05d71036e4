/**
 * The colour scale of a text map: tints laid behind words, light near the
 * neutral value and stronger towards the ends of the domain.
 *
 * A domain that runs across 0 (valence, say −5..5) gets a diverging scale:
 * Okabe–Ito blue for positive values, vermillion for negative ones, two hues
 * that stay apart for the common forms of colour-vision deficiency (Okabe &
 * Ito 2008). Any other domain gets a sequential scale in one of the two hues,
 * light at the end nearest 0.
 *
 * Words stay in the ink colour; a tint never goes so far that ink on it drops
 * under `minContrast` (4.6:1, a little above WCAG 2.2's 4.5:1 for text so
 * rounding cannot tip it under). Values the span carries but that sit at the
 * neutral point get a faint grey, so "scored, neutral" differs from "not scored".
 */

import type { Theme } from './theme.ts';
import { mixColour, strongestTint } from './colour.ts';

/** Okabe–Ito blue and vermillion, as published (Okabe & Ito 2008). */
const POSITIVE = '#0072B2';
const NEGATIVE = '#D55E00';

/** Contrast kept between the ink and the strongest tint. */
export const minContrast = 4.6;

/** The faintest tint a non-neutral value gets (share of the strongest), so small values still show. */
const FLOOR = 0.14;

export interface ValueScale {
  /** True when the domain runs across 0 and both hues are used. */
  diverging: boolean;
  /** The domain, ordered low to high. */
  domain: [number, number];
  /** Strength of `v`, 0 (neutral) to 1 (an end of the domain), values outside the domain clamped. */
  strength(v: number): number;
  /** The tint behind a word carrying `v`. */
  fill(v: number): string;
  /** The neutral point of the scale: 0 when the domain holds it, else the end nearest 0. */
  neutral: number;
}

export function valueScale(domain: readonly [number, number], theme: Theme): ValueScale {
  const lo = Math.min(domain[0], domain[1]);
  const hi = Math.max(domain[0], domain[1]);
  const diverging = lo < 0 && hi > 0;
  const neutral = diverging ? 0 : hi <= 0 ? hi : lo;
  const posMax = strongestTint(theme.paper, POSITIVE, theme.ink, minContrast);
  const negMax = strongestTint(theme.paper, NEGATIVE, theme.ink, minContrast);
  // One ceiling for both hues, so equal strengths look about equally strong.
  const ceiling = Math.min(posMax, negMax);
  const neutralFill = mixColour(theme.paper, theme.rule, 0.6);

  const strength = (v: number): number => {
    if (!Number.isFinite(v)) return 0;
    const c = Math.min(hi, Math.max(lo, v));
    if (diverging) return c >= 0 ? c / hi : c / lo;
    const far = hi <= 0 ? lo : hi;
    return far === neutral ? 1 : Math.abs(c - neutral) / Math.abs(far - neutral);
  };
  const hueOf = (v: number): string => (diverging ? (v >= 0 ? POSITIVE : NEGATIVE) : hi <= 0 ? NEGATIVE : POSITIVE);
  const fill = (v: number): string => {
    const s = strength(v);
    if (s === 0) return neutralFill;
    return mixColour(theme.paper, hueOf(v), (FLOOR + (1 - FLOOR) * s) * ceiling);
  };
  return { diverging, domain: [lo, hi], strength, fill, neutral };
}
