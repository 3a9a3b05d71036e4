/** Dialogue: quotations, their speakers and addressees. */
export { findQuotes, type Quote, type QuoteProblem, type QuoteScan } from './quotes.ts';
export { detectConvention, type Convention } from './marks.ts';
export {
  analyseDialogue,
  MIN_CONFIDENCE,
  type AttributedQuote,
  type DialogueAnalysis,
  type DialogueInput,
  type DialogueTurn,
  type Rule,
} from './attribute.ts';
export { checkPins, matchPins, unmatchedPins, type DialoguePin, type PinProblem } from './pins.ts';
export { speechVerbs, SPEECH_VERBS, type VerbList } from './verbs.ts';
export { evaluateText, parseGold, scoreDialogue, type EvalFigures, type GoldRow } from './evaluate.ts';
