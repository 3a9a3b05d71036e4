/**
 * The social cards' layouts: what each card shows and where, as the element
 * trees satori lays out (plain objects, no JSX). A card is set like a museum
 * label beside the work it describes: a narrow column of type on the left
 * (where the card stands in the exhibit, its title in the serif, then the
 * exhibition and who puts it on), and on the right the chart itself, framed
 * on the charts' own paper, drawn large enough to read.
 *
 * - panel card: the room, the panel's title, the exhibit and organiser; the
 *   panel's chart.
 * - room card: "Room 2 of 4", the room's title and its panels' titles; the
 *   room's first chart.
 * - home card: the organiser, the exhibit's title and subtitle, how many rooms
 *   and panels; a wall of the first chart of each room (up to four).
 *
 * Layouts only arrange what they are given; ./draw.ts rasterises the charts
 * to the sizes asked for here and turns the trees into PNGs. Change
 * `LAYOUT_VERSION` with any change here that alters a card's pixels: it is
 * part of every card's cache key.
 */
import { CARD_SIZE } from '../share/addresses.ts';
import { FAMILIES } from '../raster/families.ts';

export const LAYOUT_VERSION = 1;

/** The site's palette (site/styles/exhibit.css, :root), which tests/cards checks against it. */
export const PALETTE = {
  paper: '#fbf8f1',
  ink: '#22201c',
  muted: '#5a554c',
  rule: '#d9d2c3',
  accent: '#7a3b12',
  panel: '#ffffff',
} as const;

/** A chart as the pipeline drew it: the wide layout, and the narrow one when the kind has it. */
export interface ChartPicture {
  svg: string;
  narrow: string | null;
}

export interface PanelCard {
  kind: 'panel';
  exhibit: string;
  organiser: string;
  room: { number: number; title: string };
  title: string;
  chart: ChartPicture;
}

export interface RoomCard {
  kind: 'room';
  exhibit: string;
  organiser: string;
  number: number;
  rooms: number;
  title: string;
  panels: string[];
  chart: ChartPicture | null;
}

export interface HomeCard {
  kind: 'home';
  exhibit: string;
  subtitle: string | null;
  organiser: string;
  rooms: number;
  panels: number;
  charts: ChartPicture[];
}

/** Everything a card draws: its cache key is a hash of this, the fonts and `LAYOUT_VERSION`. */
export type CardContent = PanelCard | RoomCard | HomeCard;

/** A box a chart is to be drawn into, in card pixels. */
export interface Box {
  width: number;
  height: number;
}

/** Where a chart goes on a card: the box inside its frame, from the card's top left corner, in pixels. */
export interface Place extends Box {
  x: number;
  y: number;
}

/** An element satori lays out. */
export interface Node {
  type: string;
  props: { style?: Record<string, string | number>; children?: Child | Child[] };
}
type Child = Node | string;

function div(style: Record<string, string | number>, children?: Child | Child[]): Node {
  return { type: 'div', props: { style, ...(children !== undefined ? { children } : {}) } };
}

const W = CARD_SIZE.width;
const H = CARD_SIZE.height;
/** The accent rule along the top edge. */
const EDGE = 8;
const LEFT = 56;
const TOP = 52;
const BOTTOM = 48;
const RIGHT = 40;
/** Width of the column of type. */
const COLUMN = 430;
const GUTTER = 36;
const FRAME_PAD = 14;
const WALL_GAP = 18;
const serif = FAMILIES.serif.name;
const sans = FAMILIES.sans.name;

/** The area right of the column, where the chart (or the wall of charts) is framed. */
const AREA: Place = { x: LEFT + COLUMN + GUTTER, y: EDGE + TOP, width: W - LEFT - COLUMN - GUTTER - RIGHT, height: H - EDGE - TOP - BOTTOM };

/** The frames of a card's charts, in the card's pixels. */
function frames(card: CardContent): Place[] {
  if (card.kind === 'home') return wall(card.charts.length);
  if (card.kind === 'room' && !card.chart) return [];
  return [AREA];
}

/**
 * Where each chart of a card goes (inside its frame), in the order of the
 * card's charts: ./draw.ts draws each chart to fit its box and sets it there.
 */
export function chartPlaces(card: CardContent): Place[] {
  const inset = FRAME_PAD + 1;
  return frames(card).map((f) => ({ x: f.x + inset, y: f.y + inset, width: f.width - 2 * inset, height: f.height - 2 * inset - 2 }));
}

/** The frames of the wall of charts on the home card: one, two stacked, or a grid of four (three: one wide above two). */
function wall(n: number): Place[] {
  const half = (size: number) => Math.floor((size - WALL_GAP) / 2);
  const { x, y, width, height } = AREA;
  const w2 = half(width);
  const h2 = half(height);
  const x2 = x + width - w2;
  const y2 = y + height - h2;
  if (n <= 1) return n ? [AREA] : [];
  if (n === 2) return [{ x, y, width, height: h2 }, { x, y: y2, width, height: h2 }];
  const below = [{ x, y: y2, width: w2, height: h2 }, { x: x2, y: y2, width: w2, height: h2 }];
  if (n === 3) return [{ x, y, width, height: h2 }, ...below];
  return [{ x, y, width: w2, height: h2 }, { x: x2, y, width: w2, height: h2 }, ...below];
}

