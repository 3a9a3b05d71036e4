/**
 * Addressees, once speakers are known: the pin's; else the tag's ("to X", or
 * the object of "asked", "told"), a pronoun there ("to him") being the nearest
 * fitting person of the exchange; else the first cast member the speech
 * addresses by name; else the other side of the exchange — the previous
 * turn's speaker if different and at most two paragraphs back, else the next
 * turn's; else null.
 */

import type { CastMember } from '../text/model.ts';
import { fitsGender } from './refs.ts';
import { near, recentSpeakers, type Scene } from './scene.ts';
import type { Turn } from './turns.ts';

export function findAddressees(turns: readonly Turn[], cast: CastMember[], scene: Scene, chapterStart: (c: number) => number): (number | null)[] {
  return turns.map((w, i): number | null => {
    if (w.pinAddressee !== undefined) return w.pinAddressee;
    const to = w.tag?.to;
    if (to && (to.kind === 'cast' || to.kind === 'pronoun' || to.kind === 'ambiguous')) {
      if (to.kind === 'cast') return to.member !== w.speaker ? to.member : null;
      const pool = [turns[i - 1]?.speaker, turns[i + 1]?.speaker, ...recentSpeakers(turns as Turn[], i), ...scene.members(w.firstPara, 2, chapterStart(w.chapter))].filter(
        (m): m is number => m !== null && m !== undefined && m !== w.speaker,
      );
      const m = to.kind === 'pronoun' ? pool.find((k) => fitsGender(cast[k].pronoun, to.gender)) : pool.find((k) => to.candidates.includes(k));
      return m ?? null;
    }
    const voc = w.vocatives.find((m) => m !== w.speaker);
    if (voc !== undefined) return voc;
    if (w.speaker === null || to) return null;
    const prev = turns[i - 1];
    if (near(prev, w) && prev.speaker !== null && prev.speaker !== w.speaker) return prev.speaker;
    const next = turns[i + 1];
    if (near(w, next) && next.speaker !== null && next.speaker !== w.speaker) return next.speaker;
    return null;
  });
}
