/**
 * Build the text model from a decoded source string: normalise line ends,
 * trim by markers, find headings and paragraphs, split sentences, tokenise.
 *
 * Headings (chapter and part lines and their title lines) are not paragraphs.
 * Paragraphs, sentences and tokens cover chapter bodies only: text before the
 * first chapter heading, or between a part heading and its first chapter, is
 * listed in `skipped`. A sentence holds at least one word token.
 */

import { createHash } from 'node:crypto';
import type { Chapter, HeadingReport, Part, TextModel, TextOptions, TextRange, TextWarning, TrimmedLines } from './model.ts';
import { TOKEN_FLAGS } from './model.ts';
import { u32Buffer } from './columns.ts';
import { normalise } from './normalise.ts';
import { splitSentences } from './sentences.ts';
import { findStructure, type Unit } from './structure.ts';
import { nextWord, vocabForm, wordFlags, type Span } from './tokens.ts';
import { trimByMarkers } from './trim.ts';
import { wording } from '../problems/problem.ts';

/** Title of the single implicit chapter of a text without headings. */
export const WHOLE_TEXT_TITLE = 'Whole text';

function compilePattern(source: string | undefined, id: string, warnings: TextWarning[]): RegExp | undefined {
  if (source === undefined || source === '') return undefined;
  for (const flags of ['iu', 'i']) {
    try {
      return new RegExp(source, flags);
    } catch {
      // try the next flags
    }
  }
  warnings.push(wording('text/bad-chapter-pattern', { id, pattern: source }));
  return undefined;
}

export function buildTextModel(source: string, options: TextOptions): TextModel {
  const warnings: TextWarning[] = [];
  const hash = createHash('sha256').update(source, 'utf8').digest('hex');
  const norm = normalise(source);
  const trim = trimByMarkers(norm.text, options.start, options.end, norm.position, options.id);
  warnings.push(...trim.warnings);
  const base = trim.start;
  const text = norm.text.slice(trim.start, trim.end);
  const clamp = (o: number): number => (o < 0 ? 0 : o > text.length ? text.length : o);
  const sourceOffset = (o: number): number => norm.sourceOffset(clamp(o) + base);
  const position = (o: number): { line: number; column: number } => norm.position(clamp(o) + base);

  const lastLine = norm.position(Math.max(0, norm.text.length - 1)).line;
  const trimmed: { front?: TrimmedLines; back?: TrimmedLines } = {};
  if (trim.front && trim.front.end > 0) {
    trimmed.front = { from: 1, to: norm.position(trim.front.end - 1).line, marker: trim.front.marker, automatic: trim.front.automatic };
  }
  if (trim.back) {
    trimmed.back = { from: norm.position(trim.back.start).line, to: lastLine, marker: trim.back.marker, automatic: trim.back.automatic };
  }

  const pattern = compilePattern(options.chapterPattern, options.id, warnings);
  const { units, patternMatches, taken, rejected } = findStructure(text, { chapterPattern: pattern });
  const headings: HeadingReport = {
    taken: taken.map((h) => ({ line: position(h.at).line, text: h.text, title: h.title, level: h.level })),
    rejected: rejected.map((r) => ({ line: position(r.at).line, text: r.text, reason: r.reason })),
  };
  const hasChapters = units.some((u) => u.t === 'heading' && u.kind === 'chapter');
  if (pattern && patternMatches === 0) {
    warnings.push(wording('text/chapter-pattern-unmatched', { id: options.id, pattern: options.chapterPattern!, parts: hasChapters }));
  }

  const model = assemble(text, units, hasChapters, position);
  if (model.tokens.count === 0) {
    warnings.push(wording('text/empty', { id: options.id, markers: !!(options.start || options.end) }));
  }
  return { id: options.id, hash, text, ...model, sourceOffset, position, warnings, headings, trimmed };
}

type Assembled = Pick<TextModel, 'chapters' | 'paragraphs' | 'sentences' | 'tokens' | 'vocab' | 'skipped' | 'parts'>;