/** Title sizes stepped down for longer titles, so a title keeps to about four lines in the column. */
function titleSize(title: string, sizes: readonly [number, number, number]): number {
  const n = Array.from(title).length;
  return n <= 28 ? sizes[0] : n <= 56 ? sizes[1] : sizes[2];
}

const kicker = (text: string): Node =>
  div({ fontFamily: sans, fontWeight: 600, fontSize: 19, letterSpacing: 2.4, textTransform: 'uppercase', color: PALETTE.accent, lineClamp: 2 }, text);

function signature(exhibit: string, organiser: string): Node[] {
  return [
    div({ width: 56, height: 4, backgroundColor: PALETTE.accent, marginBottom: 18 }),
    div({ fontFamily: serif, fontStyle: 'italic', fontSize: 28, lineHeight: 1.2, color: PALETTE.ink, lineClamp: 2 }, exhibit),
    div({ fontFamily: sans, fontSize: 20, lineHeight: 1.3, color: PALETTE.muted, marginTop: 6, lineClamp: 2 }, organiser),
  ];
}

/** An empty frame on the charts' paper, where ./draw.ts sets a chart. */
function frame(f: Place): Node {
  return div({
    position: 'absolute',
    left: f.x,
    top: f.y,
    width: f.width,
    height: f.height,
    boxSizing: 'border-box',
    backgroundColor: PALETTE.paper,
    border: `1px solid ${PALETTE.rule}`,
    // A heavier lower edge, as a mount under a framed print.
    borderBottom: `3px solid ${PALETTE.rule}`,
  });
}

function column(children: Node[]): Node {
  return div({ display: 'flex', flexDirection: 'column', width: COLUMN, height: H - EDGE - TOP - BOTTOM }, children);
}

function page(card: CardContent, left: Node): Node {
  return div(
    {
      display: 'flex',
      position: 'relative',
      width: W,
      height: H,
      padding: `${TOP}px ${RIGHT}px ${BOTTOM}px ${LEFT}px`,
      boxSizing: 'border-box',
      backgroundColor: PALETTE.paper,
      fontFamily: sans,
      color: PALETTE.ink,
      // A rule along the top edge in the accent colour.
      borderTop: `${EDGE}px solid ${PALETTE.accent}`,
    },
    [left, ...frames(card).map(frame)],
  );
}

const spacer = (): Node => div({ display: 'flex', flexGrow: 1 });

/** The card's element tree: the type and the empty frames (the charts are set into them afterwards). */
export function cardTree(card: CardContent): Node {
  switch (card.kind) {
    case 'panel':
      return page(
        card,
        column([
          kicker(`Room ${card.room.number} · ${card.room.title}`),
          div(
            { fontFamily: serif, fontWeight: 600, fontSize: titleSize(card.title, [54, 46, 38]), lineHeight: 1.12, color: PALETTE.ink, marginTop: 22, lineClamp: 6 },
            card.title,
          ),
          spacer(),
          ...signature(card.exhibit, card.organiser),
        ]),
      );
    case 'room': {
      const shown = card.panels.slice(0, card.panels.length > 5 ? 4 : 5);
      const more = card.panels.length - shown.length;
      return page(
        card,
        column([
          kicker(`Room ${card.number} of ${card.rooms}`),
          div(
            { fontFamily: serif, fontWeight: 600, fontSize: titleSize(card.title, [52, 44, 36]), lineHeight: 1.12, color: PALETTE.ink, marginTop: 18, lineClamp: 3 },
            card.title,
          ),
          div(
            { display: 'flex', flexDirection: 'column', marginTop: 22, fontFamily: sans, fontSize: 20, lineHeight: 1.3, color: PALETTE.muted },
            [
              ...shown.map((t) => div({ display: 'block', lineClamp: 1, marginBottom: 4 }, `— ${t}`)),
              ...(more > 0 ? [div({ display: 'block', fontStyle: 'normal', marginTop: 2 }, `and ${more} more`)] : []),
            ],
          ),
          spacer(),
          ...signature(card.exhibit, card.organiser),
        ]),
      );
    }
    case 'home': {
      const count = `${card.rooms} room${card.rooms === 1 ? '' : 's'} · ${card.panels} panel${card.panels === 1 ? '' : 's'}`;
      return page(
        card,
        column([
          kicker(`An exhibition by ${card.organiser}`),
          div(
            { fontFamily: serif, fontWeight: 600, fontSize: titleSize(card.exhibit, [64, 52, 42]), lineHeight: 1.08, color: PALETTE.ink, marginTop: 20, lineClamp: 4 },
            card.exhibit,
          ),
          ...(card.subtitle
            ? [div({ fontFamily: serif, fontStyle: 'italic', fontSize: 26, lineHeight: 1.3, color: PALETTE.muted, marginTop: 18, lineClamp: 4 }, card.subtitle)]
            : []),
          spacer(),
          div({ width: 56, height: 4, backgroundColor: PALETTE.accent, marginBottom: 18 }),
          div({ fontFamily: sans, fontSize: 22, color: PALETTE.ink }, count),
        ]),
      );
    }
  }
}
