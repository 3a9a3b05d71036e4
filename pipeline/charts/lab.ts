/**
 * Colours in CIE L*a*b* (CIELAB, CIE 1976) and its polar form L*C*h, for
 * building ramps whose steps look evenly spaced in lightness.
 *
 * sRGB is converted as IEC 61966-2-1 defines it (the same linearisation as
 * WCAG's relative luminance), to CIE XYZ with the sRGB primaries and the D65
 * white point, then to L*a*b* with the CIE 1976 formulas relative to D65.
 */

import { parseHex } from './theme.ts';

export interface Lab {
  /** Lightness, 0 (black) to 100 (white). */
  l: number;
  a: number;
  b: number;
}

export interface Lch {
  l: number;
  /** Chroma: distance from the grey axis. */
  c: number;
  /** Hue angle in degrees, 0–360. */
  h: number;
}

/** D65 reference white, Y normalised to 1. */
const WHITE = { x: 0.95047, y: 1, z: 1.08883 };
const EPSILON = 216 / 24389;
const KAPPA = 24389 / 27;

function toLinear(channel: number): number {
  const c = channel / 255;
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

function fromLinear(v: number): number {
  const c = v <= 0.0031308 ? 12.92 * v : 1.055 * v ** (1 / 2.4) - 0.055;
  return c * 255;
}

function f(t: number): number {
  return t > EPSILON ? Math.cbrt(t) : (KAPPA * t + 16) / 116;
}

function fInverse(t: number): number {
  const t3 = t ** 3;
  return t3 > EPSILON ? t3 : (116 * t - 16) / KAPPA;
}

/** "#rrggbb" → L*a*b*. */
export function hexToLab(hex: string): Lab {
  const [r, g, b] = parseHex(hex).map(toLinear);
  const x = 0.4124564 * r + 0.3575761 * g + 0.1804375 * b;
  const y = 0.2126729 * r + 0.7151522 * g + 0.072175 * b;
  const z = 0.0193339 * r + 0.119192 * g + 0.9503041 * b;
  const fx = f(x / WHITE.x);
  const fy = f(y / WHITE.y);
  const fz = f(z / WHITE.z);
  return { l: 116 * fy - 16, a: 500 * (fx - fy), b: 200 * (fy - fz) };
}

/** L*a*b* → sRGB channels 0..255, unclamped (values outside 0..255 mean "out of gamut"). */
export function labToRgb(lab: Lab): [number, number, number] {
  const fy = (lab.l + 16) / 116;
  const fx = fy + lab.a / 500;
  const fz = fy - lab.b / 200;
  const x = WHITE.x * fInverse(fx);
  const y = WHITE.y * (lab.l > KAPPA * EPSILON ? fy ** 3 : lab.l / KAPPA);
  const z = WHITE.z * fInverse(fz);
  const r = 3.2404542 * x - 1.5371385 * y - 0.4985314 * z;
  const g = -0.969266 * x + 1.8760108 * y + 0.041556 * z;
  const b = 0.0556434 * x - 0.2040259 * y + 1.0572252 * z;
  return [fromLinear(r), fromLinear(g), fromLinear(b)];
}

/** Whether a L*a*b* colour can be shown in sRGB (with half a step of rounding to spare). */
export function inGamut(lab: Lab): boolean {
  return labToRgb(lab).every((c) => c >= -0.5 && c <= 255.5);
}

/** L*a*b* → "#RRGGBB", channels rounded and clamped. */
export function labToHex(lab: Lab): string {
  return `#${labToRgb(lab)
    .map((c) => Math.round(Math.min(255, Math.max(0, c))).toString(16).padStart(2, '0'))
    .join('')
    .toUpperCase()}`;
}

export function labToLch(lab: Lab): Lch {
  const h = (Math.atan2(lab.b, lab.a) * 180) / Math.PI;
  return { l: lab.l, c: Math.hypot(lab.a, lab.b), h: (h + 360) % 360 };
}

export function lchToLab(lch: Lch): Lab {
  const rad = (lch.h * Math.PI) / 180;
  return { l: lch.l, a: lch.c * Math.cos(rad), b: lch.c * Math.sin(rad) };
}
