/**
 * Where the share files of a site live, and their absolute addresses.
 *
 * Paths are relative to the site's root (its base path): the social card of
 * the home page is `card.png`, of a room `<room>/card.png`, of a panel
 * `<room>/<panel>/card.png`; a panel's chart downloads sit beside its page as
 * `chart.svg` and `chart.png`. Plan ids are lower-case letters, digits and
 * hyphens (pipeline/plan/schema.ts), so no room or panel folder can take
 * one of these file names.
 *
 * Absolute addresses are made from the plan's `exhibit.url`, the public
 * address of the home page, so they hold wherever the build itself was
 * served from (a preview under another base path gives the same addresses).
 */

/** Size of a social card in pixels: the 1.91:1 picture link previews show large (common practice, no source). */
export const CARD_SIZE = { width: 1200, height: 630 } as const;

/** Pixels per SVG unit of the PNG download of a chart. */
export const CHART_PNG_SCALE = 2;

export function cardPath(room?: string, panel?: string): string {
  return `${folder(room, panel)}card.png`;
}

export function chartSvgPath(room: string, panel: string): string {
  return `${folder(room, panel)}chart.svg`;
}

export function chartPngPath(room: string, panel: string): string {
  return `${folder(room, panel)}chart.png`;
}

/** The page of the home (no room), a room, or a panel, relative to the site's root. */
export function pagePath(room?: string, panel?: string): string {
  return folder(room, panel);
}

function folder(room?: string, panel?: string): string {
  if (panel !== undefined && room === undefined) throw new Error('a panel path needs its room');
  return room === undefined ? '' : panel === undefined ? `${room}/` : `${room}/${panel}/`;
}

/** `path` (relative to the site's root) as an absolute address under the site's public address `site` (which ends in "/"). */
export function absoluteUrl(site: string, path: string): string {
  return new URL(path.replace(/^\/+/, ''), site).href;
}

/** A page's path relative to the site's root, from its path on the server under base path `base`. */
export function sitePath(pathname: string, base: string): string {
  const b = base.endsWith('/') ? base : `${base}/`;
  return pathname.startsWith(b) ? pathname.slice(b.length) : pathname.replace(/^\/+/, '');
}
