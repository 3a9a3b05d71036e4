import { describe, expect, it } from 'vitest';
import { contrastRatio, defaultTheme, parseHex, relativeLuminance } from '../../pipeline/charts/theme.ts';

describe('contrastRatio (WCAG 2.2)', () => {
  it('matches known pairs', () => {
    // Source: WCAG 2.2, definition of "contrast ratio": (L1 + 0.05) / (L2 + 0.05), ranging from 1:1 to 21:1.
    expect(contrastRatio('#000000', '#FFFFFF')).toBeCloseTo(21, 10);
    expect(contrastRatio('#FFFFFF', '#FFFFFF')).toBe(1);
    // from memory, recomputed by hand with the WCAG luminance formula: #777 on white ≈ 4.48 (fails AA for text).
    expect(contrastRatio('#777777', '#FFFFFF')).toBeCloseTo(4.48, 2);
    // from memory: #767676 is the lightest grey that passes 4.5:1 on white (≈ 4.54).
    expect(contrastRatio('#767676', '#FFFFFF')).toBeCloseTo(4.54, 2);
    expect(contrastRatio('#767676', '#FFFFFF')).toBeGreaterThanOrEqual(4.5);
  });
  it('does not depend on the order of the colours', () => {
    expect(contrastRatio('#0072B2', '#FBF8F1')).toBe(contrastRatio('#FBF8F1', '#0072B2'));
  });
  it('uses the WCAG relative luminance', () => {
    // Source: WCAG 2.2, definition of "relative luminance" (sRGB, threshold 0.04045, exponent 2.4,
    // weights 0.2126 / 0.7152 / 0.0722). Mid grey #808080 → 0.2159 (from memory, recomputed).
    expect(relativeLuminance('#FFFFFF')).toBe(1);
    expect(relativeLuminance('#000')).toBe(0);
    expect(relativeLuminance('#808080')).toBeCloseTo(0.2159, 4);
    expect(relativeLuminance('#FF0000')).toBeCloseTo(0.2126, 10);
  });
  it('refuses colours it cannot read', () => {
    expect(() => parseHex('red')).toThrow(/hex colour/);
  });
});

/** Hue in degrees (HSV), to check that darkening kept a colour's identity. */
function hue(colour: string): number {
  const [r, g, b] = parseHex(colour).map((c) => c / 255);
  const max = Math.max(r, g, b);
  const d = max - Math.min(r, g, b);
  if (d === 0) return 0;
  const h = max === r ? ((g - b) / d) % 6 : max === g ? (b - r) / d + 2 : (r - g) / d + 4;
  return (h * 60 + 360) % 360;
}

describe('defaultTheme', () => {
  const t = defaultTheme;

  it('sets text in colours that reach 4.5:1 on paper', () => {
    // Source: WCAG 2.2, SC 1.4.3 Contrast (Minimum): 4.5:1 for text.
    for (const c of [t.ink, t.inkMuted]) expect(contrastRatio(c, t.paper)).toBeGreaterThanOrEqual(4.5);
    for (const s of t.series) expect(contrastRatio(s.text, t.paper), s.name).toBeGreaterThanOrEqual(4.5);
    // Note numbers are set in paper colour on an ink disc.
    expect(contrastRatio(t.paper, t.ink)).toBeGreaterThanOrEqual(4.5);
  });

  it('draws marks and axes that reach 3:1 on paper', () => {
    // Source: WCAG 2.2, SC 1.4.11 Non-text Contrast: 3:1 for graphical objects needed to understand content.
    for (const s of t.series) expect(contrastRatio(s.mark, t.paper), s.name).toBeGreaterThanOrEqual(3);
    expect(contrastRatio(t.axis, t.paper)).toBeGreaterThanOrEqual(3);
  });

  it('keeps the Okabe–Ito hues', () => {
    // Source: Okabe & Ito (2008), "Color Universal Design": the eight colours in RGB (from memory):
    // black 0,0,0; orange 230,159,0; sky blue 86,180,233; bluish green 0,158,115; yellow 240,228,66;
    // blue 0,114,178; vermillion 213,94,0; reddish purple 204,121,167.
    const published: Record<string, string> = {
      black: '#000000',
      orange: '#E69F00',
      'sky blue': '#56B4E9',
      'bluish green': '#009E73',
      yellow: '#F0E442',
      blue: '#0072B2',
      vermillion: '#D55E00',
      'reddish purple': '#CC79A7',
    };
    expect(t.series.map((s) => s.name).sort()).toEqual(Object.keys(published).sort());
    for (const s of t.series) {
      expect(s.source.toUpperCase(), s.name).toBe(published[s.name]);
      // Darkened variants keep their hue (within rounding of 8-bit channels).
      if (s.name !== 'black') {
        expect(Math.abs(hue(s.mark) - hue(s.source)), `${s.name} mark`).toBeLessThan(2);
        expect(Math.abs(hue(s.text) - hue(s.source)), `${s.name} text`).toBeLessThan(2);
      }
      // A hue that already reaches 3:1 is used as published.
      if (contrastRatio(s.source, t.paper) >= 3) expect(s.mark, s.name).toBe(s.source);
    }
  });

  it('keeps type legible on small screens', () => {
    // common practice, no source: nothing under ~9–10 CSS px on a phone. The narrow layout is drawn
    // at viewBox width 360 and shown down to 320 px; the wide one at 720 and shown from 540 px.
    const smallest = Math.min(...Object.values(t.sizes));
    expect(smallest).toBeGreaterThanOrEqual(13);
    expect((smallest * 320) / t.widths.narrow).toBeGreaterThanOrEqual(11);
    expect((smallest * 540) / t.widths.wide).toBeGreaterThanOrEqual(9.75);
  });

  it('is frozen', () => {
    expect(Object.isFrozen(t)).toBe(true);
    expect(Object.isFrozen(t.series)).toBe(true);
    expect(Object.isFrozen(t.series[0])).toBe(true);
    expect(Object.isFrozen(t.sizes)).toBe(true);
  });
});