/** Token columns filled in place: one capacity check per token, trimmed at the end. */
function tokenStore(capacity: number) {
  let cap = Math.max(1024, capacity);
  let start = new Uint32Array(cap);
  let end = new Uint32Array(cap);
  let sentence = new Uint32Array(cap);
  let paragraph = new Uint32Array(cap);
  let chapter = new Uint32Array(cap);
  let type = new Uint32Array(cap);
  let flags = new Uint8Array(cap);
  const grow32 = (a: Uint32Array<ArrayBuffer>): Uint32Array<ArrayBuffer> => {
    const b = new Uint32Array(cap);
    b.set(a);
    return b;
  };
  const store = {
    count: 0,
    push(s: number, e: number, si: number, pi: number, ci: number, t: number, f: number): void {
      const n = store.count;
      if (n === cap) {
        cap *= 2;
        start = grow32(start);
        end = grow32(end);
        sentence = grow32(sentence);
        paragraph = grow32(paragraph);
        chapter = grow32(chapter);
        type = grow32(type);
        const fl = new Uint8Array(cap);
        fl.set(flags);
        flags = fl;
      }
      start[n] = s;
      end[n] = e;
      sentence[n] = si;
      paragraph[n] = pi;
      chapter[n] = ci;
      type[n] = t;
      flags[n] = f;
      store.count = n + 1;
    },
    columns(): TextModel['tokens'] {
      const n = store.count;
      return {
        count: n, start: start.slice(0, n), end: end.slice(0, n), sentence: sentence.slice(0, n), paragraph: paragraph.slice(0, n),
        chapter: chapter.slice(0, n), type: type.slice(0, n), flags: flags.slice(0, n),
      };
    },
  };
  return store;
}

/**
 * Where chapter numbers restart in each part, "Chapter I" names several
 * chapters: each chapter in a part then carries its part's heading in its
 * title ("Book Two, Chapter I"), so that charts, tables and notes can tell
 * them apart. Titles that are already unique are left as they are.
 */
function nameChaptersWithinParts(chapters: Chapter[], parts: Part[]): void {
  if (parts.length === 0) return;
  const seen = new Set<string>();
  let repeated = false;
  for (const c of chapters) {
    if (seen.has(c.title)) repeated = true;
    seen.add(c.title);
  }
  if (!repeated) return;
  for (const c of chapters) {
    if (c.partIndex === null) continue;
    const part = parts[c.partIndex]!.title;
    const colon = part.indexOf(': ');
    c.title = `${colon > 0 ? part.slice(0, colon) : part}, ${c.title}`;
  }
}

