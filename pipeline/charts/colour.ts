/**
 * Mixing colours for tints (row shading, highlights behind words), and the
 * strongest tint of a hue that text in a given ink still reads on.
 * Mixing is a straight interpolation of the sRGB channels: enough for light
 * tints, and deterministic to the byte.
 */

import { contrastRatio, parseHex } from './theme.ts';

function hex2(n: number): string {
  return Math.round(Math.min(255, Math.max(0, n)))
    .toString(16)
    .toUpperCase()
    .padStart(2, '0');
}

/** `from` moved towards `to` by `t` (0 gives `from`, 1 gives `to`), as "#RRGGBB". */
export function mixColour(from: string, to: string, t: number): string {
  const a = parseHex(from);
  const b = parseHex(to);
  const k = Math.min(1, Math.max(0, t));
  return `#${a.map((c, i) => hex2(c + (b[i] - c) * k)).join('')}`;
}

/**
 * The largest t in 0..1 for which `ink` on `mixColour(paper, hue, t)` keeps
 * at least `minRatio`. Found by bisection, then confirmed on the rounded
 * colour, so the promise holds for the colour actually written.
 */
export function strongestTint(paper: string, hue: string, ink: string, minRatio: number): number {
  if (contrastRatio(ink, mixColour(paper, hue, 1)) >= minRatio) return 1;
  if (contrastRatio(ink, paper) < minRatio) return 0;
  let lo = 0;
  let hi = 1;
  for (let i = 0; i < 30; i++) {
    const mid = (lo + hi) / 2;
    if (contrastRatio(ink, mixColour(paper, hue, mid)) >= minRatio) lo = mid;
    else hi = mid;
  }
  // Rounding to 8-bit channels could tip the last step under: back off until it holds.
  let t = Math.floor(lo * 1000) / 1000;
  while (t > 0 && contrastRatio(ink, mixColour(paper, hue, t)) < minRatio) t -= 0.001;
  return Math.max(0, t);
}
