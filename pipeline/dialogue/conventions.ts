/**
 * Which marks set off speech, stretch by stretch.
 *
 * Printed books set speech in one of a few ways, and a book may change its
 * way from chapter to chapter (an anthology, a found manuscript, an edition
 * set by several printers) or even within a chapter, from scene to scene:
 *   double      “…” or "…", quotations inside in ‘…’ or '…'
 *   single      ‘…’ or '…', quotations inside in “…” or "…"
 *   guillemets  «…» (French, Italian, Russian, Spanish use; or »…« as in
 *               German and Danish printing, read from the marks' direction)
 *   low         „…“ or „…” (German, Dutch, Polish, Czech, Hungarian use)
 *   dash        a paragraph that opens with a dash (— or –) is speech, as in
 *               many translations and in French, Spanish, Russian, Swedish
 *               printing (see dashes.ts)
 * Whatever convention a stretch uses, the other marks in it are quotations
 * inside speech (or quoted words in the narrative), never speech of their own.
 *
 * Reading the convention: each paragraph that opens with an opening mark is
 * a vote for that mark's convention (an elision such as ’Tis or 'em does not
 * count: see marks.ts). A stretch's votes decide when one convention leads
 * clearly (it has every vote, or at least two and twice as many as the next).
 * The text as a whole is decided first (when it is unclear, the most votes
 * win, then opening marks anywhere, then double); each chapter keeps the
 * text's convention unless its own votes decide otherwise; a chapter printed
 * in scenes (separated by a blank-line ornament — * * *, ⁂, a rule — or by a
 * wider gap than the text's usual one between paragraphs) gives a scene its
 * own convention when the scene has at least two votes and they decide
 * against the chapter's (a chapter whose votes are split between its scenes
 * takes its first deciding scene's). Guillemets read «…» or »…« by the
 * direction of their closing marks, failing those of their opening marks.
 * The plan may fix the convention for the whole text or for single chapters
 * (`dialogue.marks`); a fixed chapter is not split.
 */

import type { TextModel } from '../text/model.ts';
import { DQ, LAQUO, LDQ, LOW_DQ, LSQ, RAQUO, SQ, LEADING_ELISIONS, isSpaceAt, isWordCharAt, wordStartingAt } from './marks.ts';

export type Convention = 'double' | 'single' | 'guillemets' | 'low' | 'dash';

export const CONVENTIONS: readonly Convention[] = ['double', 'single', 'guillemets', 'low', 'dash'];

/** How each convention is named to curators. */
export const CONVENTION_NAMES: Record<Convention, string> = {
  double: 'double marks “…”',
  single: 'single marks ‘…’',
  guillemets: 'guillemets «…»',
  low: 'low-high marks „…“',
  dash: 'dashes opening the paragraph',
};

/** A convention, or "auto" to read it from the marks. */
export type MarksName = Convention | 'auto';

/** The plan's `dialogue.marks`: one name for the whole text, or a default and names for chapters (1-based, as keys). */
export type MarksPlan = MarksName | { default?: MarksName; chapters?: Record<string, MarksName> };

/** The plan's setting, resolved: a convention (or "auto") for the text, and for chapters (1-based) that differ. */
export interface MarksSetting {
  text: MarksName;
  chapters: ReadonlyMap<number, MarksName>;
}

export const AUTO: MarksSetting = { text: 'auto', chapters: new Map() };

/** Resolve the plan's `dialogue.marks` (undefined: read every stretch). */
export function marksSetting(plan: MarksPlan | undefined): MarksSetting {
  if (plan === undefined) return AUTO;
  if (typeof plan === 'string') return { text: plan, chapters: new Map() };
  const chapters = new Map<number, MarksName>();
  for (const [k, v] of Object.entries(plan.chapters ?? {})) chapters.set(Number(k), v);
  return { text: plan.default ?? 'auto', chapters };
}

