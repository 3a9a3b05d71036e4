/**
 * Curator pins: "the quotation in chapter N that starts with these words is
 * spoken by X (to Y)". A pin matches the first quotation of its chapter whose
 * words, compared without case, quotation marks, apostrophe style or runs of
 * white space, start with the pin's words. It overrides every other rule
 * (rule "pin") for the whole turn that quotation belongs to, and makes a
 * quotation read as written words into speech.
 */

import type { CastMember, TextModel } from '../text/model.ts';
import type { DialogueSettings } from '../measures/types.ts';
import { findQuotes, type Quote } from './quotes.ts';
import { marksSetting } from './conventions.ts';

export type DialoguePin = DialogueSettings['pins'][number];

/** Lower case, one kind of apostrophe, no quotation marks, single spaces, no leading punctuation. */
export function pinForm(s: string): string {
  return s
    .toLowerCase()
    .replace(/[\u2018\u2019\u201a\u02bc`]/g, "'")
    .replace(/[\u201c\u201d\u201e"\u00ab\u00bb\u2039\u203a]/g, '')
    .replace(/\s+/g, ' ')
    .replace(/^[\s'.,;:!?\u2014\u2013-]+/, '')
    .trim();
}

/** For each pin, the indices of the quotations it matches (all of them, in order). */
export function matchPins(quotes: readonly Quote[], pins: readonly DialoguePin[]): number[][] {
  const forms = quotes.map((q) => pinForm(q.text));
  return pins.map((pin) => {
    const want = pinForm(pin.startsWith);
    if (want === '') return [];
    const out: number[] = [];
    quotes.forEach((q, i) => {
      if (q.chapter + 1 === pin.chapter && forms[i].startsWith(want)) out.push(i);
    });
    return out;
  });
}

export interface PinProblem {
  /** 0-based position of the pin in the plan's list. */
  pin: number;
  chapter: number;
  startsWith: string;
  /** no-match: the pin matches no quotation; several: it matches more than one (the first is used); unknown-speaker / unknown-addressee: an id that is not in the cast. */
  reason: 'no-match' | 'several' | 'unknown-speaker' | 'unknown-addressee';
  message: string;
}

/** Every problem with the pins of a text: pins that match nothing, match several quotations, or name ids outside the cast. */
export function checkPins(model: TextModel, dialogue: DialogueSettings | undefined, cast: readonly CastMember[]): PinProblem[] {
  const pins = dialogue?.pins ?? [];
  if (pins.length === 0) return [];
  const { quotes } = findQuotes(model, dialogue?.verbs ?? [], marksSetting(dialogue?.marks));
  const matches = matchPins(quotes, pins);
  const ids = new Set(cast.map((c) => c.id));
  const out: PinProblem[] = [];
  pins.forEach((pin, i) => {
    const where = `the pin for chapter ${pin.chapter} starting “${pin.startsWith}”`;
    const base = { pin: i, chapter: pin.chapter, startsWith: pin.startsWith };
    const m = matches[i];
    if (m.length === 0) {
      const inChapter = quotes.filter((q) => q.chapter + 1 === pin.chapter).length;
      out.push({
        ...base,
        reason: 'no-match',
        message: `${where} matches no quotation (${inChapter === 0 ? `chapter ${pin.chapter} has no quotations` : `chapter ${pin.chapter} has ${inChapter} quotations, none starting with these words`}), so it was not applied. Copy the first words of the quotation exactly as the text has them, and check the chapter number.`,
      });
    } else if (m.length > 1) {
      out.push({ ...base, reason: 'several', message: `${where} matches ${m.length} quotations; it was applied to the first (“${quotes[m[0]].text.slice(0, 50)}”). Add more of the quotation's words to make it unique.` });
    }
    if (pin.speaker !== null && !ids.has(pin.speaker)) {
      out.push({ ...base, reason: 'unknown-speaker', message: `${where} names the speaker "${pin.speaker}", who is not in the cast; the quotation was left without a speaker. Use a cast id, or null for someone outside the cast.` });
    }
    if (pin.addressee !== undefined && pin.addressee !== null && !ids.has(pin.addressee)) {
      out.push({ ...base, reason: 'unknown-addressee', message: `${where} names the addressee "${pin.addressee}", who is not in the cast; the addressee was left empty. Use a cast id, or null.` });
    }
  });
  return out;
}

/** The pins that match no quotation of the text. */
export function unmatchedPins(model: TextModel, dialogue: DialogueSettings | undefined, cast: readonly CastMember[] = []): PinProblem[] {
  return checkPins(model, dialogue, cast).filter((p) => p.reason === 'no-match');
}
