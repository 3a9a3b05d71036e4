/**
 * Where the conversation source gets its turns of speech: the dialogue
 * reader's turns, each with a speaker and an addressee (cast ids, or null
 * when not known well enough). A speech spread over several quotations —
 * interrupted by its tag, or running on over paragraphs — is one turn.
 */

import type { MeasureContext } from '../measures/types.ts';
import { analyseDialogue } from '../dialogue/attribute.ts';
import type { QuoteTurn } from './conversation.ts';

/** Reads the turns of speech of a text, or returns null when no dialogue reader is available. */
export type QuoteReader = (ctx: MeasureContext) => readonly QuoteTurn[] | null;

export const readQuotes: QuoteReader = (ctx) => analyseDialogue(ctx).turns;
