/**
 * Point symbols of equal area: circle, square, diamond, triangle up,
 * triangle down. A second cue beside colour, so groups stay apart for
 * readers who cannot tell the hues apart (and in greyscale).
 */

import { num } from './svg.ts';

export const SHAPES = ['circle', 'square', 'diamond', 'triangle-up', 'triangle-down'] as const;
export type Shape = (typeof SHAPES)[number];

/** The shape for group `i` (cycling through the five). */
export function shapeFor(i: number): Shape {
  return SHAPES[((i % SHAPES.length) + SHAPES.length) % SHAPES.length];
}

/** Side of a square with the area of a circle of radius r: r√π. */
const SQUARE = Math.sqrt(Math.PI);
/** Side of an equilateral triangle with the area of a circle of radius r: r·√(4π/√3). */
const TRIANGLE = Math.sqrt((4 * Math.PI) / Math.sqrt(3));

/** Distance from the centre to the farthest point of the shape, for a shape of the area of a circle of radius r. */
export function reach(shape: Shape, r: number): number {
  switch (shape) {
    case 'circle':
      return r;
    case 'square':
    case 'diamond':
      return (r * SQUARE) / Math.SQRT2;
    default:
      return (r * TRIANGLE) / Math.sqrt(3);
  }
}

/** An SVG element name and geometry attributes for `shape` centred on (x, y), area π r². */
export function symbol(shape: Shape, x: number, y: number, r: number): { tag: string; attrs: Record<string, number | string> } {
  if (shape === 'circle') return { tag: 'circle', attrs: { cx: x, cy: y, r } };
  if (shape === 'square') {
    const s = r * SQUARE;
    return { tag: 'rect', attrs: { x: x - s / 2, y: y - s / 2, width: s, height: s } };
  }
  if (shape === 'diamond') {
    const h = (r * SQUARE) / Math.SQRT2;
    return { tag: 'path', attrs: { d: `M${num(x)},${num(y - h)}L${num(x + h)},${num(y)}L${num(x)},${num(y + h)}L${num(x - h)},${num(y)}Z` } };
  }
  // Equilateral triangle: centroid at (x, y), circumradius R, apex up or down.
  const a = r * TRIANGLE;
  const R = a / Math.sqrt(3);
  const s = shape === 'triangle-up' ? 1 : -1;
  const apex = y - s * R;
  const base = y + (s * R) / 2;
  return { tag: 'path', attrs: { d: `M${num(x)},${num(apex)}L${num(x + a / 2)},${num(base)}L${num(x - a / 2)},${num(base)}Z` } };
}
