/**
 * The chart contract. A chart kind is one file that gives `defineChart` its
 * name, its options and what only it knows: how to make its data safe to
 * draw, when there is nothing to draw, where a note goes, what the chart
 * says in words, the table of the values it draws, and the drawing itself.
 * Everything else happens here, the same way for every kind:
 *
 *   1. options  parsed strictly: unknown keys rejected, defaults filled,
 *               each error naming the option and what it takes
 *   2. id       the base of the ids of the SVG's <title> and <desc> (below)
 *   3. prepare  the kind's `prepare`, once, shared by everything after it
 *   4. table    the kind's `table`: the values the chart draws
 *   5. empty    the kind's `empty` gives a reason, or null; with a reason both
 *               layouts are the shared "No data to draw" panel
 *   6. notes    each note placed once by the kind's `place`, in order; one
 *               note per `slot` when the kind has slots; a note not drawn is
 *               reported with why ("beside": the chart shows its target but
 *               has no place for it; "absent": the chart does not show it)
 *   7. words    the kind's `alt` summary; the drawn notes' sentences follow it
 *               in the alt text, and are kept apart for pages (`summary`)
 *   8. layouts  the kind's `draw` at 720 units wide and at 360, each framed
 *               by `frame` (root, <title>, <desc>, paper)
 *
 * Ids. The root's `<title>` and `<desc>` need ids that are unique on a page
 * yet the same on every build. By default a chart's id is "vt-<kind>-<hash>",
 * the hash (FNV-1a, 32 bit) taken over the dataset, the options and the
 * notes; the narrow layout appends "-n". Two identical charts on one page
 * would share ids: give one of them an `id` option.
 */

import { z } from 'zod';
import type { ChartOutput, DataAt, NoteAt, NoteOutcome, PinnedNote, Table, TextAt } from './types.ts';
import { defaultTheme, serifStyle } from './theme.ts';
import type { Theme } from './theme.ts';
import { el, escapeXml, hashString, textEl, truncateText } from './svg.ts';
import { upperFirst } from './format.ts';
import { noteSentences } from './furniture.ts';

/** One of the two layouts: the viewBox width, and whether it is the narrow one (for phones). */
export interface Layout {
  width: number;
  narrow: boolean;
}

/** What every step of a kind receives: the data, the parsed options, the theme and what `prepare` made of them. */
export interface Drawing<D, O, P> {
  data: D;
  opts: O;
  theme: Theme;
  prep: P;
}

/** Why a note is not drawn: the chart shows its target but has no place for it ("beside"), or does not show it at all ("absent"). */
export type Miss = 'beside' | 'absent';

/** A note the kind has placed: where it goes, in the kind's own terms, and the note. */
export type Placed<T> = T & { note: PinnedNote };

/** A drawing of one layout: its markup (inside the root group) and its height in viewBox units. */
export interface Body {
  body: string;
  height: number;
}

/** What a kind supplies; see the file comment for when each step runs. */
export interface ChartSpec<D extends { kind: string; title: string }, S extends z.ZodObject, P, T extends object> {
  /** The chart kind, equal to the dataset's `kind`. */
  name: D['kind'];
  /** Options: a strict object, every field described with its default ("Default: …"), `id` among them. */
  options: S;
  /** The data made safe to draw (missing values, order, formats), once for both layouts. */
  prepare(data: D, opts: z.output<S>, theme: Theme): P;
  /** Why there is nothing to draw ("the dataset has no rows."), or null. */
  empty(c: Drawing<D, z.output<S>, P>): string | null;
  /** The values the chart draws, as a table. */
  table(c: Drawing<D, z.output<S>, P>): Table;
  /** Where a note goes, in the kind's terms, or why it cannot be drawn. Called once per note. */
  place(at: NoteAt, c: Drawing<D, z.output<S>, P>): T | Miss;
  /** When set, at most one note is drawn per slot (the first); later ones go beside the chart. */
  slot?(target: T): string | number;
  /** The chart's own words for what a note points at, when the chart has them ("Segment 3 (words 1201–1800)"). */
  words?(at: NoteAt, c: Drawing<D, z.output<S>, P>): string | undefined;
  /** One or two sentences that state the main finding; the notes are added after them. */
  alt(c: Drawing<D, z.output<S>, P>, notes: readonly Placed<T>[]): string;
  /** The drawing of one layout. */
  draw(c: Drawing<D, z.output<S>, P>, notes: readonly Placed<T>[], layout: Layout): Body;
}

