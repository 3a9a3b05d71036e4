/**
 * A treemap: each item a rectangle whose area is proportional to its value,
 * items of a group packed together under the group's name.
 *
 * Layout. d3-hierarchy's squarified treemap (Bruls, Huizing & van Wijk
 * 2000), items sorted by value (largest first, ties by label), which makes
 * the layout deterministic. Groups are packed first, each then holds its
 * items under a header band with its name and total; the bands and the gaps
 * take a little area, so areas compare exactly only within a group.
 *
 * Colour and labels. Groups take pale tints of the theme's series hues
 * (L* 82 for the group's band, 94 for its items, chroma kept low; see
 * ramp.ts), outlined in the series colour, and carry their names, so colour
 * is never the only cue.
 * An item is labelled — its name on up to two lines and its value — only
 * when all of that fits inside its rectangle; smaller items keep a tooltip
 * and are listed in the table. Beyond `limit` items, the smallest of each
 * group are drawn together as one "… more" rectangle.
 */

import { z } from 'zod';
import { hierarchy, treemap as layoutTreemap, treemapSquarify } from 'd3-hierarchy';
import type { HierarchyRectangularNode } from 'd3-hierarchy';
import type { NoteAt, Table, TreemapData } from './types.ts';
import { seriesColour, serifStyle } from './theme.ts';
import type { Theme } from './theme.ts';
import type { Miss, Placed } from './chart.ts';
import { defineChart, findNamed, isDataAt, idOption } from './chart.ts';
import { el, textEl, textWidth, titleEl, truncateText, wrapText } from './svg.ts';
import { decimalsFor, formatNumber, formatPercent, joinWords, sentence } from './format.ts';
import { atLightness } from './ramp.ts';
import { markerHeight, markerWidth, noteInline, notesBelow, notesInLane } from './furniture.ts';
import type { NoteAnchor } from './furniture.ts';

export const treemapOptions = z.strictObject({
  values: z
    .boolean()
    .default(true)
    .describe("Write each labelled item's value and share of the total under its name. Default: true."),
  limit: z
    .number()
    .int()
    .min(1)
    .max(500)
    .default(60)
    .describe('Most items drawn one by one, the largest first; the rest of each group share one rectangle ("12 more"). The table lists every item. Default: 60.'),
  id: idOption,
});

export type TreemapOptions = z.output<typeof treemapOptions>;

/** Lightness L* and most chroma C* of a group's band and of its items' rectangles (see ramp.ts). */
const GROUP_TINT = { l: 82, c: 32 };
const ITEM_TINT = { l: 94, c: 12 };

interface Item {
  id: string;
  label: string;
  value: number;
  group: string | null;
}

/** A rectangle drawn: one item, or several small ones together. */
interface Cell {
  key: string;
  label: string;
  value: number;
  group: string | null;
  /** The items it stands for (one, unless merged). */
  members: Item[];
}

interface Prepared {
  /** Items with a positive, finite value, largest first. */
  items: Item[];
  total: number;
  grouped: boolean;
  /** Group names, largest total first. */
  groups: { name: string; total: number }[];
  cells: Cell[];
  fmt: (v: number) => string;
}

const byCodePoint = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);

function prepare(data: TreemapData, opts: TreemapOptions): Prepared {
  const items: Item[] = data.items
    .filter((i) => Number.isFinite(i.value) && i.value > 0)
    .map((i) => ({ id: i.id, label: i.label, value: i.value, group: i.group ?? null }))
    .sort((a, b) => b.value - a.value || byCodePoint(a.label, b.label) || byCodePoint(a.id, b.id));
  const grouped = data.items.some((i) => i.group !== undefined);
  const totals = new Map<string, number>();
  for (const i of items) {
    const g = i.group ?? '';
    totals.set(g, (totals.get(g) ?? 0) + i.value);
  }
  const groups = [...totals.entries()].map(([name, total]) => ({ name, total })).sort((a, b) => b.total - a.total || byCodePoint(a.name, b.name));
  const kept = new Set(items.slice(0, opts.limit));
  const cells: Cell[] = items.filter((i) => kept.has(i)).map((i) => ({ key: `item:${i.id}`, label: i.label, value: i.value, group: i.group, members: [i] }));
  for (const g of groups) {
    const rest = items.filter((i) => !kept.has(i) && (i.group ?? '') === g.name);
    if (rest.length === 0) continue;
    cells.push({
      key: `more:${g.name}`,
      label: `${rest.length} more`,
      value: rest.reduce((s, i) => s + i.value, 0),
      group: rest[0].group,
      members: rest,
    });
  }
  const decimals = decimalsFor(items.map((i) => i.value));
  return {
    items,
    total: items.reduce((s, i) => s + i.value, 0),
    grouped,
    groups,
    cells,
    fmt: (v) => formatNumber(v, decimals, true),
  };
}

