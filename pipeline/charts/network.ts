/**
 * A network: nodes sized by a measure, grouped by community, joined by
 * links as thick as their weight, each node named beside it.
 *
 * Layout. A force-directed layout (force.ts) with a seeded random source and
 * a fixed number of ticks: the same data always gives the same picture.
 * Nodes are laid out sorted by id and links by their ends, so the order in
 * which the data lists them does not matter either.
 *
 * Encoding. A node's area is proportional to its size (radius ∝ √size, with
 * a smallest radius so every node stays visible). Each community is a
 * group with its own colour (Okabe–Ito mark colours from the theme) and its
 * own shape (circle, square, diamond, triangles), so colour is never the
 * only cue; groups are numbered by their total size, largest first. Link
 * width grows linearly with weight.
 *
 * Names. Placed greedily, largest node first, in the first free one of
 * eight positions around the node (labels.ts), clear of other names and
 * nodes and, where possible, of links. A name with no free position is
 * replaced by a number, itself placed the same way, and listed in a key
 * under the drawing.
 */

import { z } from 'zod';
import type { NetworkData, NoteAt, Table } from './types.ts';
import { seriesColour, serifStyle } from './theme.ts';
import type { Theme } from './theme.ts';
import type { Miss, Placed } from './chart.ts';
import { defineChart, findNamed, isDataAt, idOption } from './chart.ts';
import { el, textEl, textWidth, titleEl, truncateText } from './svg.ts';
import { decimalsFor, formatNumber, joinWords, sentence } from './format.ts';
import { forceLayout } from './force.ts';
import { boxOf, placeAllEightWays, placeEightWays } from './labels.ts';
import type { Box, Disc, PositionContext, Segment } from './labels.ts';
import { reach, shapeFor, symbol } from './shapes.ts';
import type { Shape } from './shapes.ts';
import { legend, markerHeight, markerWidth, noteInline } from './furniture.ts';
import type { Block, LegendItem } from './furniture.ts';

export const networkOptions = z.strictObject({
  minWeight: z
    .number()
    .min(0)
    .default(0)
    .describe('Links lighter than this are left out of the drawing (the table keeps them); links of weight 0 or less are never drawn. Default: 0.'),
  ticks: z
    .number()
    .int()
    .min(50)
    .max(2000)
    .default(300)
    .describe('Steps of the force-directed layout; more settle a large network further, at some cost in build time. Default: 300.'),
  id: idOption,
});

export type NetworkOptions = z.output<typeof networkOptions>;

interface Node {
  id: string;
  name: string;
  size: number;
  community: number;
  /** Group number, 1 = the group with the largest total size. */
  group: number;
}

interface Link {
  source: string;
  target: string;
  weight: number;
}

interface Group {
  number: number;
  members: Node[];
  total: number;
}

interface Prepared {
  /** Nodes sorted by id. */
  nodes: Node[];
  /** Every link with a positive weight between two known, different nodes; pairs merged; sorted by their ends. */
  links: Link[];
  groups: Group[];
  fmtSize: (v: number) => string;
  fmtWeight: (v: number) => string;
}

const byCodePoint = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);

