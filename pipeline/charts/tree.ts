/**
 * A word tree: a phrase and the words that follow it (or precede it),
 * branching wherever the text goes different ways. Each word's type size and
 * the stroke of the branch leading to it grow with how often that
 * continuation occurs; branches are sorted, most frequent first.
 *
 * Layout. The tidy tree of d3-hierarchy (Reingold–Tilford, as improved by
 * Walker and Buchheim et al.) sets the words of a level apart across the
 * branches, each gap sized to the two words' type. Along the branches each
 * level is a column that starts a short connector after the widest word of
 * the level before, so words of different levels never overlap. For
 * direction "left" the whole tree is mirrored, the phrase at the right and
 * the words before it reading towards it.
 *
 * Legibility. Beyond `depth` and `minCount`, each word keeps at most
 * `breadth` continuations and the drawing at most `limit` words, chosen
 * most frequent first. When the tree is still too wide, type shrinks (never
 * under 13 units), then the deepest level is left out, then words are cut
 * short. A word whose continuations are not all drawn (or that the text
 * continues beyond `depth`) ends in "…"; the table lists every branch
 * within `depth` and `minCount`.
 */

import { z } from 'zod';
import { hierarchy, tree as tidyTree } from 'd3-hierarchy';
import type { HierarchyPointNode } from 'd3-hierarchy';
import type { NoteAt, Table, TreeData, TreeNode } from './types.ts';
import { serifStyle } from './theme.ts';
import type { Theme } from './theme.ts';
import type { Miss } from './chart.ts';
import { defineChart, idOption } from './chart.ts';
import { el, num, textEl, textWidth, titleEl, truncateText, wrapText } from './svg.ts';
import { formatNumber, formatPercent, joinWords, sentence } from './format.ts';

export const treeOptions = z.strictObject({
  depth: z
    .number()
    .int()
    .min(1)
    .max(12)
    .default(4)
    .describe('Most words drawn after (or before) the phrase along any branch. Default: 4.'),
  minCount: z
    .number()
    .int()
    .min(1)
    .default(1)
    .describe('Branches that occur fewer times than this are left out of the drawing and the table. Default: 1 (keep all).'),
  breadth: z
    .number()
    .int()
    .min(1)
    .max(20)
    .default(5)
    .describe('Most continuations drawn for any one word, the most frequent first. Default: 5.'),
  limit: z
    .number()
    .int()
    .min(1)
    .max(200)
    .default(40)
    .describe('Most words drawn in all (the phrase not counted), the most frequent branches first, so long trees stay legible. Default: 40.'),
  id: idOption,
});

export type TreeOptions = z.output<typeof treeOptions>;

/** A branch kept after pruning by depth and minCount. */
interface Branch {
  word: string;
  count: number;
  depth: number;
  /** Words from the phrase down to this one, the phrase first. */
  path: string[];
  children: Branch[];
  /** The text goes on beyond `depth` here. */
  cut: boolean;
}

const byCodePoint = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);

/** Children sorted by count (then word), pruned by depth and minCount. */
function prune(node: TreeNode, opts: TreeOptions, depth = 0, path: string[] = []): Branch {
  const here = [...path, node.word];
  const kids =
    depth >= opts.depth
      ? []
      : (node.children ?? [])
          .filter((c) => Number.isFinite(c.count) && c.count >= opts.minCount)
          .sort((a, b) => b.count - a.count || byCodePoint(a.word, b.word))
          .map((c) => prune(c, opts, depth + 1, here));
  const cut = depth >= opts.depth && (node.children ?? []).some((c) => Number.isFinite(c.count) && c.count >= opts.minCount);
  return { word: node.word, count: Number.isFinite(node.count) ? node.count : 0, depth, path: here, children: kids, cut };
}

/** The branches drawn: at most `breadth` children each, at most `limit` words, most frequent first. */
function select(root: Branch, opts: TreeOptions): Set<Branch> {
  const chosen = new Set<Branch>([root]);
  let order = 0;
  const seq = new Map<Branch, number>();
  const queue: Branch[] = [];
  const offer = (b: Branch) => {
    for (const c of b.children.slice(0, opts.breadth)) {
      seq.set(c, order++);
      queue.push(c);
    }
  };
  offer(root);
  while (queue.length && chosen.size - 1 < opts.limit) {
    queue.sort((a, b) => b.count - a.count || a.depth - b.depth || seq.get(a)! - seq.get(b)!);
    const next = queue.shift()!;
    chosen.add(next);
    offer(next);
  }
  return chosen;
}

