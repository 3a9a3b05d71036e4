/**
 * The edition stage: each text's reading edition (edition/edition.ts), kept in
 * the result cache by the text's hash and reading options like a measure, and
 * what the other stages ask of it: where a table row's places and a note's
 * segment stand in it, and which segment holds a paragraph.
 */
import { z } from 'zod';
import type { ResultCache } from '../cache/cache.ts';
import { cacheKey } from '../cache/cache.ts';
import type { Table } from '../charts/types.ts';
import type { Edition, Passage } from '../edition/edition.ts';
import { buildEdition, EDITION_VERSION, paragraphAt, passageOfSegment, passageOfToken } from '../edition/edition.ts';
import type { TextOptions } from '../text/model.ts';
import type { ReadText } from './read-text.ts';
import type { NoteFacts } from './notes.ts';
import { equalSegments } from '../stats/windows.ts';

/** What is read back of a cached edition; anything else is built again. */
const editionShape = z.object({
  words: z.number(),
  parts: z.array(z.object({ title: z.string(), firstChapter: z.number(), chapters: z.number() })),
  chapters: z.array(
    z.object({
      number: z.number(),
      title: z.string(),
      token: z.number(),
      paragraphs: z.array(z.object({ n: z.number(), token: z.number(), tokens: z.number(), form: z.string(), content: z.array(z.unknown()) })),
    }),
  ),
  trimmed: z.object({}).passthrough(),
});

/** The reading edition of a text, from the cache or built from its model. */
export function editionOf(text: ReadText, options: TextOptions, cache: ResultCache): Edition {
  return cache.get(
    cacheKey({ textHash: text.hash, textOptions: options, measure: 'edition', version: EDITION_VERSION, params: {}, cast: null, language: '' }),
    () => buildEdition(text.open().model),
    (value) => {
      const r = editionShape.safeParse(value);
      return r.success ? null : `${r.error.issues[0]!.path.join('.') || 'the value'}: ${r.error.issues[0]!.message}`;
    },
  );
}

/** Each table row's places as paragraphs of the edition (each paragraph once, in text order); null when the table has no places. */
export function tablePassages(table: Table, edition: Edition): (Passage[] | null)[] | null {
  if (!table.places) return null;
  return table.places.map((tokens) => {
    if (!tokens) return null;
    const seen = new Set<string>();
    const out: Passage[] = [];
    for (const t of [...tokens].sort((a, b) => a - b)) {
      const p = passageOfToken(edition, t);
      if (!p || seen.has(`${p.chapter}.${p.paragraph}`)) continue;
      seen.add(`${p.chapter}.${p.paragraph}`);
      out.push(p);
    }
    return out;
  });
}

/** What the notes stage reads of the edition: paragraphs per chapter, and segments against paragraphs. */
export function editionFacts(edition: Edition): Pick<NoteFacts, 'segmentPassage' | 'segmentOfPassage'> & { paragraphs: number[] } {
  return {
    paragraphs: edition.chapters.map((c) => c.paragraphs.length),
    segmentPassage: (segment, of) => passageOfSegment(edition, segment, of),
    segmentOfPassage: (at, of) => {
      const p = paragraphAt(edition, at);
      if (!p || p.tokens === 0) return null;
      const k = equalSegments(edition.words, of).findIndex(([a, b]) => p.token >= a && p.token < b);
      return k < 0 ? null : k + 1;
    },
  };
}