function prepare(data: NetworkData): Prepared {
  const seen = new Set<string>();
  const raw = data.nodes
    .filter((n) => {
      if (seen.has(n.id)) return false;
      seen.add(n.id);
      return true;
    })
    .map((n) => ({ ...n, size: Number.isFinite(n.size) ? Math.max(0, n.size) : 0 }))
    .sort((a, b) => byCodePoint(a.id, b.id));
  // Links: one per unordered pair, weights added.
  const pairs = new Map<string, Link>();
  for (const e of data.edges) {
    if (!seen.has(e.source) || !seen.has(e.target) || e.source === e.target) continue;
    if (!Number.isFinite(e.weight) || e.weight <= 0) continue;
    const [s, t] = byCodePoint(e.source, e.target) <= 0 ? [e.source, e.target] : [e.target, e.source];
    const key = `${s}\u0000${t}`;
    const link = pairs.get(key);
    if (link) link.weight += e.weight;
    else pairs.set(key, { source: s, target: t, weight: e.weight });
  }
  const links = [...pairs.values()].sort((a, b) => byCodePoint(a.source, b.source) || byCodePoint(a.target, b.target));
  // Groups: communities ranked by total size, then by their own number.
  const byCommunity = new Map<number, typeof raw>();
  for (const n of raw) byCommunity.set(n.community, [...(byCommunity.get(n.community) ?? []), n]);
  const ranked = [...byCommunity.entries()]
    .map(([community, members]) => ({ community, members, total: members.reduce((s, m) => s + m.size, 0) }))
    .sort((a, b) => b.total - a.total || a.community - b.community);
  const groupOf = new Map(ranked.map((g, i) => [g.community, i + 1]));
  const nodes: Node[] = raw.map((n) => ({ id: n.id, name: n.name, size: n.size, community: n.community, group: groupOf.get(n.community)! }));
  const bySize = (a: Node, b: Node) => b.size - a.size || byCodePoint(a.name, b.name) || byCodePoint(a.id, b.id);
  const groups = ranked.map((g, i) => ({ number: i + 1, total: g.total, members: nodes.filter((n) => n.group === i + 1).sort(bySize) }));
  const sizeDecimals = decimalsFor(nodes.map((n) => n.size), 3);
  const weightDecimals = decimalsFor(links.map((l) => l.weight));
  return {
    nodes,
    links,
    groups,
    fmtSize: (v) => formatNumber(v, sizeDecimals, true),
    fmtWeight: (v) => formatNumber(v, weightDecimals, true),
  };
}

/* ---------- table and alt text ---------- */

function neighbours(prep: Prepared, id: string): { node: Node; weight: number }[] {
  const byId = new Map(prep.nodes.map((n) => [n.id, n]));
  return prep.links
    .filter((l) => l.source === id || l.target === id)
    .map((l) => ({ node: byId.get(l.source === id ? l.target : l.source)!, weight: l.weight }))
    .sort((a, b) => b.weight - a.weight || byCodePoint(a.node.name, b.node.name));
}

function bySizeDesc(nodes: readonly Node[]): Node[] {
  return [...nodes].sort((a, b) => b.size - a.size || byCodePoint(a.name, b.name) || byCodePoint(a.id, b.id));
}

function networkTable(data: NetworkData, prep: Prepared): Table {
  return {
    columns: [
      { key: 'name', label: 'Name', numeric: false },
      { key: 'group', label: 'Group', numeric: true },
      { key: 'size', label: data.sizeLabel, numeric: true },
      { key: 'links', label: 'Links', numeric: true },
      { key: 'linked', label: `Linked to (${data.weightLabel})`, numeric: false },
    ],
    rows: bySizeDesc(prep.nodes).map((n) => {
      const ns = neighbours(prep, n.id);
      return [n.name, n.group, n.size, ns.length, ns.map((x) => `${x.node.name} (${prep.fmtWeight(x.weight)})`).join('; ')];
    }),
  };
}

const MAX_GROUPS_IN_ALT = 5;
const MAX_MEMBERS_IN_ALT = 5;

