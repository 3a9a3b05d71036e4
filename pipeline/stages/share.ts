/**
 * The build's share stage: the pictures a site offers for sharing, written
 * into the built site after Astro has written the pages.
 *
 *   - a social card (1200×630 PNG) for the home page, each room and each
 *     panel (layouts in pipeline/cards/), at the paths of
 *     pipeline/share/addresses.ts, which the pages' link-preview tags name;
 *   - each panel's chart as a PNG at 2× (the standalone SVG with its credit
 *     line, pipeline/share/standalone.ts, rasterised in the project's faces).
 *
 * Every picture is cached on disk under `<cache>/pictures/`, keyed by a hash
 * of exactly what is drawn: the card's strings and chart SVGs (or the
 * standalone chart), the bytes of the font files, the card layout's version
 * and the picture's size. A caption edit changes none of these and redraws
 * nothing; a changed chart redraws the pictures that show it: its panel's
 * card and chart PNG, and the room and home cards when it is the first chart
 * of its room. A cached picture costs a hash, a check of its PNG header, and
 * a copy.
 */
import { createHash } from 'node:crypto';
import { closeSync, copyFileSync, mkdirSync, openSync, readSync, renameSync, writeFileSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import type { PreparedExhibit } from './prepared.ts';
import { stableJson } from '../cache/cache.ts';
import { CARD_SIZE, cardPath, CHART_PNG_SCALE, chartPngPath } from '../share/addresses.ts';
import { panelCredit, standaloneSvg, viewBoxSize } from '../share/standalone.ts';
import { LAYOUT_VERSION } from '../cards/layout.ts';
import type { CardContent, ChartPicture } from '../cards/layout.ts';
import { drawCard } from '../cards/draw.ts';
import { fontFiles, hashFonts } from '../raster/fonts.ts';
import { pngSize, projectFonts, rasterise } from '../raster/raster.ts';

/** One picture the site offers: where it goes, what it shows, how to draw it. */
export interface Picture {
  kind: 'card' | 'chart';
  /** Path in the site, relative to its root. */
  path: string;
  /** Pixel size the file must have. */
  width: number;
  height: number;
  /** Exactly what is drawn (hashed for the cache key). */
  content: unknown;
  draw: () => Promise<Buffer>;
}

export interface ShareStats {
  /** Social cards drawn afresh, and taken from the cache. */
  cards: { drawn: number; cached: number };
  /** Chart PNGs drawn afresh, and taken from the cache. */
  charts: { drawn: number; cached: number };
  /** Paths (relative to the site's root) of the pictures drawn afresh. */
  redrawn: string[];
  /** Seconds spent drawing (summed over pictures drawn side by side), and in all. */
  drawSeconds: number;
  seconds: number;
}

/** The stats as one line for the build's log. */
export function shareSummary(s: ShareStats): string {
  const n = (k: number, what: string) => `${k} ${what}${k === 1 ? '' : 's'}`;
  return `Pictures: ${n(s.cards.drawn, 'social card')} and ${n(s.charts.drawn, 'chart PNG')} drawn, ${s.cards.cached + s.charts.cached} from the cache (${s.seconds.toFixed(2)} s)`;
}

/** What each card draws, for the home page, each room and each panel. */
export function cardContents(prepared: PreparedExhibit): { path: string; content: CardContent }[] {
  const e = prepared.exhibit;
  const picture = (p: { svg: string; svgNarrow: string | null }): ChartPicture => ({ svg: p.svg, narrow: p.svgNarrow });
  const rooms = prepared.rooms;
  const out: { path: string; content: CardContent }[] = [
    {
      path: cardPath(),
      content: {
        kind: 'home',
        exhibit: e.title,
        subtitle: e.subtitle,
        organiser: e.organiser,
        rooms: rooms.length,
        panels: rooms.reduce((s, r) => s + r.panels.length, 0),
        charts: rooms.filter((r) => r.panels.length).slice(0, 4).map((r) => picture(r.panels[0]!)),
      },
    },
  ];
  rooms.forEach((room, i) => {
    out.push({
      path: cardPath(room.id),
      content: {
        kind: 'room',
        exhibit: e.title,
        organiser: e.organiser,
        number: i + 1,
        rooms: rooms.length,
        title: room.title,
        panels: room.panels.map((p) => p.title),
        chart: room.panels[0] ? picture(room.panels[0]) : null,
      },
    });
    for (const panel of room.panels) {
      out.push({
        path: cardPath(room.id, panel.id),
        content: { kind: 'panel', exhibit: e.title, organiser: e.organiser, room: { number: i + 1, title: room.title }, title: panel.title, chart: picture(panel) },
      });
    }
  });
  return out;
}

/** Every picture of the site: the cards, then each panel's chart PNG. */
export function sharePictures(prepared: PreparedExhibit): Picture[] {
  const cards: Picture[] = cardContents(prepared).map(({ path, content }) => ({
    kind: 'card' as const,
    path,
    ...CARD_SIZE,
    content: { card: content, layout: LAYOUT_VERSION },
    draw: () => drawCard(content),
  }));
  const charts: Picture[] = prepared.rooms.flatMap((room) =>
    room.panels.map((panel) => {
      const svg = standaloneSvg(panel.svg, panelCredit(prepared, room.id, panel.id), prepared.exhibit.language);
      const size = viewBoxSize(svg.slice(svg.indexOf('<svg')));
      const width = Math.round(size.width * CHART_PNG_SCALE);
      const height = Math.round(size.height * CHART_PNG_SCALE);
      return {
        kind: 'chart' as const,
        path: chartPngPath(room.id, panel.id),
        width,
        height,
        content: { chart: svg, scale: CHART_PNG_SCALE },
        draw: () => rasterise(svg, { scale: CHART_PNG_SCALE, width, height }),
      };
    }),
  );
  return [...cards, ...charts];
}

/**
 * Writes every share picture into the built site `outDir`, drawing only those
 * the cache (`cacheDir`/pictures, or none when `cacheDir` is null) lacks.
 * Pictures are drawn a few at a time: sharp rasterises on its own threads
 * while satori lays out the next card.
 */
export async function writeSharePictures(prepared: PreparedExhibit, outDir: string, cacheDir: string | null): Promise<ShareStats> {
  const started = performance.now();
  const store = cacheDir ? join(cacheDir, 'pictures') : null;
  const fonts = hashFonts(fontFiles());
  const stats: ShareStats = { cards: { drawn: 0, cached: 0 }, charts: { drawn: 0, cached: 0 }, redrawn: [], drawSeconds: 0, seconds: 0 };
  const todo: { pic: Picture; dest: string; cached: string | null }[] = [];
  for (const pic of sharePictures(prepared)) {
    const dest = join(outDir, pic.path);
    mkdirSync(dirname(dest), { recursive: true });
    const key = createHash('sha256').update(stableJson({ content: pic.content, fonts, width: pic.width, height: pic.height })).digest('hex');
    const cached = store ? join(store, `${key}.png`) : null;
    if (cached && sizeOnDisk(cached, pic)) {
      copyFileSync(cached, dest);
      stats[`${pic.kind}s`].cached++;
    } else {
      todo.push({ pic, dest, cached });
    }
  }
  if (todo.length) projectFonts(cacheDir ?? join(tmpdir(), 'vitrine'));
  if (store && todo.length) mkdirSync(store, { recursive: true });
  const draw = async ({ pic, dest, cached }: (typeof todo)[number]) => {
    const t = performance.now();
    const png = await pic.draw();
    const size = pngSize(png);
    if (!size || size.width !== pic.width || size.height !== pic.height) {
      throw new Error(`${pic.path} came out ${size ? `${size.width}×${size.height}` : 'not a PNG'}, not ${pic.width}×${pic.height}`);
    }
    stats.drawSeconds += (performance.now() - t) / 1000;
    stats[`${pic.kind}s`].drawn++;
    stats.redrawn.push(pic.path);
    writeFileSync(dest, png);
    if (cached) {
      // Write then rename, so a crash never leaves a half-written picture in the cache.
      const tmp = `${cached}.${process.pid}.tmp`;
      writeFileSync(tmp, png);
      renameSync(tmp, cached);
    }
  };
  const lanes = Math.max(1, Math.min(4, availableParallelism()));
  let next = 0;
  await Promise.all(
    Array.from({ length: lanes }, async () => {
      while (next < todo.length) await draw(todo[next++]!);
    }),
  );
  stats.redrawn.sort();
  stats.seconds = (performance.now() - started) / 1000;
  return stats;
}

/** Whether `file` is a PNG of the picture's size (a damaged or foreign cache entry is redrawn). */
function sizeOnDisk(file: string, pic: Picture): boolean {
  let fd: number;
  try {
    fd = openSync(file, 'r');
  } catch {
    return false;
  }
  try {
    const head = Buffer.alloc(24);
    readSync(fd, head, 0, 24, 0);
    const size = pngSize(head);
    return !!size && size.width === pic.width && size.height === pic.height;
  } finally {
    closeSync(fd);
  }
}