/* ---------- table and alt text ---------- */

function treemapTable(data: TreemapData, prep: Prepared): Table {
  const grouped = prep.grouped;
  const rows = [...data.items]
    .map((i) => ({ i, v: Number.isFinite(i.value) ? i.value : null }))
    .sort((a, b) => (b.v ?? -Infinity) - (a.v ?? -Infinity) || byCodePoint(a.i.label, b.i.label))
    .map(({ i, v }) => {
      const share = v !== null && v > 0 && prep.total > 0 ? Math.round((v / prep.total) * 1000) / 10 : null;
      return grouped ? [i.label, i.group ?? null, v, share] : [i.label, v, share];
    });
  return {
    columns: [
      { key: 'item', label: 'Item', numeric: false },
      ...(grouped ? [{ key: 'group', label: 'Group', numeric: false }] : []),
      { key: 'value', label: data.valueLabel, numeric: true },
      { key: 'share', label: 'Share of the total (%)', numeric: true },
    ],
    rows,
  };
}

function treemapAlt(data: TreemapData, prep: Prepared): string {
  const max = prep.items[0].value;
  const top = prep.items.filter((i) => i.value === max);
  const share = formatPercent(max / prep.total);
  const names = joinWords(top.length > 3 ? [...top.slice(0, 3).map((i) => i.label), `${top.length - 3} more`] : top.map((i) => i.label));
  const lead =
    top.length === 1
      ? `${data.valueLabel}: ${names} is the largest, ${prep.fmt(max)} (${share} of ${prep.fmt(prep.total)})`
      : `${data.valueLabel}: ${names} are the largest, ${prep.fmt(max)} each (${share} of ${prep.fmt(prep.total)} each)`;
  const parts = [sentence(lead)];
  if (prep.grouped && prep.groups.length > 1) {
    const g = prep.groups[0];
    parts.push(sentence(`The largest group is ${g.name || 'the ungrouped items'}, ${prep.fmt(g.total)} (${formatPercent(g.total / prep.total)})`));
  }
  return parts.join(' ');
}

/* ---------- notes ---------- */

/**
 * A note goes on the rectangle that holds its item (by id, then label;
 * several small items may share one); a character or word, on the item named
 * after it. An item without a positive value has no rectangle: its note goes
 * beside the chart. Chapters have no place here.
 */
function place(note: NoteAt, data: TreemapData, prep: Prepared): { cell: Cell } | Miss {
  const at = isDataAt(note) ? note.category : findNamed(note, data.items, (x) => [x.id, x.label, x.label.toLowerCase()])?.id;
  if (at === undefined) return 'absent';
  const cell = prep.cells.find((c) => c.members.some((m) => m.id === at)) ?? prep.cells.find((c) => c.members.some((m) => m.label === at));
  if (cell) return { cell };
  return data.items.some((i) => i.id === at || i.label === at) ? 'beside' : 'absent';
}

/* ---------- drawing ---------- */

const PAD = 12;

interface Node {
  name: string;
  cell?: Cell;
  children?: Node[];
}

interface Ctx {
  data: TreemapData;
  prep: Prepared;
  opts: TreemapOptions;
  theme: Theme;
  notes: readonly Placed<{ cell: Cell }>[];
  width: number;
  narrow: boolean;
}