/** How a stretch's convention was decided. */
export type ConventionSource = 'plan' | 'read' | 'text';

export interface SceneConvention {
  /** Index into `model.paragraphs` of the scene's first paragraph. */
  firstParagraph: number;
  /** One past its last paragraph. */
  endParagraph: number;
  convention: Convention;
  /** plan: fixed by the plan; read: decided by the stretch's own marks; text: taken from the chapter or the text. */
  source: ConventionSource;
  /** Guillemets only: the stretch reads »…« (German and Danish printing) rather than «…». */
  reversed: boolean;
  /** Paragraphs of the stretch that open with each convention's mark. */
  votes: Record<Convention, number>;
}

export interface ChapterConvention {
  /** 0-based chapter. */
  chapter: number;
  convention: Convention;
  source: ConventionSource;
  /** The chapter's scenes, in order; one entry when it has no scene breaks or they all share the chapter's convention. */
  scenes: SceneConvention[];
}

export interface ConventionMap {
  /** The convention of most of the text (its own decision). */
  text: Convention;
  chapters: ChapterConvention[];
  /** Per paragraph: the convention of its stretch. */
  of(paragraph: number): Convention;
  /** Per paragraph: whether its stretch reads guillemets reversed (»…«). */
  reversed(paragraph: number): boolean;
  /** Paragraphs that are scene breaks (an ornament line). */
  breaks: ReadonlySet<number>;
}

const DASHES = /[\u2014\u2013\u2015]/;

