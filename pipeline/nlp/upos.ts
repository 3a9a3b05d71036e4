/**
 * Universal part-of-speech tags (Universal Dependencies v2, 17 tags). A tagged
 * token stores its tag as an index into `UPOS`.
 */

export const UPOS = [
  'ADJ',
  'ADP',
  'ADV',
  'AUX',
  'CCONJ',
  'DET',
  'INTJ',
  'NOUN',
  'NUM',
  'PART',
  'PRON',
  'PROPN',
  'PUNCT',
  'SCONJ',
  'SYM',
  'VERB',
  'X',
] as const;

export type Upos = (typeof UPOS)[number];

/** The index of each tag in `UPOS`. */
export const UPOS_ID: Readonly<Record<Upos, number>> = Object.freeze(
  Object.fromEntries(UPOS.map((tag, i) => [tag, i])) as Record<Upos, number>,
);

/** The id of a tag name; `X` (other) for anything that is not a UPOS tag (e.g. a tagger's own SPACE). */
export function uposId(tag: string | undefined): number {
  return tag !== undefined && Object.hasOwn(UPOS_ID, tag) ? UPOS_ID[tag as Upos] : UPOS_ID.X;
}

/** A mask over UPOS ids: 1 for each tag named. */
export function uposMask(tags: readonly string[]): Uint8Array {
  const mask = new Uint8Array(UPOS.length);
  for (const t of tags) mask[uposId(t)] = 1;
  return mask;
}