function assemble(text: string, units: Unit[], hasChapters: boolean, position: (o: number) => { line: number; column: number }): Assembled {
  const p = { start: u32Buffer(), end: u32Buffer(), chapter: u32Buffer(), line: u32Buffer() };
  const sentenceEstimate = Math.ceil(text.length / 80);
  const s = {
    start: u32Buffer(sentenceEstimate), end: u32Buffer(sentenceEstimate), paragraph: u32Buffer(sentenceEstimate),
    firstToken: u32Buffer(sentenceEstimate), tokenCount: u32Buffer(sentenceEstimate),
  };
  const t = tokenStore(Math.ceil(text.length / 5.5));
  const vocab: string[] = [];
  const vocabIndex = new Map<string, number>();
  /** Surface form → type * 8 + flags. */
  const surface = new Map<string, number>();
  const chapters: Chapter[] = [];
  const span: Span = { start: 0, end: 0 };
  const pendingSentences: number[] = [];

  let current: Chapter | null = null;
  const parts: Part[] = [];
  /** The part the next chapter belongs to (null outside parts). */
  let part: Part | null = null;

  const open = (title: string, heading: string | null, line: number, at: number, inPart: Part | null): Chapter => ({
    index: chapters.length, title, heading, part: inPart ? inPart.title : null,
    partIndex: inPart ? inPart.index : null, numberInPart: inPart ? inPart.chapterCount + 1 : null,
    line, start: at, end: at,
    firstParagraph: p.start.length, paragraphCount: 0,
    firstSentence: s.start.length, sentenceCount: 0,
    firstToken: t.count, tokenCount: 0,
  });
  const close = (): void => {
    if (!current) return;
    current.paragraphCount = p.start.length - current.firstParagraph;
    current.sentenceCount = s.start.length - current.firstSentence;
    current.tokenCount = t.count - current.firstToken;
    if (current.paragraphCount > 0) {
      current.start = p.start.get(current.firstParagraph);
      current.end = p.end.get(p.start.length - 1);
    }
    chapters.push(current);
    if (current.partIndex !== null) parts[current.partIndex]!.chapterCount++;
    current = null;
  };

  const typeInfo = (w: string): number => {
    let info = surface.get(w);
    if (info === undefined) {
      const form = vocabForm(w);
      let type = vocabIndex.get(form);
      if (type === undefined) {
        type = vocab.length;
        vocab.push(form);
        vocabIndex.set(form, type);
      }
      info = type * 8 + wordFlags(w);
      surface.set(w, info);
    }
    return info;
  };

  const addParagraph = (ch: Chapter, ps: number, pe: number): void => {
    const pi = p.start.length;
    p.start.push(ps);
    p.end.push(pe);
    p.chapter.push(ch.index);
    p.line.push(position(ps).line);
    pendingSentences.length = 0;
    splitSentences(text, ps, pe, (a, b) => pendingSentences.push(a, b));
    let from = ps;
    for (let k = 0; k < pendingSentences.length; k += 2) {
      const se = pendingSentences[k + 1];
      const first = t.count;
      const si = s.start.length;
      let initial: number = TOKEN_FLAGS.sentenceInitial;
      while (nextWord(text, from, se, span)) {
        const info = typeInfo(text.slice(span.start, span.end));
        t.push(span.start, span.end, si, pi, ch.index, Math.floor(info / 8), (info & 7) | initial);
        initial = 0;
        from = span.end;
      }
      from = se;
      const count = t.count - first;
      if (count > 0) {
        s.start.push(pendingSentences[k]);
        s.end.push(se);
        s.paragraph.push(pi);
        s.firstToken.push(first);
        s.tokenCount.push(count);
      }
    }
  };
  if (!hasChapters) {
    const firstPara = units.find((u) => u.t === 'para');
    current = open(WHOLE_TEXT_TITLE, null, firstPara ? position(firstPara.start).line : 1, 0, null);
  }
  const outside: Array<TextRange & { lastUnit: number }> = [];
  for (let ui = 0; ui < units.length; ui++) {
    const u = units[ui];
    if (u.t === 'heading') {
      close();
      if (u.kind === 'part') {
        part = { index: parts.length, title: u.title, heading: u.heading, line: position(u.start).line, firstChapter: chapters.length, chapterCount: 0 };
        parts.push(part);
      } else {
        // A prologue, epilogue or interlude stands outside the parts; the next numbered chapter returns to the open part.
        current = open(u.title, u.heading, position(u.start).line, u.end, u.extra ? null : part);
        if (part && !u.extra && part.chapterCount === 0) part.firstChapter = chapters.length;
      }
      continue;
    }
    if (u.t === 'matter') {
      close();
      outside.push({ start: u.start, end: u.end, line: position(u.start).line, lastUnit: ui });
      continue;
    }
    if (current) {
      addParagraph(current, u.start, u.end);
      continue;
    }
    const last = outside[outside.length - 1];
    if (last && last.lastUnit === ui - 1) {
      last.end = u.end;
      last.lastUnit = ui;
    } else {
      outside.push({ start: u.start, end: u.end, line: position(u.start).line, lastUnit: ui });
    }
  }
  close();
  nameChaptersWithinParts(chapters, parts);

  return {
    chapters,
    paragraphs: { count: p.start.length, start: p.start.toArray(), end: p.end.toArray(), chapter: p.chapter.toArray(), line: p.line.toArray() },
    sentences: {
      count: s.start.length, start: s.start.toArray(), end: s.end.toArray(), paragraph: s.paragraph.toArray(),
      firstToken: s.firstToken.toArray(), tokenCount: s.tokenCount.toArray(),
    },
    tokens: t.columns(),
    vocab,
    skipped: outside.map(({ start, end, line }) => ({ start, end, line })),
    parts,
  };
}