function networkAlt(data: NetworkData, prep: Prepared): string {
  const ranked = bySizeDesc(prep.nodes);
  const top = ranked.filter((n) => n.size === ranked[0].size);
  const others = prep.nodes.length - 1;
  const parts: string[] = [];
  if (prep.nodes.length === 1) {
    parts.push(sentence(`${ranked[0].name} is the only node (${data.sizeLabel} ${prep.fmtSize(ranked[0].size)})`));
  } else if (top.length === 1) {
    const links = neighbours(prep, top[0].id).length;
    parts.push(sentence(`${top[0].name} is the most central (${data.sizeLabel} ${prep.fmtSize(top[0].size)}), linked to ${links} of the ${others} others`));
  } else {
    const names = joinWords(top.length > 3 ? [...top.slice(0, 3).map((n) => n.name), `${top.length - 3} more`] : top.map((n) => n.name));
    parts.push(sentence(`${names} are the most central (${data.sizeLabel} ${prep.fmtSize(top[0].size)} each)`));
  }
  if (prep.groups.length === 1) {
    if (prep.nodes.length > 1) parts.push(`All ${prep.nodes.length} form one group.`);
  } else {
    const list = prep.groups.slice(0, MAX_GROUPS_IN_ALT).map((g) => {
      const names = g.members.slice(0, MAX_MEMBERS_IN_ALT).map((m) => m.name);
      if (g.members.length > MAX_MEMBERS_IN_ALT) names.push(`${g.members.length - MAX_MEMBERS_IN_ALT} more`);
      return joinWords(names);
    });
    const rest = prep.groups.length - list.length;
    parts.push(sentence(`${prep.groups.length} groups: ${list.join('; ')}${rest > 0 ? `; and ${rest} smaller groups` : ''}`));
  }
  return parts.join(' ');
}

/* ---------- notes ---------- */

/** A note goes beside a node: by id, then by name; a character or word, the node named after it. Chapters have no place here. */
function place(note: NoteAt, data: NetworkData, prep: Prepared): { node: Node } | Miss {
  const at = isDataAt(note) ? note.category : findNamed(note, data.nodes, (x) => [x.id, x.name])?.id;
  if (at === undefined) return 'absent';
  const node = prep.nodes.find((n) => n.id === at) ?? prep.nodes.find((n) => n.name === at);
  return node ? { node } : 'absent';
}

/* ---------- drawing ---------- */

const PAD = 12;

interface Ctx {
  data: NetworkData;
  prep: Prepared;
  opts: NetworkOptions;
  theme: Theme;
  notes: readonly Placed<{ node: Node }>[];
  width: number;
  narrow: boolean;
}

interface Drawn {
  node: Node;
  x: number;
  y: number;
  r: number;
  shape: Shape;
  /** Radius of the disc that holds the whole symbol. */
  reach: number;
}

/** Legend rows: one entry per group (symbol, colour, "Group 1"), wrapped; none for a single group. */
function groupLegend(ctx: Ctx, top: number): Block {
  const { prep, theme, width: W } = ctx;
  const items: LegendItem[] = prep.groups.map((g) => ({
    name: `Group ${g.number} (${g.members.length})`,
    colour: seriesColour(theme, g.number - 1).mark,
    symbol: (cx, cy) => symbol(shapeFor(g.number - 1), cx, cy, 6),
    title: `Group ${g.number}: ${joinWords(g.members.map((m) => m.name))}`,
  }));
  return legend(prep.groups.length < 2 ? [] : items, PAD, top, W - 2 * PAD, theme, { swatch: 16, lineHeight: theme.sizes.label + 10, align: 'middle', truncate: false });
}