function allBranches(root: Branch): Branch[] {
  const out: Branch[] = [];
  const walk = (b: Branch) => {
    out.push(b);
    b.children.forEach(walk);
  };
  walk(root);
  return out;
}

/** A phrase in reading order: for "left", the words before come first. */
function phrase(b: Branch, direction: TreeData['direction']): string {
  return direction === 'right' ? b.path.join(' ') : [...b.path].reverse().join(' ');
}

const quote = (s: string) => `\u201C${s}\u201D`;

function times(n: number): string {
  return n === 1 ? 'once' : n === 2 ? 'twice' : `${formatNumber(n, 0)} times`;
}

/** Whether the tree holds `word` (lower case) anywhere. */
function holds(n: TreeNode, word: string): boolean {
  return n.word.toLowerCase() === word || (n.children ?? []).some((c) => holds(c, word));
}

/* ---------- table and alt text ---------- */

function treeTable(data: TreeData, root: Branch): Table {
  const rows = allBranches(root)
    .filter((b) => b.depth > 0)
    .map((b) => {
      const parent = allBranches(root).find((p) => p.children.includes(b))!;
      return [phrase(b, data.direction), b.depth, b.count, parent.count > 0 ? Math.round((b.count / parent.count) * 1000) / 10 : null];
    });
  return {
    columns: [
      { key: 'phrase', label: 'Phrase', numeric: false },
      { key: 'depth', label: data.direction === 'right' ? 'Words after the phrase' : 'Words before the phrase', numeric: true },
      { key: 'count', label: 'Occurrences', numeric: true },
      { key: 'share', label: 'Share of the shorter phrase (%)', numeric: true },
    ],
    rows,
  };
}

function treeAlt(data: TreeData, root: Branch, drawnWords: number, totalWords: number): string {
  const verb = data.direction === 'right' ? 'followed' : 'preceded';
  const kids = root.children;
  const max = kids[0].count;
  const top = kids.filter((k) => k.count === max);
  const share = root.count > 0 ? ` (${formatPercent(max / root.count)})` : '';
  const names = joinWords(top.length > 3 ? [...top.slice(0, 3).map((k) => quote(k.word)), `${top.length - 3} more`] : top.map((k) => quote(k.word)));
  let main = `${quote(root.word)} occurs ${times(root.count)}; it is most often ${verb} by ${names}, ${times(max)}${top.length > 1 ? ' each' : ''}${share}`;
  const next = kids.find((k) => k.count < max);
  if (next) main += `, then by ${quote(next.word)}, ${times(next.count)}`;
  const parts = [sentence(main)];
  // The longest frequent branch: the deepest word reached by following the most frequent continuation.
  let b = root;
  while (b.children.length) b = b.children[0];
  if (b.depth >= 2) parts.push(sentence(`The most frequent branch reads ${quote(phrase(b, data.direction))} (${times(b.count)})`));
  if (drawnWords < totalWords) parts.push(`The tree shows ${drawnWords} of ${totalWords} words; the table lists all.`);
  return parts.join(' ');
}

/* ---------- drawing ---------- */

const PAD = 12;
/** Largest type, for the phrase, per layout. */
const TYPE_MAX = { wide: 28, narrow: 22 };
/** Room between a word and the next, where the connector runs. */
const GAP = { wide: 28, narrow: 18 };

interface Laid {
  branch: Branch;
  size: number;
  text: string;
  /** The word is followed by "…": some continuations are not drawn. */
  more: boolean;
  width: number;
  left: number;
  /** Centre of the line, across the branches. */
  y: number;
}

interface Ctx {
  data: TreeData;
  root: Branch;
  chosen: Set<Branch>;
  theme: Theme;
  width: number;
  narrow: boolean;
}

/** Type size of a word: 13 units up to `max`, by the square root of its share of the phrase's count. */
function sizeFor(count: number, rootCount: number, max: number, min: number): number {
  const share = rootCount > 0 ? Math.min(1, Math.max(0, count / rootCount)) : 0;
  return Math.round((min + (max - min) * Math.sqrt(share)) * 10) / 10;
}

