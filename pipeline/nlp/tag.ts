/**
 * Part-of-speech tags and lemmas for every token of a text model, from wink-nlp
 * with its English model, aligned to our tokens by character offsets.
 *
 * - The text is read chapter by chapter, in chunks of whole sentences of about
 *   `CHUNK_CHARACTERS` characters (one wink document per chunk; the model is
 *   loaded once per process, see `wink.ts`), so memory stays bounded on long texts.
 * - A token of ours that wink splits takes the tag of wink's first part:
 *   "don't" → "do" (AUX), "Hale's" → "Hale" (PROPN), "well-kept" → "well" (ADV).
 * - Its lemma: wink's lemma when both read the same span ("walked" → "walk");
 *   the first part's lemma when the rest is a clitic ('s, n't, 'll, 'd, 've,
 *   're, 'm: "don't" → "do"); otherwise our own lower-cased form ("well-kept",
 *   and "Mrs" where wink reads "Mrs." as one token). A possessive 's left on a
 *   lemma is removed ("brother's" → "brother"). Wink's lemmas follow American
 *   spelling ("colour" → "color", "grey" → "gray").
 * - A token no wink token covers (none seen in practice) is tagged X, its form as lemma.
 * - Results are memoised per model object.
 */
import type { ItsFunction } from 'wink-nlp';
import type { TextModel } from '../text/model.ts';
import { vocabForm } from '../text/tokens.ts';
import { align } from './align.ts';
import { UPOS_ID, uposId } from './upos.ts';
import { wink } from './wink.ts';

export interface TokenTags {
  /** UPOS id of each token of the model (index into `UPOS`). */
  pos: Uint8Array;
  /** Lemma id of each token of the model (index into `lemmas`). */
  lemma: Uint32Array;
  /** Lemmas, lower-cased, apostrophes as in the model's vocabulary ('). */
  lemmas: string[];
}

/**
 * Characters of text per wink document (cut at a sentence end). Small
 * documents are cheaper for wink per token than one large one (measured on a
 * 4.4-million-character text: 10,000–30,000 characters per document took
 * 55–75 % of the CPU time of a single document).
 */
export const CHUNK_CHARACTERS = 20_000;

/** A stretch of whole sentences of one chapter, read as one wink document. */
export interface Chunk {
  /** Character range in the model's text. */
  start: number;
  end: number;
  /** Token range [firstToken, endToken). */
  firstToken: number;
  endToken: number;
}

/** The model's sentences grouped into chunks of about `size` characters, never across a chapter heading. */
export function sentenceChunks(model: TextModel, size = CHUNK_CHARACTERS): Chunk[] {
  const { sentences, chapters } = model;
  const out: Chunk[] = [];
  for (const chapter of chapters) {
    const last = chapter.firstSentence + chapter.sentenceCount;
    let s = chapter.firstSentence;
    while (s < last) {
      const start = sentences.start[s]!;
      let e = s + 1;
      while (e < last && sentences.end[e - 1]! - start < size) e++;
      const firstToken = sentences.firstToken[s]!;
      const endToken = sentences.firstToken[e - 1]! + sentences.tokenCount[e - 1]!;
      if (endToken > firstToken) out.push({ start, end: sentences.end[e - 1]!, firstToken, endToken });
      s = e;
    }
  }
  return out;
}

const memo = new WeakMap<TextModel, TokenTags>();

/** The tags of a model's tokens, computed on first request and memoised per model. */
export function tagModel(model: TextModel): TokenTags {
  let tags = memo.get(model);
  if (!tags) {
    tags = computeTags(model);
    memo.set(model, tags);
  }
  return tags;
}

const CLITIC = /^(?:n['’]t|['’](?:s|d|ll|ve|re|m))$/i;

