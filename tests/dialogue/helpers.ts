import { buildTextModel } from '../../pipeline/text/build.ts';
import { findMentions } from '../../pipeline/text/mentions.ts';
import type { CastMember } from '../../pipeline/text/model.ts';
import type { DialogueSettings, MeasureContext } from '../../pipeline/measures/types.ts';
import { analyseDialogue, type AttributedQuote } from '../../pipeline/dialogue/attribute.ts';

/** A measure context for an invented text. */
export function context(text: string, cast: CastMember[] = [], dialogue?: DialogueSettings): MeasureContext {
  const model = buildTextModel(text, { id: 'dialogue-test' });
  return { model, cast, mentions: findMentions(model, cast), language: 'en', ...(dialogue ? { dialogue } : {}) };
}

/** The attributed quotations of an invented text. */
export function quotesOf(text: string, cast: CastMember[] = [], dialogue?: DialogueSettings): AttributedQuote[] {
  return analyseDialogue(context(text, cast, dialogue)).quotes;
}

/** The quotation whose words start with `start`. */
export function quote(quotes: readonly AttributedQuote[], start: string): AttributedQuote {
  const q = quotes.find((x) => x.text.startsWith(start));
  if (!q) throw new Error(`no quotation starts with "${start}"; found: ${quotes.map((x) => x.text).join(' | ')}`);
  return q;
}

/** An invented cast used across the tests. */
export const CAST: CastMember[] = [
  { id: 'ada', name: 'Ada Fenn', aliases: [], pronoun: 'she' },
  { id: 'hollis', name: 'Hollis Fenn', aliases: [], pronoun: 'he' },
  { id: 'osric', name: 'Osric Dunn', aliases: ['the ferryman'], pronoun: 'he' },
  { id: 'mabel', name: 'Mabel Pryor', aliases: [], pronoun: 'she' },
];