interface Attempt {
  laid: Laid[];
  right: number;
  top: number;
  bottom: number;
}

/** Lays out the chosen branches down to `maxDepth`, with type up to `typeMax` and words cut to `wordMax`. */
function attempt(ctx: Ctx, typeMax: number, maxDepth: number, wordMax: number, gap: number): Attempt {
  const { root, chosen, theme } = ctx;
  const min = theme.sizes.small;
  const small = theme.sizes.small;
  const visible = (b: Branch) => chosen.has(b) && b.depth <= maxDepth;
  const h = hierarchy<Branch>(root, (b) => b.children.filter(visible));
  const sizeOf = (b: Branch) => (b.depth === 0 ? typeMax : sizeFor(b.count, root.count, Math.max(min, typeMax * 0.8), min));
  const lineOf = (b: Branch) => sizeOf(b) * 1.4;
  const layout = tidyTree<Branch>()
    .nodeSize([1, 1])
    .separation((a, b) => (lineOf(a.data) + lineOf(b.data)) / 2 + (a.parent === b.parent ? 0 : 6));
  const pts = layout(h);
  const out: Laid[] = [];
  pts.each((p: HierarchyPointNode<Branch>) => {
    const b = p.data;
    const size = sizeOf(b);
    const text = truncateText(b.word, b.depth === 0 ? Math.max(wordMax, ctx.width * 0.4) : wordMax, size);
    const more = b.cut || b.children.some((c) => !visible(c));
    const width = textWidth(text, size) + (more ? 3 + textWidth('\u2026', small) : 0);
    out.push({ branch: b, size, text, more, width, left: 0, y: p.x });
  });
  // Columns: every word of a level starts where the widest word of the level before ends, plus the gap.
  const levels = Math.max(...out.map((l) => l.branch.depth));
  let left = PAD;
  for (let d = 0; d <= levels; d++) {
    const level = out.filter((l) => l.branch.depth === d);
    for (const l of level) l.left = left;
    left += Math.max(...level.map((l) => l.width)) + gap;
  }
  return {
    laid: out,
    right: Math.max(...out.map((l) => l.left + l.width)),
    top: Math.min(...out.map((l) => l.y - lineOf(l.branch) / 2)),
    bottom: Math.max(...out.map((l) => l.y + lineOf(l.branch) / 2)),
  };
}

/** The first layout that fits the width: smaller type, then fewer levels, then shorter words. */
function fitLayout(ctx: Ctx): Attempt {
  const limit = ctx.width - PAD;
  const typeMax = ctx.narrow ? TYPE_MAX.narrow : TYPE_MAX.wide;
  const gap = ctx.narrow ? GAP.narrow : GAP.wide;
  const wordMax = ctx.width * 0.3;
  const deepest = Math.max(...[...ctx.chosen].map((b) => b.depth));
  for (let t = typeMax; t >= 13; t -= 3) {
    const a = attempt(ctx, t, deepest, wordMax, gap);
    if (a.right <= limit) return a;
  }
  for (let d = deepest - 1; d >= 1; d--) {
    const a = attempt(ctx, 16, d, wordMax, gap);
    if (a.right <= limit) return a;
  }
  // One level and still too wide: cut words to share the width left after the phrase.
  const one = attempt(ctx, 16, 1, wordMax, gap);
  const phraseEnd = one.laid[0].left + one.laid[0].width + gap;
  return attempt(ctx, 16, 1, Math.max(40, limit - phraseEnd - 14), gap);
}

