/**
 * The project's typefaces, as files: Source Serif 4 and Source Sans 3 from
 * the @fontsource packages in the lockfile (SIL Open Font Licence), the same
 * faces the site self-hosts (site/layouts/Page.astro imports their CSS).
 * Nothing is fetched: every file comes from node_modules.
 *
 * Two consumers:
 * - satori, which lays out the social cards and turns their text into paths,
 *   reads WOFF (not WOFF2) files directly (`satoriFonts`);
 * - the rasteriser (librsvg inside sharp) finds fonts through fontconfig and
 *   FreeType, which here open neither WOFF nor WOFF2, so `fontFolder` writes
 *   the faces unwrapped (./woff.ts) into a folder with a fontconfig file that
 *   lists only them; ./raster.ts points FONTCONFIG_FILE at it.
 */
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { woffToSfnt } from './woff.ts';
import { FAMILIES } from './families.ts';
import type { Face, Family } from './families.ts';

/** The faces the site loads (the same list as the CSS imports in site/layouts/Page.astro). */
export const FACES: readonly Face[] = [
  { family: 'serif', weight: 400, style: 'normal' },
  { family: 'serif', weight: 400, style: 'italic' },
  { family: 'serif', weight: 600, style: 'normal' },
  { family: 'sans', weight: 400, style: 'normal' },
  { family: 'sans', weight: 600, style: 'normal' },
];

/** Subsets satori gets for card text: Latin and its extension cover the scripts of the plan's languages today. */
const CARD_SUBSETS = ['latin', 'latin-ext'];

const require = createRequire(import.meta.url);

function filesDir(family: Family): string {
  return join(dirname(require.resolve(`${FAMILIES[family].pkg}/package.json`)), 'files');
}

/** The package's subsets (latin, latin-ext, greek, …), from its unicode.json. */
function subsets(family: Family): string[] {
  const unicode = JSON.parse(readFileSync(join(dirname(filesDir(family)), 'unicode.json'), 'utf8')) as Record<string, string>;
  return Object.keys(unicode).sort();
}

export interface FontFile {
  face: Face;
  subset: string;
  /** Absolute path of the WOFF file. */
  path: string;
}

/** Every WOFF file of `faces`, one per subset the package has. */
export function fontFiles(faces: readonly Face[] = FACES, only?: readonly string[]): FontFile[] {
  const out: FontFile[] = [];
  for (const face of faces) {
    const dir = filesDir(face.family);
    for (const subset of only ?? subsets(face.family)) {
      const path = join(dir, `${FAMILIES[face.family].stem}-${subset}-${face.weight}-${face.style}.woff`);
      if (!existsSync(path)) throw new Error(`the font file ${path} is missing: run "npm ci" to reinstall ${FAMILIES[face.family].pkg}`);
      out.push({ face, subset, path });
    }
  }
  return out;
}

/** A short hash of the bytes of some font files: part of every card's cache key. */
export function hashFonts(files: readonly FontFile[]): string {
  const h = createHash('sha256');
  for (const f of files) h.update(f.path.slice(f.path.lastIndexOf('/') + 1)).update(readFileSync(f.path));
  return h.digest('hex').slice(0, 16);
}

export interface SatoriFont {
  name: string;
  data: Buffer;
  weight: 400 | 600;
  style: 'normal' | 'italic';
}

/** The card faces as satori takes them (WOFF data). */
export function satoriFonts(faces: readonly Face[] = FACES): SatoriFont[] {
  return fontFiles(faces, CARD_SUBSETS).map((f) => ({
    name: FAMILIES[f.face.family].name,
    data: readFileSync(f.path),
    weight: f.face.weight,
    style: f.face.style,
  }));
}

/**
 * A folder holding the faces as TrueType/OpenType files and a fontconfig file
 * that registers them and nothing else, so charts rasterise alike on every
 * machine. The folder is named by the fonts' hash, written once, and reused;
 * it is built beside and renamed into place, so a crash leaves no half folder.
 * Returns the fontconfig file's path.
 */
export function fontFolder(parent: string, files: readonly FontFile[] = fontFiles()): string {
  const dir = join(parent, `fonts-${hashFonts(files)}`);
  const conf = join(dir, 'fonts.conf');
  if (existsSync(conf)) return conf;
  mkdirSync(parent, { recursive: true });
  const tmp = `${dir}.${process.pid}.tmp`;
  rmSync(tmp, { recursive: true, force: true });
  mkdirSync(tmp);
  for (const f of files) {
    const name = f.path.slice(f.path.lastIndexOf('/') + 1).replace(/\.woff$/, '.otf');
    writeFileSync(join(tmp, name), woffToSfnt(readFileSync(f.path), f.path));
  }
  writeFileSync(join(tmp, 'fonts.conf'), fontconfigFile(dir));
  try {
    renameSync(tmp, dir);
  } catch (e) {
    // Another build got there first: its folder is the same.
    rmSync(tmp, { recursive: true, force: true });
    if (!existsSync(conf)) throw e;
  }
  return conf;
}

/** The fonts in a font folder (for tests and messages). */
export function folderFaces(conf: string): string[] {
  return readdirSync(dirname(conf)).filter((f) => f.endsWith('.otf')).sort();
}

function fontconfigFile(dir: string): string {
  const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;');
  // Generic names and the fallbacks of the stacks resolve to the project's faces, so text
  // never falls through to whatever the machine has installed.
  const aliases = Object.values(FAMILIES)
    .flatMap((f) =>
      [f.generic, ...f.stack.split(',').map((s) => s.trim().replace(/^'|'$/g, '')).filter((n) => n !== f.name && n !== f.generic)].map(
        (alias) => `  <alias binding="same"><family>${esc(alias)}</family><prefer><family>${esc(f.name)}</family></prefer></alias>`,
      ),
    )
    .join('\n');
  return `<?xml version="1.0"?>
<!DOCTYPE fontconfig SYSTEM "urn:fontconfig:fonts.dtd">
<!-- Written by Vitrine: the project's own faces and nothing else. -->
<fontconfig>
  <dir>${esc(dir)}</dir>
  <cachedir>${esc(join(dir, 'cache'))}</cachedir>
${aliases}
  <alias binding="same"><family>system-ui</family><prefer><family>${FAMILIES.sans.name}</family></prefer></alias>
</fontconfig>
`;
}
