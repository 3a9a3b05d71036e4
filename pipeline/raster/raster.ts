/**
 * SVG → PNG with the project's own typefaces, for the social cards, the
 * charts' PNG downloads and anything else that needs a picture of a chart.
 *
 * sharp draws SVG with librsvg, which finds fonts through fontconfig. The
 * fontconfig file `projectFonts` writes lists only the project's faces
 * (./fonts.ts), and FONTCONFIG_FILE is pointed at it before the first
 * drawing. fontconfig reads that variable once per process, when text is
 * first drawn: so the first call checks that the faces are really the ones
 * in use (a serif word and a sans word must draw differently; were the file
 * ignored both would fall back to one machine font) and throws a clear error
 * otherwise, rather than publish pictures set in whatever the machine has.
 */
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import sharp from 'sharp';
import { fontFiles, fontFolder } from './fonts.ts';
import { FAMILIES } from './families.ts';

let configured: string | null = null;
let checked: Promise<void> | null = null;

/**
 * Registers the project's faces for every later rasterising in this process.
 * `parent` holds the font folder (kept between builds); default the system's
 * temporary folder. Returns the fontconfig file.
 */
export function projectFonts(parent: string = join(tmpdir(), 'vitrine')): string {
  if (configured) return configured;
  const conf = fontFolder(parent, fontFiles());
  process.env.FONTCONFIG_FILE = conf;
  configured = conf;
  return conf;
}

/** Throws unless text is drawn in the project's faces (see the file comment). */
function checkFaces(): Promise<void> {
  checked ??= (async () => {
    const word = (family: string) =>
      sharp(
        Buffer.from(
          `<svg xmlns="http://www.w3.org/2000/svg" width="160" height="40"><text x="4" y="30" font-size="28" style="font-family:'${family}'">Hamburg</text></svg>`,
        ),
      )
        .raw()
        .toBuffer();
    const [serif, sans] = await Promise.all([word(FAMILIES.serif.name), word(FAMILIES.sans.name)]);
    if (serif.equals(sans)) {
      checked = null;
      throw new Error(
        `the charts cannot be drawn in ${FAMILIES.serif.name} and ${FAMILIES.sans.name}: the font configuration ${configured} was not used ` +
          '(fontconfig was started before it was set, or reads a FONTCONFIG_FILE of its own); run the build in a process of its own',
      );
    }
  })();
  return checked;
}

export interface RasterOptions {
  /** Pixels per SVG user unit: 2 draws a 720-unit chart 1440 px wide. Default 1. */
  scale?: number;
  /** Resize the drawing to exactly this size in pixels (after `scale`); aspect kept when only one is given. */
  width?: number;
  height?: number;
}

/** Draws an SVG document as a PNG in the project's faces. */
export async function rasterise(svg: string, opts: RasterOptions = {}): Promise<Buffer> {
  projectFonts();
  await checkFaces();
  // librsvg takes 72 dpi as one pixel per user unit.
  let img = sharp(Buffer.from(svg), { density: 72 * (opts.scale ?? 1) });
  if (opts.width || opts.height) img = img.resize(opts.width, opts.height, { fit: 'fill' });
  return encodePng(img);
}

/** A sharp image as PNG bytes: the same input gives the same bytes (sharp writes no time or text chunks). */
export function encodePng(img: import("sharp").Sharp): Promise<Buffer> {
  return img.png({ compressionLevel: 6 }).toBuffer();
}

/** Width and height of a PNG, from its IHDR chunk (PNG spec, ISO/IEC 15948, §11.2.2); null if it is not a PNG. */
export function pngSize(png: Uint8Array): { width: number; height: number } | null {
  const b = Buffer.from(png.buffer, png.byteOffset, png.byteLength);
  const signature = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
  if (b.length < 24 || signature.some((v, i) => b[i] !== v) || b.toString('latin1', 12, 16) !== 'IHDR') return null;
  return { width: b.readUInt32BE(16), height: b.readUInt32BE(20) };
}