function drawTree(ctx: Ctx): { body: string; height: number; words: number } {
  const { data, root, theme, width: W, narrow } = ctx;
  const small = theme.sizes.small;
  const fit = fitLayout(ctx);
  const offsetY = PAD + 4 - fit.top;
  const mirror = data.direction === 'left';
  const X = (x: number) => (mirror ? W - x : x);
  const byBranch = new Map(fit.laid.map((l) => [l.branch, l]));
  const maxStroke = narrow ? 5 : 7;
  const strokeOf = (count: number) => 1 + (maxStroke - 1) * (root.count > 0 ? Math.min(1, count / root.count) : 0);

  // Connectors: from the end of a word to the start of each continuation, a smooth S.
  const links: string[] = [];
  for (const l of fit.laid) {
    if (l.branch.depth === 0) continue;
    const parentBranch = fit.laid.find((p) => p.branch.children.includes(l.branch))!;
    const from = { x: parentBranch.left + parentBranch.width + 3, y: parentBranch.y + offsetY };
    const to = { x: l.left - 3, y: l.y + offsetY };
    const mid = (from.x + to.x) / 2;
    links.push(
      el('path', {
        d: `M${num(X(from.x))},${num(from.y)}C${num(X(mid))},${num(from.y)} ${num(X(mid))},${num(to.y)} ${num(X(to.x))},${num(to.y)}`,
        'stroke-width': strokeOf(l.branch.count),
      }),
    );
  }
  const words = fit.laid.map((l) => {
    const cy = l.y + offsetY;
    const base = cy + l.size * 0.35;
    const titleText = `${phrase(l.branch, data.direction)}: ${times(l.branch.count)}`;
    const parts: string[] = [titleEl(titleText)];
    const wordW = textWidth(l.text, l.size);
    const ellW = l.more ? 3 + textWidth('\u2026', small) : 0;
    if (!mirror) {
      parts.push(textEl(l.text, { x: l.left, y: base, 'font-size': l.size }));
      if (l.more) parts.push(textEl('\u2026', { x: l.left + wordW + 3, y: base, 'font-size': small, fill: theme.inkMuted }));
    } else {
      // Mirrored: the word ends where its box ends nearest the phrase; "…" sits before it.
      parts.push(textEl(l.text, { x: X(l.left), y: base, 'font-size': l.size, 'text-anchor': 'end' }));
      if (l.more) parts.push(textEl('\u2026', { x: X(l.left + wordW + ellW), y: base, 'font-size': small, fill: theme.inkMuted }));
    }
    return el('g', { class: l.branch.depth === 0 ? 'vt-tree-root' : 'vt-tree-word', 'data-depth': l.branch.depth }, parts);
  });
  const body = [
    el('g', { class: 'vt-tree-links', fill: 'none', stroke: theme.axis, 'stroke-linecap': 'round' }, links),
    el('g', { class: 'vt-tree-words' }, words),
  ];
  let y = fit.bottom + offsetY + 10;

  const caption = wrapText('Type size and branch width show how often each continuation occurs.', W - 2 * PAD, theme.sizes.axisTitle, 2, 'serif');
  caption.lines.forEach((line, i) => {
    body.push(
      textEl(line, {
        x: mirror ? W - PAD : PAD,
        y: y + theme.sizes.axisTitle + i * (theme.sizes.axisTitle + 4),
        'text-anchor': mirror ? 'end' : undefined,
        'font-size': theme.sizes.axisTitle,
        style: serifStyle(theme, true),
        fill: theme.inkMuted,
        class: 'vt-axis-title',
      }),
    );
  });
  y += caption.lines.length * (theme.sizes.axisTitle + 4) + PAD;
  return { body: body.join(''), height: Math.ceil(y), words: fit.laid.length - 1 };
}

export const tree = defineChart({
  name: 'tree',
  options: treeOptions,
  prepare: (data: TreeData, opts) => {
    const root = prune(data.root ?? { word: '', count: 0, children: [] }, opts);
    return { root, chosen: select(root, opts), total: allBranches(root).length - 1 };
  },
  empty: ({ data, opts, prep: { root } }) => {
    if (root.children.length > 0) return null;
    return (data.root?.children ?? []).length > 0
      ? `no continuation of ${quote(root.word)} occurs at least ${opts.minCount} times.`
      : `nothing ${data.direction === 'right' ? 'follows' : 'precedes'} ${quote(root.word)} in the text.`;
  },
  table: ({ data, prep }) => treeTable(data, prep.root),
  // The tree has no marks for notes: a note goes beside it, unless it names a word the tree does not hold, or a character or segment.
  place: (at: NoteAt, { data }): Miss => {
    if ('word' in at) return holds(data.root, at.word.toLowerCase()) ? 'beside' : 'absent';
    return 'character' in at || 'segment' in at ? 'absent' : 'beside';
  },
  alt: ({ data, prep }) => treeAlt(data, prep.root, prep.chosen.size - 1, prep.total),
  draw: ({ data, prep, theme }, _notes, { width, narrow }) => drawTree({ data, root: prep.root, chosen: prep.chosen, theme, width, narrow }),
});