/** A chart kind, as the pipeline and the tests use it. */
export interface Chart<D extends { kind: string; title: string }, S extends z.ZodObject> {
  /** The chart kind, equal to the dataset's `kind`. */
  name: D['kind'];
  /** Options: a strict object; every field documented and defaulted. */
  options: S;
  /**
   * Draws `data` in both layouts with its alt text and table. `options` are
   * parsed with `options` (defaults filled, unknown keys rejected); notes the
   * chart cannot draw are listed in `skippedNotes`, with why in `notes`.
   */
  render(data: D, options?: z.input<S>, theme?: Theme, notes?: readonly PinnedNote[]): ChartOutput;
}

/** The kind of data a chart draws. */
export type DataOf<C> = C extends Chart<infer D, z.ZodObject> ? D : never;

/** Options that do not fit a chart's schema: the message names each option at fault and what it takes. */
export class ChartOptionsError extends Error {
  constructor(kind: string, messages: string[]) {
    super(`options of the "${kind}" chart: ${messages.join('; ')}`);
    this.name = 'ChartOptionsError';
  }
}

/** Parses options strictly, or throws a `ChartOptionsError` that says, for each fault, the option, what is wrong and what it takes. */
export function parseOptions<S extends z.ZodObject>(kind: string, schema: S, input: unknown): z.output<S> {
  const done = schema.safeParse(input ?? {});
  if (done.success) return done.data;
  const shape = schema.shape as Record<string, z.ZodType>;
  const known = Object.keys(shape).join(', ');
  const messages = done.error.issues.map((issue) => {
    if (issue.code === 'unrecognized_keys') return `unknown option${issue.keys.length > 1 ? 's' : ''} ${issue.keys.map((k) => `"${k}"`).join(', ')} (the options are: ${known})`;
    const key = String(issue.path[0] ?? '');
    const about = shape[key]?.description;
    return `"${key}": ${issue.message}${about ? ` (${about})` : ''}`;
  });
  throw new ChartOptionsError(kind, messages);
}

/** Defines a chart kind from what only it knows; the contract does the rest (see the file comment). */
export function defineChart<D extends { kind: string; title: string }, S extends z.ZodObject, P, T extends object>(
  spec: ChartSpec<D, S, P, T>,
): Chart<D, S> {
  const render = (data: D, options: z.input<S> = {} as z.input<S>, theme: Theme = defaultTheme, notes: readonly PinnedNote[] = []): ChartOutput => {
    const opts = parseOptions(spec.name, spec.options, options);
    const id = chartId(spec.name, (opts as { id?: string }).id, data, opts, notes);
    const c: Drawing<D, z.output<S>, P> = { data, opts, theme, prep: spec.prepare(data, opts, theme) };
    const table = spec.table(c);
    const reason = spec.empty(c);

    const placed: Placed<T>[] = [];
    const taken = new Set<string | number>();
    const outcomes: NoteOutcome[] = notes.map((note) => {
      const target = spec.place(note.at, c);
      const words = spec.words?.(note.at, c);
      const outcome = (placedAs: NoteOutcome['placed']): NoteOutcome => (words === undefined ? { label: note.label, placed: placedAs } : { label: note.label, placed: placedAs, words });
      if (target === 'beside' || target === 'absent') return outcome(target);
      if (reason) return outcome('beside');
      if (spec.slot) {
        const slot = spec.slot(target);
        if (taken.has(slot)) return outcome('beside');
        taken.add(slot);
      }
      placed.push({ ...target, note });
      return outcome('drawn');
    });
    const skippedNotes = outcomes.filter((o) => o.placed !== 'drawn').map((o) => o.label);

    if (reason) {
      const alt = `No data to draw: ${reason}`;
      return {
        svg: emptyChart(spec.name, id, data.title, reason, theme, theme.widths.wide),
        svgNarrow: emptyChart(spec.name, `${id}-n`, data.title, reason, theme, theme.widths.narrow),
        alt,
        summary: alt,
        table,
        notes: outcomes,
        skippedNotes,
      };
    }
    const summary = spec.alt(c, placed);
    const alt = placed.length ? `${summary} ${noteSentences(placed.map((p) => p.note))}` : summary;
    const layout = (width: number, narrow: boolean, svgId: string) => {
      const { body, height } = spec.draw(c, placed, { width, narrow });
      return frame({ kind: spec.name, id: svgId, width, height, title: data.title, desc: alt, theme, body });
    };
    return {
      svg: layout(theme.widths.wide, false, id),
      svgNarrow: layout(theme.widths.narrow, true, `${id}-n`),
      alt,
      summary,
      table,
      notes: outcomes,
      skippedNotes,
    };
  };
  return { name: spec.name, options: spec.options, render };
}

