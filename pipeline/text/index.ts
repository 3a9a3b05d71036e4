/** The text model: decoding, building, cast mentions. */
export * from './model.ts';
export { decodeText, firstInvalidByte, type DecodeProblem, type DecodeResult } from './decode.ts';
export { buildTextModel, WHOLE_TEXT_TITLE } from './build.ts';
export { findMentions, derivedNames } from './mentions.ts';
export { tokenise, vocabForm, type Span } from './tokens.ts';