function computeTags(model: TextModel): TokenTags {
  const { tokens, vocab, text } = model;
  const pos = new Uint8Array(tokens.count).fill(UPOS_ID.X);
  const lemma = new Uint32Array(tokens.count);
  const lemmas: string[] = [];
  const lemmaIndex = new Map<string, number>();
  const lemmaId = (s: string): number => {
    let id = lemmaIndex.get(s);
    if (id === undefined) {
      id = lemmas.length;
      lemmas.push(s);
      lemmaIndex.set(s, id);
    }
    return id;
  };
  // Lemma of a token read by its own form, per vocabulary type.
  const formLemma = new Int32Array(vocab.length).fill(-1);
  const ofForm = (type: number): number => {
    let id = formLemma[type]!;
    if (id < 0) formLemma[type] = id = lemmaId(vocab[type]!);
    return id;
  };
  // Lemma from wink, per (type, tag, split), asked of wink only once.
  const winkLemma = new Map<number, number>();
  const { nlp, its } = wink();

  for (const { start: chunkStart, end: chunkEnd, firstToken, endToken } of sentenceChunks(model)) {
    const chunk = text.slice(chunkStart, chunkEnd);
    const doc = nlp.readDoc(chunk);
    const winkTokens = doc.tokens();
    const values = winkTokens.out(its.value) as string[];
    const tags = winkTokens.out(its.pos) as string[];
    const count = values.length;
    const wStart = new Uint32Array(count);
    const wEnd = new Uint32Array(count);
    locate(chunk, values, chunkStart, wStart, wEnd);
    const a = align(tokens.start, tokens.end, firstToken, endToken, wStart, wEnd, count);

    for (let k = firstToken; k < endToken; k++) {
      const o = k - firstToken;
      const type = tokens.type[k]!;
      const f = a.first[o]!;
      if (f < 0) {
        lemma[k] = ofForm(type);
        continue;
      }
      const tag = uposId(tags[f]);
      pos[k] = tag;
      const parts = a.parts[o]!;
      const exact = parts === 1 && a.partStart[o] === tokens.start[k] && a.partEnd[o] === tokens.end[k];
      const clitic = parts > 1 && f + 1 < count && CLITIC.test(values[f + 1]!);
      if (!exact && !clitic) {
        lemma[k] = ofForm(type);
        continue;
      }
      const key = (type * 32 + tag) * 2 + (clitic ? 1 : 0);
      let id = winkLemma.get(key);
      if (id === undefined) {
        const l = winkTokens.itemAt(f).out(its.lemma as ItsFunction<string>) as string | undefined;
        id = l ? lemmaId(possessiveStripped(vocabForm(l))) : ofForm(type);
        winkLemma.set(key, id);
      }
      lemma[k] = id;
    }
  }
  return { pos, lemma, lemmas };
}

/**
 * "brother's" → "brother". Wink splits a possessive it has not met before
 * ("brother" + "'s") but reads it whole once it has learnt it (see `wink.ts`),
 * lemma and all; stripping the ending gives the same lemma either way.
 */
function possessiveStripped(lemma: string): string {
  return lemma.length > 2 && lemma.endsWith("'s") ? lemma.slice(0, -2) : lemma;
}

/**
 * Character ranges (offset by `base`) of wink's tokens in `chunk`. Wink keeps
 * every character of a token's value, so each value is found at the cursor
 * after skipping white space; its own white-space tokens get an empty range.
 */
function locate(chunk: string, values: string[], base: number, start: Uint32Array, end: Uint32Array): void {
  let c = 0;
  for (let j = 0; j < values.length; j++) {
    const v = values[j]!;
    if (v.length === 0 || isSpace(v.charCodeAt(0))) {
      start[j] = end[j] = base + c;
      continue;
    }
    while (c < chunk.length && isSpace(chunk.charCodeAt(c))) c++;
    let at = c;
    if (!chunk.startsWith(v, c)) {
      const found = chunk.indexOf(v, c);
      // Not found nearby: leave the token unplaced rather than jump ahead.
      if (found < 0 || found - c > 64) {
        start[j] = end[j] = base + c;
        continue;
      }
      at = found;
    }
    start[j] = base + at;
    end[j] = base + at + v.length;
    c = at + v.length;
  }
}

function isSpace(c: number): boolean {
  return (
    c === 32 ||
    (c >= 9 && c <= 13) ||
    c === 0xa0 ||
    c === 0x1680 ||
    (c >= 0x2000 && c <= 0x200a) ||
    c === 0x2028 ||
    c === 0x2029 ||
    c === 0x202f ||
    c === 0x205f ||
    c === 0x3000 ||
    c === 0xfeff
  );
}
