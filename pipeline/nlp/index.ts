/** Parts of speech and lemmas from an English language model, aligned to the text model's tokens. */
export { UPOS, UPOS_ID, uposId, uposMask, type Upos } from './upos.ts';
export { isEnglish, requireEnglish, NeedsEnglishModelError } from './english.ts';
export { tagModel, CHUNK_CHARACTERS, type TokenTags } from './tag.ts';
export { align, type Alignment } from './align.ts';
export { wink, winkLoadCount, WINK_PIPE } from './wink.ts';
