/**
 * Small, pure helpers for writing SVG as strings: escaping, attributes,
 * elements, coordinates, approximate text measurement and stable hashing.
 * Everything here is deterministic: the same input gives the same bytes.
 */

const XML_ESCAPES: Record<string, string> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&apos;',
};

/** Escapes the five XML special characters (& < > " '). Every string that comes from a text or a plan goes through here. */
export function escapeXml(s: string): string {
  return String(s).replace(/[&<>"']/g, (c) => XML_ESCAPES[c]);
}

/**
 * A coordinate or length as SVG text: rounded to at most 2 decimals, no
 * trailing zeros, no exponent, no "-0", independent of the locale.
 */
export function num(n: number): string {
  if (!Number.isFinite(n)) return '0';
  const r = Math.round(n * 100) / 100;
  if (Object.is(r, -0) || r === 0) return '0';
  return String(r);
}

export type AttrValue = string | number | boolean | null | undefined;
export type Attrs = Record<string, AttrValue>;

/**
 * Attributes as ` key="value"` pairs, in the order given. Numbers go through
 * `num`, strings through `escapeXml`; `true` writes the bare name as
 * `name="name"`; `false`, `null` and `undefined` are left out.
 */
export function attrs(a: Attrs): string {
  let out = '';
  for (const [key, value] of Object.entries(a)) {
    if (value === undefined || value === null || value === false) continue;
    const text = value === true ? key : typeof value === 'number' ? num(value) : escapeXml(value);
    out += ` ${key}="${text}"`;
  }
  return out;
}

/**
 * An element. `children` is markup that is already safe (built with these
 * helpers); pass text through `escapeXml` or use `textEl`. Without children
 * the element is self-closing.
 */
export function el(tag: string, a: Attrs = {}, children?: string | readonly string[]): string {
  const inner = Array.isArray(children) ? children.join('') : (children as string | undefined);
  if (inner === undefined || inner === '') return `<${tag}${attrs(a)}/>`;
  return `<${tag}${attrs(a)}>${inner}</${tag}>`;
}

/** A `<text>` element whose content is plain text (escaped here). */
export function textEl(text: string, a: Attrs = {}): string {
  return `<text${attrs(a)}>${escapeXml(text)}</text>`;
}

/** A `<title>` child: the tooltip and accessible name of its parent. */
export function titleEl(text: string): string {
  return `<title>${escapeXml(text)}</title>`;
}

/** A path's `d` from points: "M x,y L x,y …". */
export function polylinePath(points: readonly (readonly [number, number])[]): string {
  return points.map(([x, y], i) => `${i === 0 ? 'M' : 'L'}${num(x)},${num(y)}`).join('');
}

/* ---------- text measurement ---------- */

/** Which face a string is set in: widths differ a little. */
export type Face = 'sans' | 'serif';

const NARROW = new Set(Array.from("iljtfrI.,;:'!|()[]{} \u00B7\u2019\u2018`"));
const SEMI_NARROW = new Set(Array.from('1sczvxyk-"/\u2013'));
const WIDE = new Set(Array.from('mwMW@%\u2014\u2026&<>=+~^#*_\u2212'));

/**
 * Average advance widths (em) per class of glyph. Calibrated against the
 * widest common fallbacks (a DejaVu-like sans, a Georgia-like serif) so that
 * layout errs on the side of room rather than overlap.
 */
const WIDTHS: Record<Face, { narrow: number; semi: number; wide: number; digit: number; upper: number; lower: number }> = {
  sans: { narrow: 0.32, semi: 0.52, wide: 0.9, digit: 0.62, upper: 0.69, lower: 0.6 },
  serif: { narrow: 0.29, semi: 0.45, wide: 0.86, digit: 0.52, upper: 0.7, lower: 0.5 },
};

/**
 * Width of one character in em, approximated from classes of glyphs. Fine for
 * layout and truncation; not a substitute for real font metrics.
 */
export function charWidthEm(ch: string, face: Face = 'sans'): number {
  const cp = ch.codePointAt(0) ?? 0;
  // CJK ideographs, kana, Hangul and full-width forms take a full em.
  if (cp >= 0x1100 && (cp <= 0x115f || (cp >= 0x2e80 && cp <= 0xa4cf) || (cp >= 0xac00 && cp <= 0xd7a3) || (cp >= 0xf900 && cp <= 0xfaff) || (cp >= 0xff00 && cp <= 0xff60))) return 1;
  // Combining marks take no room.
  if (cp >= 0x0300 && cp <= 0x036f) return 0;
  const w = WIDTHS[face];
  if (NARROW.has(ch)) return w.narrow;
  if (SEMI_NARROW.has(ch)) return w.semi;
  if (WIDE.has(ch)) return w.wide;
  if (ch >= '0' && ch <= '9') return w.digit;
  if (ch !== ch.toLowerCase()) return w.upper;
  return w.lower;
}

/** Approximate advance width of `s` at `fontSize`, in the same units. */
export function textWidth(s: string, fontSize: number, face: Face = 'sans'): number {
  let em = 0;
  for (const ch of Array.from(s)) em += charWidthEm(ch, face);
  return em * fontSize;
}

/**
 * `s` cut to fit `maxWidth` (approximately), ending with an ellipsis when cut.
 * Whole code points are kept; trailing spaces before the ellipsis are removed.
 */
export function truncateText(s: string, maxWidth: number, fontSize: number, face: Face = 'sans'): string {
  if (textWidth(s, fontSize, face) <= maxWidth) return s;
  const chars = Array.from(s);
  const ellipsis = textWidth('\u2026', fontSize, face);
  let width = 0;
  let keep = 0;
  for (const ch of chars) {
    const w = charWidthEm(ch, face) * fontSize;
    if (width + w + ellipsis > maxWidth) break;
    width += w;
    keep++;
  }
  return `${chars.slice(0, keep).join('').trimEnd()}\u2026`;
}

/* ---------- stable ids ---------- */

/** FNV-1a 32-bit hash of the UTF-16 code units of `s`, as base-36 text. */
export function hashString(s: string): string {
  let h = 0x811c9dc5;
  for (let i = 0; i < s.length; i++) {
    h ^= s.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h.toString(36);
}

/**
 * `s` broken at spaces into at most `maxLines` lines that fit `maxWidth`.
 * `complete` is false when something had to be cut (the last line then ends
 * with an ellipsis), so callers can choose another layout instead.
 */
export function wrapText(s: string, maxWidth: number, fontSize: number, maxLines: number, face: Face = 'sans'): { lines: string[]; complete: boolean } {
  const words = s.split(/\s+/).filter(Boolean);
  const lines: string[] = [];
  let cur = '';
  let i = 0;
  for (; i < words.length; i++) {
    const next = cur ? `${cur} ${words[i]}` : words[i];
    if (textWidth(next, fontSize, face) <= maxWidth) {
      cur = next;
      continue;
    }
    if (!cur) break; // a single word too wide for a line
    lines.push(cur);
    cur = '';
    i--;
    if (lines.length === maxLines) break;
  }
  if (lines.length < maxLines && cur) {
    lines.push(cur);
    cur = '';
  }
  const rest = words.slice(i).join(' ');
  const complete = i >= words.length && cur === '';
  if (complete) return { lines, complete };
  const lastIndex = Math.min(lines.length, maxLines - 1);
  const tail = [lines[lastIndex] ?? '', rest].filter(Boolean).join(' ');
  lines.length = lastIndex;
  lines.push(truncateText(tail, maxWidth, fontSize, face));
  return { lines, complete: false };
}