/* ---------- reading a note's target (for the kinds' `place`) ---------- */

/** Whether a target is in the dataset's own terms (rather than a chapter, character, word or segment). */
export function isDataAt(at: NoteAt): at is DataAt {
  return !('chapter' in at || 'character' in at || 'word' in at || 'segment' in at);
}

/**
 * Whether a string is one of the names a target goes by, for kinds that find
 * things by name: a character's cast id and name; a word in lower case and as
 * typed. Null for chapters and segments, which are not found by name.
 */
export function namedAs(at: TextAt): ((s: string | undefined) => boolean) | null {
  const names = 'character' in at ? [at.character, at.name] : 'word' in at ? [at.word.toLowerCase(), at.word] : null;
  return names && ((s) => s !== undefined && names.includes(s));
}

/** The first of `items` that a character or word names, by any of the names `names` gives for an item; none for chapters and segments. */
export function findNamed<T>(at: TextAt, items: readonly T[], names: (item: T) => readonly (string | undefined)[]): T | undefined {
  const has = namedAs(at);
  return has ? items.find((x) => names(x).some(has)) : undefined;
}

/** Whether `text` holds `word` (a word or phrase) as a whole word, ignoring case. */
export function holdsWord(text: string, word: string): boolean {
  const w = word.toLowerCase().replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  return new RegExp(`(^|[^\\p{L}])${w}($|[^\\p{L}])`, 'iu').test(text);
}

/** The `id` option every chart kind takes. */
export const idOption = z
  .string()
  .regex(/^[A-Za-z][A-Za-z0-9_-]*$/, 'an id starts with a letter and holds only letters, digits, "-" and "_"')
  .optional()
  .describe('Base of the ids of the chart\'s <title> and <desc> ("<id>-title", "<id>-desc"). Default: "vt-<kind>-<hash of data, options and notes>".');

/** The base id of a chart: the `id` option, or a hash of everything that shapes the drawing. */
export function chartId(kind: string, explicit: string | undefined, ...inputs: unknown[]): string {
  if (explicit) return explicit;
  return `vt-${kind}-${hashString(JSON.stringify([kind, ...inputs]))}`;
}

export interface FrameArgs {
  kind: string;
  id: string;
  width: number;
  height: number;
  title: string;
  desc: string;
  theme: Theme;
  /** Markup of the drawing, placed inside the root `<g>` after the paper. */
  body: string;
}

/** The SVG root: `<title>`, `<desc>`, then one root `<g>` holding the paper and the drawing. */
export function frame(a: FrameArgs): string {
  const { id, theme } = a;
  const root = el(
    'g',
    {
      class: 'vt-chart-body',
      fill: theme.ink,
      style: `font-family:${theme.fonts.sans};font-size:${theme.sizes.label}px`,
    },
    [el('rect', { class: 'vt-paper', width: a.width, height: a.height, fill: theme.paper }), a.body],
  );
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${a.width} ${a.height}" role="img"` +
    ` aria-labelledby="${escapeXml(id)}-title ${escapeXml(id)}-desc" data-chart="${escapeXml(a.kind)}" class="vt-chart">` +
    `<title id="${escapeXml(id)}-title">${escapeXml(a.title)}</title>` +
    `<desc id="${escapeXml(id)}-desc">${escapeXml(a.desc)}</desc>` +
    root +
    `</svg>`
  );
}

/** A panel that says there is nothing to draw, and why, instead of a chart. */
export function emptyChart(kind: string, id: string, title: string, reason: string, theme: Theme, width: number): string {
  const height = Math.round(width / 4);
  const body = el('g', { class: 'vt-empty' }, [
    el('rect', {
      x: 8,
      y: 8,
      width: width - 16,
      height: height - 16,
      fill: 'none',
      stroke: theme.rule,
      'stroke-width': 1,
    }),
    textEl('No data to draw', {
      x: width / 2,
      y: height / 2 - 4,
      'text-anchor': 'middle',
      'font-size': theme.sizes.axisTitle + 2,
      style: serifStyle(theme, true),
      fill: theme.ink,
    }),
    textEl(truncateText(upperFirst(reason), width - 40, theme.sizes.small), {
      x: width / 2,
      y: height / 2 + theme.sizes.small + 8,
      'text-anchor': 'middle',
      'font-size': theme.sizes.small,
      fill: theme.inkMuted,
    }),
  ]);
  return frame({ kind, id, width, height, title, desc: `No data to draw: ${reason}`, theme, body });
}
