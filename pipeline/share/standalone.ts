/**
 * A panel's chart as a file of its own, and as a snippet of HTML for other
 * sites: the chart SVG the site shows inline, made to stand alone.
 *
 * On the site, charts name their typefaces through the page's CSS variables
 * (`var(--vt-serif, …)`, pipeline/charts/theme.ts). Outside it there is no
 * such variable, and SVG renderers that read no CSS variables (librsvg among
 * them) drop the whole declaration. So a standalone chart names the faces
 * themselves, with fallbacks and a generic family (`'Source Serif 4',
 * Georgia, 'Times New Roman', serif`), and carries its own size, an XML
 * declaration, and a credit line below the chart: the exhibit, the
 * organiser and the panel's address. The chart's <title> and <desc>, its
 * role and labels stay as they are.
 */
import { defaultTheme } from '../charts/theme.ts';
import type { Theme } from '../charts/theme.ts';
import { el, escapeXml, num, textEl, textWidth, truncateText } from '../charts/svg.ts';
import { FAMILIES } from '../raster/families.ts';
import { absoluteUrl, pagePath } from './addresses.ts';
import type { PreparedExhibit } from '../stages/prepared.ts';

export interface Credit {
  exhibit: string;
  organiser: string;
  /** The panel's absolute address, or null when the plan gives no public address. */
  url: string | null;
}

/** A panel's credit: the exhibit, its organiser and the panel's address (when the exhibit has a public address). */
export function panelCredit(prepared: Pick<PreparedExhibit, 'exhibit'>, room: string, panel: string): Credit {
  const e = prepared.exhibit;
  return { exhibit: e.title, organiser: e.organiser, url: e.url ? absoluteUrl(e.url, pagePath(room, panel)) : null };
}

/** The chart with its typefaces named instead of taken from the page's CSS variables. */
export function withNamedFonts(svg: string, theme: Theme = defaultTheme): string {
  return svg
    .replaceAll(escapeXml(theme.fonts.serif), escapeXml(FAMILIES.serif.stack))
    .replaceAll(escapeXml(theme.fonts.sans), escapeXml(FAMILIES.sans.stack));
}

/** The root element's viewBox size; throws if `svg` does not start with an `<svg>` root that has one. */
export function viewBoxSize(svg: string): { width: number; height: number } {
  const root = /^<svg\b[^>]*>/.exec(svg);
  const box = root && /\sviewBox="\s*0[\s,]+0[\s,]+([\d.]+)[\s,]+([\d.]+)\s*"/.exec(root[0]);
  if (!box) throw new Error('the chart is not an SVG with a viewBox starting at 0 0');
  return { width: Number(box[1]), height: Number(box[2]) };
}

const CREDIT = { size: 13, line: 18, pad: 12, rule: 1 };

/** Height of the credit band below a chart, in SVG units. */
function creditHeight(credit: Credit): number {
  return CREDIT.pad * 2 + CREDIT.line * (credit.url ? 2 : 1);
}

/**
 * The chart as a standalone SVG document: XML declaration, the SVG namespace,
 * width and height, named typefaces, and the credit band below the chart.
 * `language` (ISO 639-1) is set as `xml:lang` so a reader's screen reader
 * speaks the title and description in it.
 */
export function standaloneSvg(svg: string, credit: Credit, language = 'en', theme: Theme = defaultTheme): string {
  return `<?xml version="1.0" encoding="UTF-8"?>\n${creditedSvg(svg, credit, language, theme, false)}\n`;
}

/** The chart with its credit band, as an `<svg>` element; an embed also shrinks to fit a narrower column. */
function creditedSvg(svg: string, credit: Credit, language: string, theme: Theme, embed: boolean): string {
  const { width, height } = viewBoxSize(svg);
  const band = creditHeight(credit);
  const total = height + band;
  const named = withNamedFonts(svg, theme);
  const open = /^<svg\b[^>]*>/.exec(named)![0];
  const rest = named.slice(open.length);
  const kept = open
    .replace(/^<svg/, '')
    .replace(/>$/, '')
    .replace(/\s(?:viewBox|width|height|xml:lang|xmlns)="[^"]*"/g, '');
  const size = ` width="${num(width)}" height="${num(total)}"${embed ? ' style="max-width:100%;height:auto"' : ''}`;
  const root = `<svg xmlns="http://www.w3.org/2000/svg"${size} viewBox="0 0 ${num(width)} ${num(total)}" xml:lang="${escapeXml(language)}"${kept}>`;
  const close = rest.lastIndexOf('</svg>');
  if (close < 0) throw new Error('the chart SVG has no closing </svg>');
  return root + rest.slice(0, close) + creditBand(credit, width, height, band, theme) + '</svg>';
}

/** The credit below the chart: exhibit and organiser, then the panel's address (never cut: set smaller if it is long). */
function creditBand(credit: Credit, width: number, top: number, height: number, theme: Theme): string {
  const inner = width - CREDIT.pad * 2;
  const first = truncateText(`${credit.exhibit} · ${credit.organiser}`, inner, CREDIT.size);
  const parts = [
    el('rect', { x: 0, y: top, width, height, fill: theme.paper }),
    el('line', { x1: CREDIT.pad, x2: width - CREDIT.pad, y1: top + CREDIT.rule / 2, y2: top + CREDIT.rule / 2, stroke: theme.rule, 'stroke-width': CREDIT.rule }),
    textEl(first, { x: CREDIT.pad, y: top + CREDIT.pad + CREDIT.size, 'font-size': CREDIT.size, fill: theme.inkMuted }),
  ];
  if (credit.url) {
    const fit = Math.min(CREDIT.size, (inner / textWidth(credit.url, CREDIT.size)) * CREDIT.size);
    parts.push(
      textEl(credit.url, {
        x: CREDIT.pad,
        y: top + CREDIT.pad + CREDIT.size + CREDIT.line,
        'font-size': Math.max(8, Math.floor(fit * 10) / 10),
        fill: theme.inkMuted,
      }),
    );
  }
  return el(
    'g',
    { class: 'vt-credit', style: `font-family:${FAMILIES.sans.stack}` },
    parts,
  );
}

export interface EmbedArgs {
  svg: string;
  title: string;
  credit: Credit;
  language?: string;
}

/**
 * Static HTML that shows the chart on another site: a figure with the chart
 * (credit inside), the panel's title and the credit as its caption, and a
 * link back to the panel when the exhibit has a public address. No script, no
 * styles beyond the SVG's own, no file it needs to fetch.
 */
export function embedSnippet(a: EmbedArgs): string {
  const svg = creditedSvg(a.svg, a.credit, a.language ?? 'en', defaultTheme, true);
  const title = escapeXml(a.title);
  const named = a.credit.url ? `<a href="${escapeXml(a.credit.url)}">${title}</a>` : title;
  const from = `${escapeXml(a.credit.exhibit)}, ${escapeXml(a.credit.organiser)}`;
  return `<figure>\n${svg}\n<figcaption>${named} — from ${from}.</figcaption>\n</figure>\n`;
}