/** The convention whose opening mark opens the paragraph text[a, b), or null. `reversed` notes »… openings. */
export function openingVote(text: string, a: number, b: number): { convention: Convention; reversed: boolean } | null {
  const c = text.charCodeAt(a);
  const next = a + 1 < b ? text[a + 1] : '';
  if (next === '' || /\s/.test(next) && c !== LAQUO && c !== RAQUO && !DASHES.test(text[a])) return null;
  if (c === LDQ || c === DQ) return { convention: 'double', reversed: false };
  if (c === LOW_DQ) return { convention: 'low', reversed: false };
  if (c === LAQUO) return { convention: 'guillemets', reversed: false };
  if (c === RAQUO) return { convention: 'guillemets', reversed: true };
  if (c === LSQ || c === SQ) {
    if (!isWordCharAt(text, a + 1) && !/[\u201c"\u2026\u2014.]/.test(next)) return null;
    // ’Tis and 'em are elisions, not openings; a left mark is always an opening in careful printing.
    if (c === SQ && LEADING_ELISIONS.has(wordStartingAt(text, a + 1, b))) return null;
    return { convention: 'single', reversed: false };
  }
  if (DASHES.test(text[a])) {
    // A dash and then the speech: "— Yes," or "—Yes," (not a rule of dashes, not a dash before a digit range).
    let k = a + 1;
    while (k < b && /[ \t\u00a0\u202f]/.test(text[k])) k++;
    if (k < b && /[\p{L}\p{N}¿¡"“‘'«„…]/u.test(text[k])) return { convention: 'dash', reversed: false };
  }
  return null;
}

/**
 * Guillemets in closing position in text[a, b) — after a word or punctuation
 * (a space between allowed, as French printing sets it) and before a space,
 * punctuation or the paragraph's end: » counts +1 («…» printing), « counts −1
 * (»…« printing).
 */
function closingGuillemets(text: string, a: number, b: number): number {
  let n = 0;
  for (let i = a; i < b; i++) {
    const c = text.charCodeAt(i);
    if (c !== LAQUO && c !== RAQUO) continue;
    if (i + 1 < b && /[\p{L}\p{N}]/u.test(text[i + 1])) continue;
    let k = i - 1;
    if (k >= a && /[ \u00a0\u202f]/.test(text[k])) k--;
    if (k < a || /\s/.test(text[k]) || text.charCodeAt(k) === LAQUO || text.charCodeAt(k) === RAQUO) continue;
    n += c === RAQUO ? 1 : -1;
  }
  return n;
}

/** Opening marks anywhere in text[a, b): a mark after a space (or the edge) and before a letter. */
function innerVotes(text: string, a: number, b: number, into: Record<Convention, number>): void {
  for (let i = a; i < b; i++) {
    const c = text.charCodeAt(i);
    if (c !== LDQ && c !== DQ && c !== LSQ && c !== SQ && c !== LOW_DQ && c !== LAQUO) continue;
    if (!isSpaceAt(text, i - 1, a, b) || !isWordCharAt(text, i + 1)) continue;
    if (c === LDQ || c === DQ) into.double++;
    else if (c === LOW_DQ) into.low++;
    else if (c === LAQUO) into.guillemets++;
    else if (c === LSQ || !LEADING_ELISIONS.has(wordStartingAt(text, i + 1, b))) into.single++;
  }
}

const noVotes = (): Record<Convention, number> => ({ double: 0, single: 0, guillemets: 0, low: 0, dash: 0 });

/** The convention a stretch's votes decide, or null when none leads clearly (`min` votes at least). */
export function decide(votes: Record<Convention, number>, min = 1): Convention | null {
  const ranked = CONVENTIONS.map((c) => [c, votes[c]] as const).sort((x, y) => y[1] - x[1]);
  const [top, second] = ranked;
  if (top[1] < min) return null;
  if (second[1] === 0 || (top[1] >= 2 && top[1] >= 2 * second[1])) return top[0];
  return null;
}

/** Whether paragraph text[a, b) is a scene-break ornament: a short line with no letters or digits (* * *, ⁂, ~, a rule). */
export function isOrnament(text: string, a: number, b: number): boolean {
  if (b - a > 40 || b <= a) return false;
  const s = text.slice(a, b);
  return !/[\p{L}\p{N}]/u.test(s) && !/["“”‘’'«»„]/.test(s) && /\S/.test(s);
}

/** Read the convention of every stretch of the text (see the module comment). */
export function readConventions(model: TextModel, setting: MarksSetting = AUTO): ConventionMap {
  const { text, paragraphs, chapters } = model;
  const n = paragraphs.count;
  const vote: ({ convention: Convention; reversed: boolean } | null)[] = new Array(n);
  const breaks = new Set<number>();
  const gaps = new Uint16Array(n);
  const guillemetClosers = new Int32Array(n);
  const gapCount = new Map<number, number>();
  for (let p = 0; p < n; p++) {
    const a = paragraphs.start[p];
    const b = paragraphs.end[p];
    vote[p] = openingVote(text, a, b);
    guillemetClosers[p] = closingGuillemets(text, a, b);
    if (isOrnament(text, a, b)) breaks.add(p);
    if (p > 0 && paragraphs.chapter[p] === paragraphs.chapter[p - 1]) {
      let nl = 0;
      for (let i = paragraphs.end[p - 1]; i < a; i++) if (text.charCodeAt(i) === 10) nl++;
      gaps[p] = Math.min(nl, 65535);
      gapCount.set(gaps[p], (gapCount.get(gaps[p]) ?? 0) + 1);
    }
  }
  // The usual gap between paragraphs; a wider one is a scene break.
  let usual = 2;
  let most = -1;
  for (const [g, k] of gapCount) if (k > most || (k === most && g < usual)) [usual, most] = [g, k];

  const count = (from: number, to: number): { votes: Record<Convention, number>; reversed: boolean; closers: number } => {
    const votes = noVotes();
    let rev = 0;
    let fwd = 0;
    let closers = 0;
    for (let p = from; p < to; p++) {
      closers += guillemetClosers[p];
      const v = vote[p];
      if (!v) continue;
      votes[v.convention]++;
      if (v.convention === 'guillemets') v.reversed ? rev++ : fwd++;
    }
    // Guillemets: the closing marks tell the direction (a French paragraph that goes on from the one before
    // opens with », like a German opening); failing them, the opening ones.
    return { votes, reversed: closers !== 0 ? closers < 0 : rev > fwd, closers };
  };

  // 1. The text.
  const all = count(0, n);
  let textConv = decide(all.votes);
  if (textConv === null) {
    const ranked = CONVENTIONS.filter((c) => all.votes[c] > 0).sort((x, y) => all.votes[y] - all.votes[x]);
    if (ranked.length) textConv = ranked[0];
  }
  if (textConv === null) {
    const inner = noVotes();
    for (let p = 0; p < n; p++) innerVotes(text, paragraphs.start[p], paragraphs.end[p], inner);
    textConv = inner.single > inner.double ? 'single' : inner.low > inner.double ? 'low' : inner.guillemets > inner.double ? 'guillemets' : 'double';
  }
  if (setting.text !== 'auto') textConv = setting.text;

  // 2. Chapters, and 3. their scenes.
  const conv: Convention[] = new Array(n).fill(textConv);
  const rev = new Uint8Array(n);
  const out: ChapterConvention[] = chapters.map((ch) => {
    const from = ch.firstParagraph;
    const to = from + ch.paragraphCount;
    const own = count(from, to);
    const fixed = setting.chapters.get(ch.index + 1) ?? (setting.text !== 'auto' ? setting.text : 'auto');
    // The chapter's scenes, and what each one's own votes decide (at least two of them).
    const ranges: [number, number][] = [];
    let start = from;
    for (let p = from; p <= to; p++) {
      const isBreak = p < to && (breaks.has(p) || (p > from && gaps[p] > usual && gaps[p] >= 3));
      if (p < to && !isBreak) continue;
      if (p > start) ranges.push([start, p]);
      start = breaks.has(p) ? p + 1 : p;
    }
    if (ranges.length === 0) ranges.push([from, to]);
    const counted = ranges.map(([a, b]) => count(a, b));
    const decided = counted.map((c) => (fixed === 'auto' && ranges.length > 1 ? decide(c.votes, 2) : null));
    // A chapter whose votes are split between its scenes takes its first scene's convention.
    const read = fixed === 'auto' ? (decide(own.votes) ?? decided.find((d) => d !== null) ?? null) : null;
    const chapterConv: Convention = fixed !== 'auto' ? fixed : (read ?? textConv);
    const source: ConventionSource = fixed !== 'auto' ? 'plan' : read !== null ? 'read' : 'text';
    const reversed = own.votes.guillemets > 0 || own.closers !== 0 ? own.reversed : all.reversed;
    const scenes: SceneConvention[] = ranges.map(([a, b], k) => {
      const mine = decided[k];
      const differs = mine !== null && mine !== chapterConv;
      const sc = counted[k];
      return {
        firstParagraph: a,
        endParagraph: b,
        convention: differs ? mine : chapterConv,
        source: differs ? 'read' : source,
        reversed: sc.votes.guillemets > 0 || sc.closers !== 0 ? sc.reversed : reversed,
        votes: sc.votes,
      };
    });
    for (const s of scenes) {
      for (let p = s.firstParagraph; p < s.endParagraph; p++) {
        conv[p] = s.convention;
        rev[p] = s.reversed ? 1 : 0;
      }
    }
    // Scenes that share the chapter's convention are one stretch as far as curators are concerned.
    const merged: SceneConvention[] = [];
    for (const s of scenes) {
      const last = merged[merged.length - 1];
      if (last && last.convention === s.convention && last.reversed === s.reversed) {
        last.endParagraph = s.endParagraph;
        for (const c of CONVENTIONS) last.votes[c] += s.votes[c];
      } else merged.push({ ...s, votes: { ...s.votes } });
    }
    return { chapter: ch.index, convention: chapterConv, source, scenes: merged };
  });
  return { text: textConv, chapters: out, of: (p) => conv[p] ?? textConv, reversed: (p) => rev[p] === 1, breaks };
}
