/**
 * Light-to-dark ramps and pale tints of one hue, and the text colour that
 * reads on any of their steps.
 *
 * A ramp keeps the hue angle of a palette colour (in CIE L*C*h) and steps its
 * lightness L* evenly, so each step looks about as different from the next
 * as any other; lightness alone carries the order, which stays readable for
 * the common colour-vision deficiencies and in greyscale. Chroma is the
 * source colour's own, lowered where sRGB cannot show it at that lightness.
 *
 * Text on a step is set in the theme's ink or paper, whichever contrasts
 * more. Between L* ≈ 48 and ≈ 58 neither reaches 4.5:1 (WCAG 2.2 SC 1.4.3),
 * so the default lightness steps jump over that band: 93, 82, 71, 60 | 46,
 * 35, 24 (steps of 11, and 14 across the band).
 */

import type { Theme } from './theme.ts';
import { contrastRatio } from './theme.ts';
import { hexToLab, inGamut, labToHex, labToLch, lchToLab } from './lab.ts';

/** L* of the seven steps of a sequential ramp, light to dark (see the file comment). */
export const RAMP_LIGHTNESS: readonly number[] = Object.freeze([93, 82, 71, 60, 46, 35, 24]);

/** The largest chroma not above `max` that sRGB can show at lightness `l` and hue `h` (bisection). */
function gamutChroma(l: number, h: number, max: number): number {
  if (inGamut(lchToLab({ l, c: max, h }))) return max;
  let lo = 0;
  let hi = max;
  for (let i = 0; i < 30; i++) {
    const mid = (lo + hi) / 2;
    if (inGamut(lchToLab({ l, c: mid, h }))) lo = mid;
    else hi = mid;
  }
  return lo;
}

/**
 * `source`'s hue at lightness `l` (0–100), as "#RRGGBB"; chroma at most
 * `maxChroma` (a pale tint wants little), and never beyond the source's own.
 */
export function atLightness(source: string, l: number, maxChroma = Infinity): string {
  const { c, h } = labToLch(hexToLab(source));
  return labToHex(lchToLab({ l, c: gamutChroma(l, h, Math.min(c, maxChroma)), h }));
}

/** One colour per lightness, all in `source`'s hue. */
export function lightnessRamp(source: string, lightnesses: readonly number[] = RAMP_LIGHTNESS): string[] {
  return lightnesses.map((l) => atLightness(source, l));
}

/**
 * `k` colours (1 to the ramp's length) picked evenly from `ramp`, light to
 * dark; a single colour is the middle step.
 */
export function pickSteps(ramp: readonly string[], k: number): string[] {
  const n = ramp.length;
  if (k <= 1) return [ramp[Math.floor((n - 1) / 2)]];
  const m = Math.min(k, n);
  return Array.from({ length: m }, (_, i) => ramp[Math.round((i * (n - 1)) / (m - 1))]);
}

/** The theme's ink or paper, whichever contrasts more with `fill`. */
export function textOn(fill: string, theme: Theme): string {
  return contrastRatio(theme.ink, fill) >= contrastRatio(theme.paper, fill) ? theme.ink : theme.paper;
}