function drawTreemap(ctx: Ctx): { body: string; height: number } {
  const { data, prep, opts, theme, width: W, narrow } = ctx;
  const fs = theme.sizes.label;
  const small = theme.sizes.small;
  const parts: string[] = [];
  let y = PAD;

  // Notes that cannot sit inside their rectangle go in a lane above.
  const mh = markerHeight(theme);
  const laneY = y + mh / 2;
  const plotW = W - 2 * PAD;
  const plotH = narrow ? 420 : 400;
  const header = fs + 9;
  const groupIndex = new Map(prep.groups.map((g, i) => [g.name, i]));

  const build = (top: number) => {
    const root: Node = prep.grouped
      ? { name: '', children: prep.groups.map((g) => ({ name: g.name, children: prep.cells.filter((c) => (c.group ?? '') === g.name).map((c) => ({ name: c.key, cell: c })) })) }
      : { name: '', children: prep.cells.map((c) => ({ name: c.key, cell: c })) };
    const h = hierarchy<Node>(root, (n) => n.children)
      .sum((n) => n.cell?.value ?? 0)
      .sort((a, b) => (b.value ?? 0) - (a.value ?? 0) || byCodePoint(a.data.name, b.data.name));
    return layoutTreemap<Node>()
      .tile(treemapSquarify)
      .size([plotW, plotH])
      .paddingInner((n) => (n.depth === 0 ? 4 : 2))
      .paddingTop((n) => (n.depth === 1 ? header : 0))
      .paddingRight((n) => (n.depth === 1 ? 2 : 0))
      .paddingBottom((n) => (n.depth === 1 ? 2 : 0))
      .paddingLeft((n) => (n.depth === 1 ? 2 : 0))(h)
      .each((n) => {
        n.x0 += PAD;
        n.x1 += PAD;
        n.y0 += top;
        n.y1 += top;
      });
  };
  const fitsInside = (n: HierarchyRectangularNode<Node>, notes: number) => n.x1 - n.x0 >= notes * (markerWidth('9', theme) + 3) + 6 && n.y1 - n.y0 >= mh + 6;
  // Lay out once to learn which notes need the lane, then again below it if any do.
  let laid = build(y);
  const leafOf = (cell: Cell, l: HierarchyRectangularNode<Node>) => l.leaves().find((n) => n.data.cell === cell)!;
  const laneNotes = ctx.notes.filter((n) => !fitsInside(leafOf(n.cell, laid), ctx.notes.filter((m) => m.cell === n.cell).length));
  // A note on a rectangle in the upper half goes in a lane above, in the lower half in a lane below.
  const low = (n: { cell: Cell }) => {
    const leaf = leafOf(n.cell, laid);
    return (leaf.y0 + leaf.y1) / 2 > y + plotH / 2;
  };
  const above = laneNotes.filter((n) => !low(n));
  if (above.length) {
    y += mh + 12;
    laid = build(y);
  }

  const tint = (group: string | null, t: { l: number; c: number }) => {
    const i = prep.grouped ? (groupIndex.get(group ?? '') ?? 0) : 0;
    return atLightness(seriesColour(theme, i).source, t.l, t.c);
  };

  // Groups: a band with the name and total, outlined in the series colour.
  if (prep.grouped) {
    parts.push(
      el(
        'g',
        { class: 'vt-groups' },
        (laid.children ?? []).map((g) => {
          const name = g.data.name;
          const i = groupIndex.get(name) ?? 0;
          const total = g.value ?? 0;
          const w = g.x1 - g.x0;
          const full = `${name || 'Other'} \u00B7 ${prep.fmt(total)}`;
          const text = textWidth(full, fs) <= w - 10 ? full : truncateText(name || 'Other', w - 10, fs);
          const label = w >= 40 && header >= fs ? textEl(text, { x: g.x0 + 6, y: g.y0 + fs + 2, 'font-weight': 600 }) : '';
          return el('g', { class: 'vt-group', 'data-group': name }, [
            titleEl(`${name || 'Other'}: ${prep.fmt(total)} (${formatPercent(total / prep.total)})`),
            el('rect', { x: g.x0, y: g.y0, width: w, height: g.y1 - g.y0, fill: tint(name, GROUP_TINT), stroke: seriesColour(theme, i).mark, 'stroke-width': 1.5 }),
            label,
          ]);
        }),
      ),
    );
  }

  // Items: labelled only where the name (up to two lines) and the value fit.
  const anchors: NoteAnchor[] = [];
  const anchorsBelow: NoteAnchor[] = [];
  const leaves = laid.leaves();
  let unlabelled = 0;
  parts.push(
    el(
      'g',
      { class: 'vt-cells' },
      leaves.map((n) => {
        const cell = n.data.cell!;
        const w = n.x1 - n.x0;
        const h = n.y1 - n.y0;
        const fill = tint(cell.group, ITEM_TINT);
        const share = formatPercent(cell.value / prep.total);
        const g: string[] = [
          titleEl(
            cell.members.length === 1
              ? `${cell.label}: ${prep.fmt(cell.value)} (${share})`
              : `${cell.label}: ${cell.members.map((m) => m.label).join(', ')} \u2014 ${prep.fmt(cell.value)} together (${share})`,
          ),
          el('rect', { x: n.x0, y: n.y0, width: w, height: h, fill, stroke: prep.grouped ? 'none' : theme.axis, 'stroke-width': prep.grouped ? undefined : 0.75 }),
        ];
        const cellNotes = ctx.notes.filter((t) => t.cell === cell);
        const inside = cellNotes.length > 0 && !laneNotes.includes(cellNotes[0]);
        const noteRoom = inside ? cellNotes.reduce((s, t) => s + markerWidth(t.note.label, theme) + 3, 0) : 0;
        const lines = wrapText(cell.label, w - 10 - noteRoom, fs, 2);
        const valueText = opts.values ? (textWidth(`${prep.fmt(cell.value)} (${share})`, small) <= w - 10 ? `${prep.fmt(cell.value)} (${share})` : prep.fmt(cell.value)) : '';
        const needH = 6 + lines.lines.length * (fs + 3) + (opts.values ? small + 4 : 0);
        const fits = lines.complete && needH <= h && (!opts.values || textWidth(valueText, small) <= w - 10);
        if (fits) {
          lines.lines.forEach((line, li) => g.push(textEl(line, { x: n.x0 + 5, y: n.y0 + 4 + fs + li * (fs + 3) })));
          if (opts.values) g.push(textEl(valueText, { x: n.x0 + 5, y: n.y0 + 4 + lines.lines.length * (fs + 3) + small, 'font-size': small, fill: theme.inkMuted }));
        } else unlabelled++;
        if (inside) {
          let mx = n.x1 - 4;
          for (const t of cellNotes) {
            const mw = markerWidth(t.note.label, theme);
            g.push(noteInline(t.note, mx - mw / 2, n.y0 + 4 + mh / 2, theme));
            mx -= mw + 3;
          }
        } else for (const t of cellNotes) (above.includes(t) ? anchors : anchorsBelow).push({ note: t.note, x: (n.x0 + n.x1) / 2, y: (n.y0 + n.y1) / 2 });
        return el('g', { class: 'vt-cell', 'data-item': cell.members.length === 1 ? cell.members[0].id : cell.key }, g);
      }),
    ),
  );
  parts.push(notesInLane(anchors, laneY, PAD, W - PAD, theme));
  let bottom = y + plotH;
  if (anchorsBelow.length) {
    parts.push(notesBelow(anchorsBelow, bottom + 12 + mh / 2, PAD, W - PAD, theme));
    bottom += 12 + mh;
  }

  // What the areas show, and how many items go without a label.
  const note = unlabelled === 0 ? '' : unlabelled === 1 ? ' One rectangle is too small for its label; the table lists it.' : ` ${unlabelled} rectangles are too small for their labels; the table lists them.`;
  const caption = wrapText(`Area: ${data.valueLabel}.${note}`, W - 2 * PAD, theme.sizes.axisTitle, 3, 'serif');
  caption.lines.forEach((line, i) =>
    parts.push(
      textEl(line, {
        x: PAD,
        y: bottom + 8 + theme.sizes.axisTitle + i * (theme.sizes.axisTitle + 4),
        'font-size': theme.sizes.axisTitle,
        style: serifStyle(theme, true),
        fill: theme.inkMuted,
        class: 'vt-axis-title',
      }),
    ),
  );
  return { body: parts.join(''), height: Math.ceil(bottom + 8 + caption.lines.length * (theme.sizes.axisTitle + 4) + PAD) };
}

export const treemap = defineChart({
  name: 'treemap',
  options: treemapOptions,
  prepare: (data: TreemapData, opts) => prepare(data, opts),
  empty: ({ data, prep }) =>
    prep.items.length > 0 ? null : data.items.length === 0 ? 'the dataset has no items.' : 'every value is zero, negative or missing.',
  table: ({ data, prep }) => treemapTable(data, prep),
  place: (at, { data, prep }) => place(at, data, prep),
  alt: ({ data, prep }) => treemapAlt(data, prep),
  draw: ({ data, prep, opts, theme }, notes, { width, narrow }) => drawTreemap({ data, prep, opts, theme, notes, width, narrow }),
});
