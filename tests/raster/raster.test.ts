// Rasterising in the project's faces: text drawn by librsvg (in sharp) must be set in the font
// files themselves. Checked against fontkit (a general-purpose font engine from npm) laying out
// the same word from the same WOFF file: the ink of the drawn word is as wide as fontkit's
// bounding box for it. A fallback face (what the machine has) would differ by far more.
// PNG header layout: PNG specification (ISO/IEC 15948:2004), §5.2 signature and §11.2.2 IHDR.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import sharp from 'sharp';
import * as fontkit from 'fontkit';
import { pngSize, projectFonts, rasterise } from '../../pipeline/raster/raster.ts';
import { fontFiles, folderFaces } from '../../pipeline/raster/fonts.ts';
import { FACES } from '../../pipeline/raster/fonts.ts';

const WORD = 'Hamburgefonstiv';
const SIZE = 48;

const word = (family: string, extra = '') =>
  `<svg xmlns="http://www.w3.org/2000/svg" width="520" height="80"><rect width="520" height="80" fill="#fff"/>` +
  `<text x="10" y="58" font-size="${SIZE}" style="font-family:${family}${extra}">${WORD}</text></svg>`;

/** Width of the ink (non-white pixels) of a PNG, by sharp's trim. */
async function inkWidth(png: Buffer): Promise<number> {
  const { info } = await sharp(png).trim({ background: '#ffffff', threshold: 40 }).toBuffer({ resolveWithObject: true });
  return info.width;
}

/** fontkit's width of the word's ink, at SIZE px, from the WOFF file of a face. */
function fontkitWidth(stem: string): number {
  const file = fontFiles().find((f) => f.path.endsWith(`${stem}-latin-400-normal.woff`))!;
  const font = fontkit.create(readFileSync(file.path)) as fontkit.Font;
  const run = font.layout(WORD);
  let x = 0;
  let minX = Infinity;
  let maxX = -Infinity;
  run.glyphs.forEach((g, i) => {
    const b = g.bbox;
    if (b.maxX > b.minX) {
      minX = Math.min(minX, x + b.minX);
      maxX = Math.max(maxX, x + b.maxX);
    }
    x += run.positions[i]!.xAdvance;
  });
  return ((maxX - minX) * SIZE) / font.unitsPerEm;
}

describe('rasterise', () => {
  it('registers every face the site loads, in every subset, and only those', () => {
    const conf = projectFonts();
    expect(folderFaces(conf).length).toBe(fontFiles(FACES).length);
    expect(readFileSync(conf, 'utf8')).not.toMatch(/<include|\/usr\/share\/fonts/);
  });

  it.each([
    ["'Source Serif 4'", 'source-serif-4'],
    ["'Source Sans 3'", 'source-sans-3'],
  ])('draws %s with the font file itself', async (family, stem) => {
    const drawn = await inkWidth(await rasterise(word(family)));
    expect(Math.abs(drawn - fontkitWidth(stem))).toBeLessThanOrEqual(3);
  });

  it('falls back to the project faces, not the machine’s, for the stacks’ other names and the generic families', async () => {
    const serif = await rasterise(word("'Source Serif 4'"));
    expect((await rasterise(word('Georgia, serif'))).equals(serif)).toBe(true);
    expect((await rasterise(word('serif'))).equals(serif)).toBe(true);
    const sans = await rasterise(word("'Source Sans 3'"));
    expect((await rasterise(word('Arial, sans-serif'))).equals(sans)).toBe(true);
    expect(sans.equals(serif)).toBe(false);
  });

  it('draws at a scale, and to an exact size', async () => {
    const svg = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 360 120"><rect width="360" height="120" fill="#0072B2"/></svg>';
    expect(pngSize(await rasterise(svg, { scale: 2 }))).toEqual({ width: 720, height: 240 });
    expect(pngSize(await rasterise(svg, { width: 300, height: 100 }))).toEqual({ width: 300, height: 100 });
  });

  it('reads a PNG’s size from its IHDR chunk, as sharp reports it', async () => {
    const png = await sharp({ create: { width: 7, height: 3, channels: 3, background: '#fff' } }).png().toBuffer();
    expect(pngSize(png)).toEqual({ width: 7, height: 3 });
    expect(pngSize(Buffer.from('GIF89a and more bytes than that'))).toBeNull();
  });

  it('gives the same bytes for the same drawing', async () => {
    expect((await rasterise(word("'Source Serif 4'", ';font-style:italic'))).equals(await rasterise(word("'Source Serif 4'", ';font-style:italic')))).toBe(true);
  });
});