function drawNetwork(ctx: Ctx): { body: string; height: number } {
  const { data, prep, opts, theme, width: W, narrow } = ctx;
  const fs = theme.sizes.label;
  const small = theme.sizes.small;
  const parts: string[] = [];
  let y = PAD;

  const lg = groupLegend(ctx, y);
  parts.push(lg.markup);
  if (lg.height) y += lg.height + 4;

  // The plot: a box in the layout's proportions, a margin inside it for names.
  // Larger networks get a taller plot, so names keep finding room.
  const n = prep.nodes.length;
  const plotH = narrow ? Math.min(560, Math.max(340, 220 + 12 * n)) : Math.min(560, Math.max(400, 300 + 8 * n));
  const plot = { x: PAD, y, width: W - 2 * PAD, height: plotH };
  // Room around the nodes for names: about half a name across, a line and a half down.
  const mx = narrow ? 40 : 48;
  const my = 24;
  const inner = { x: plot.x + mx, y: plot.y + my, width: plot.width - 2 * mx, height: plot.height - 2 * my };
  const rMax = narrow ? 13 : 18;
  const rMin = narrow ? 4 : 5;
  const maxSize = Math.max(...prep.nodes.map((n) => n.size));
  const radius = (size: number) => Math.max(rMin, maxSize > 0 ? rMax * Math.sqrt(size / maxSize) : rMin);
  const shapes = prep.nodes.map((n) => shapeFor(n.group - 1));
  const reaches = prep.nodes.map((n, i) => reach(shapes[i], radius(n.size)));
  const drawnLinks = prep.links.filter((l) => l.weight >= opts.minWeight);
  const positions = forceLayout(
    prep.nodes.map((n, i) => ({ id: n.id, r: reaches[i] })),
    drawnLinks,
    inner,
    opts.ticks,
    narrow ? 70 : 110,
  );
  const drawn: Drawn[] = prep.nodes.map((node, i) => ({ node, x: positions[i].x, y: positions[i].y, r: radius(node.size), shape: shapes[i], reach: reaches[i] }));
  const at = new Map(drawn.map((d) => [d.node.id, d]));

  // Links, heaviest on top.
  const maxW = Math.max(...drawnLinks.map((l) => l.weight), 0);
  const widthOf = (w: number) => 1 + ((narrow ? 4 : 6) - 1) * (maxW > 0 ? w / maxW : 0);
  const segments: Segment[] = drawnLinks.map((l) => ({ a: { x: at.get(l.source)!.x, y: at.get(l.source)!.y }, b: { x: at.get(l.target)!.x, y: at.get(l.target)!.y } }));
  parts.push(
    el(
      'g',
      { class: 'vt-links', stroke: theme.axis, 'stroke-linecap': 'round' },
      [...drawnLinks]
        .map((l, i) => ({ l, s: segments[i] }))
        .sort((a, b) => a.l.weight - b.l.weight)
        .map(({ l, s }) =>
          el(
            'line',
            { x1: s.a.x, y1: s.a.y, x2: s.b.x, y2: s.b.y, 'stroke-width': widthOf(l.weight) },
            titleEl(`${at.get(l.source)!.node.name} \u2013 ${at.get(l.target)!.node.name}: ${prep.fmtWeight(l.weight)} (${data.weightLabel})`),
          ),
        ),
    ),
  );

  // Nodes, largest first so small ones stay visible on top.
  const order = [...drawn].sort((a, b) => b.r - a.r || byCodePoint(a.node.id, b.node.id));
  parts.push(
    el(
      'g',
      { class: 'vt-nodes', stroke: theme.paper, 'stroke-width': 1.5 },
      order.map((d) => {
        const s = symbol(d.shape, d.x, d.y, d.r);
        return el(
          s.tag,
          { ...s.attrs, fill: seriesColour(theme, d.node.group - 1).mark, 'data-node': d.node.id },
          titleEl(`${d.node.name}: ${data.sizeLabel} ${prep.fmtSize(d.node.size)}; group ${d.node.group}`),
        );
      }),
    ),
  );

  // Names: largest node first, each in the first free position around its node.
  const discs: Disc[] = drawn.map((d) => ({ x: d.x, y: d.y, r: d.reach }));
  const place: PositionContext = { bounds: boxOf(plot), discs, segments, taken: [], gap: 3, pad: 2 };
  const nameMax = narrow ? 110 : 160;
  const labels: string[] = [];
  const markers: string[] = [];
  const notesOf = (d: Drawn) => ctx.notes.filter((n) => n.node.id === d.node.id);
  const request = (d: Drawn, text: string, size: number) => {
    const notes = notesOf(d);
    const markerRoom = notes.reduce((s, n) => s + markerWidth(n.note.label, theme) + 3, 0);
    return {
      disc: { x: d.x, y: d.y, r: d.reach },
      width: textWidth(text, size) + (markerRoom ? markerRoom + 1 : 0),
      height: Math.max(size + 2, notes.length ? markerHeight(theme) : 0),
    };
  };
  /** A name (or key number) set in `box`, its middle `height / 2` below the box's top, with the node's note markers after it. */
  const write = (d: Drawn, text: string, size: number, box: Box, height: number) => {
    const cy = box.y0 + height / 2;
    labels.push(textEl(text, { x: box.x0, y: cy + size * 0.35, 'font-size': size === fs ? undefined : size, 'data-node': d.node.id }));
    let mx = box.x0 + textWidth(text, size) + 4;
    for (const n of notesOf(d)) {
      const w = markerWidth(n.note.label, theme);
      markers.push(noteInline(n.note, mx + w / 2, cy, theme));
      mx += w + 3;
    }
  };
  const names = order.map((d) => truncateText(d.node.name, nameMax, fs));
  const requests = order.map((d, i) => request(d, names[i], fs));
  const placed = placeAllEightWays(requests, place);
  const keyed: Drawn[] = [];
  order.forEach((d, i) => {
    const p = placed[i];
    if (p) write(d, names[i], fs, p.box, requests[i].height);
    else keyed.push(d);
  });
  // Names that found no room: a number instead, and a key below.
  keyed.forEach((d, i) => {
    const key = String(i + 1);
    const req = request(d, key, small);
    const p = placeEightWays(req, place);
    // Nowhere free at all: the number goes to the right of the node regardless.
    if (p) write(d, key, small, p.box, req.height);
    else write(d, key, small, boxOf({ x: d.x + d.reach + 3, y: d.y - small / 2, width: 0, height: small }), small);
  });
  parts.push(
    el('g', { class: 'vt-node-labels', stroke: theme.paper, 'stroke-width': 3, 'stroke-linejoin': 'round', style: 'paint-order:stroke' }, labels),
  );
  if (markers.length) parts.push(el('g', { class: 'vt-notes' }, markers));
  // The drawing ends under its lowest node or name.
  const lowest = Math.max(...drawn.map((d) => d.y + d.reach), ...place.taken.map((t) => t.y1));
  y = Math.min(plot.y + plot.height, lowest + 8) + 6;

  if (keyed.length) {
    const entries = keyed.map((d, i) => `${i + 1} ${d.node.name}`);
    const lines: string[] = [];
    let cur = '';
    for (const e of entries) {
      const next = cur ? `${cur} \u00B7 ${e}` : e;
      if (cur && textWidth(next, small) > W - 2 * PAD) {
        lines.push(cur);
        cur = e;
      } else cur = next;
    }
    if (cur) lines.push(cur);
    parts.push(
      el(
        'g',
        { class: 'vt-key', 'font-size': small, fill: theme.ink },
        lines.map((line, i) => textEl(truncateText(line, W - 2 * PAD, small), { x: PAD, y: y + small + i * (small + 5) })),
      ),
    );
    y += lines.length * (small + 5) + 4;
  }

  // What the marks mean.
  const captionY = y + theme.sizes.axisTitle;
  parts.push(
    textEl(truncateText(`Area: ${data.sizeLabel}. Line width: ${data.weightLabel}.`, W - 2 * PAD, theme.sizes.axisTitle, 'serif'), {
      x: PAD,
      y: captionY,
      'font-size': theme.sizes.axisTitle,
      style: serifStyle(theme, true),
      fill: theme.inkMuted,
      class: 'vt-axis-title',
    }),
  );
  return { body: parts.join(''), height: Math.ceil(captionY + PAD) };
}

export const network = defineChart({
  name: 'network',
  options: networkOptions,
  prepare: (data: NetworkData) => prepare(data),
  empty: ({ prep }) => (prep.nodes.length === 0 ? 'the dataset has no nodes.' : null),
  table: ({ data, prep }) => networkTable(data, prep),
  place: (at, { data, prep }) => place(at, data, prep),
  alt: ({ data, prep }) => networkAlt(data, prep),
  draw: ({ data, prep, opts, theme }, notes, { width, narrow }) => drawNetwork({ data, prep, opts, theme, notes, width, narrow }),
});
