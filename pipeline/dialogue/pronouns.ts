/**
 * Pronoun resolution for dialogue tags and beats ("she said", "He smiled.").
 *
 * Candidates are the cast members whose pronoun fits (a member with no
 * pronoun fits he and she), narrowed by an ambiguous name's owners. Each gets
 * a score:
 *   +3    the latest narrative subject before the pronoun in its paragraph
 *         (+1.5 for any other narrative mention there; +0.5 for the latest);
 *   +2/d  a narrative subject d paragraphs back (+1/d for another mention), up to 6;
 *   +2.5  the speaker that alternation expects here;
 *   +1    each of the three latest known speakers (+0.5 for the very latest;
 *         known from evidence, not from alternation); with
 *         a verb that carries on a speech ("went on", "added") +2 and +1.5
 *         instead, and no turn-taking penalty;
 *   −1.5  the previous turn's speaker, when this turn starts a new paragraph
 *         (people take turns);
 *   −4    anyone the quotation addresses by name.
 * The best wins; its confidence follows its lead over the second: ≥3 → 0.85,
 * ≥1.5 → 0.75, ≥0.75 (or any lead over candidates with no evidence) → 0.62,
 * else 0.45 (below the threshold). A single
 * candidate gets 0.8 unless it is addressed. In `local` mode only the
 * paragraph's own mentions and a single candidate count. When the latest
 * person acting before the pronoun is named or described but outside the
 * cast ("Clem", "the postman"), the result is member −1 with that name:
 * someone outside the cast.
 */

import type { CastMember } from '../text/model.ts';
import type { TextModel } from '../text/model.ts';
import { fitsGender, type Gender } from './refs.ts';
import { adjacent, recentSpeakers, type Scene } from './scene.ts';
import type { Turn } from './turns.ts';

export interface PronounContext {
  model: TextModel;
  cast: CastMember[];
  scene: Scene;
  turns: Turn[];
}

/**
 * Who the pronoun stands for when the latest person acting before it (in its
 * paragraph or the one before) is named or described but outside the cast,
 * with no fitting cast member named after them ("The Widow Carrow sat in the
 * kitchen. … “It’s here,” she said."; "The postman stood stamping in the
 * yard. … he said"): their name or description; else null.
 */
function outsiderBefore(ctx: PronounContext, g: Gender, token: number): string | null {
  const p = ctx.model.tokens.paragraph[token];
  const first = ctx.model.chapters[ctx.model.paragraphs.chapter[p]].firstParagraph;
  for (let q = p; q >= Math.max(first, p - 1); q--) {
    const l = ctx.scene.mentionsOf(q).filter((m) => m.token < token);
    for (let k = l.length - 1; k >= 0; k--) {
      const m = l[k];
      if (m.member >= 0 && fitsGender(ctx.cast[m.member].pronoun, g)) return null;
      if (m.member < 0 && m.agent) return m.name;
    }
  }
  return null;
}

export function resolvePronoun(
  ctx: PronounContext,
  i: number,
  g: Gender,
  token: number,
  opts: { expected?: number | null; continuing?: boolean; local?: boolean } = {},
): { member: number; conf: number; name?: string } | null {
  const { model, cast, scene, turns } = ctx;
  const w = turns[i];
  const outsider = outsiderBefore(ctx, g, token);
  if (outsider !== null) return { member: -1, conf: 0.6, name: outsider };
  const compatible = cast.map((_, k) => k).filter((k) => fitsGender(cast[k].pronoun, g) && (w.candidates === null || w.candidates.includes(k)));
  if (compatible.length === 0) return null;
  if (compatible.length === 1) return w.vocatives.includes(compatible[0]) ? null : { member: compatible[0], conf: 0.8 };
  const score = new Map<number, number>(compatible.map((k) => [k, 0]));
  const add = (m: number, s: number): void => {
    if (score.has(m)) score.set(m, score.get(m)! + s);
  };
  const p = model.tokens.paragraph[token];
  const own = scene.mentionsOf(p).filter((m) => m.token < token && m.member >= 0);
  let localEvidence = false;
  const seen = new Set<number>();
  let latestSubject = true;
  for (let k = own.length - 1; k >= 0; k--) {
    const m = own[k];
    if (seen.has(m.member) || !score.has(m.member)) continue;
    seen.add(m.member);
    localEvidence = true;
    add(m.member, (m.subject && latestSubject ? 3 : 1.5) + (seen.size === 1 ? 0.5 : 0));
    if (m.subject) latestSubject = false;
  }
  for (const m of w.vocatives) add(m, -4);
  if (opts.local) {
    if (!localEvidence) return null;
  } else {
    const first = model.chapters[w.chapter].firstParagraph;
    const best = new Map<number, number>();
    for (let d = 1; d <= 6 && p - d >= first; d++) {
      for (const m of scene.mentionsOf(p - d)) {
        if (m.member < 0) continue;
        const s = (m.subject ? 2 : 1) / d;
        if ((best.get(m.member) ?? 0) < s) best.set(m.member, s);
      }
    }
    for (const [m, s] of best) add(m, s);
    if (opts.expected !== undefined && opts.expected !== null) add(opts.expected, 2.5);
    const prev = turns[i - 1];
    if (opts.continuing) {
      recentSpeakers(turns, i, true).slice(0, 3).forEach((m, k) => add(m, k === 0 ? 2 : 1.5));
    } else {
      recentSpeakers(turns, i, true).slice(0, 3).forEach((m, k) => add(m, k === 0 ? 0.5 : 1));
      if (adjacent(prev, w) && prev.speaker !== null && prev.lastPara !== w.firstPara) add(prev.speaker, -1.5);
    }
  }
  const ranked = [...score.entries()].sort((a, b) => b[1] - a[1] || a[0] - b[0]);
  const [top, second] = ranked;
  if (top[1] <= 0) return null;
  // A lead over candidates with no evidence at all counts as a lead of at least 0.75.
  const margin = Math.max(top[1] - (second ? second[1] : -Infinity), second && second[1] <= 0 ? 0.75 : 0);
  const conf = margin >= 3 ? 0.85 : margin >= 1.5 ? 0.75 : margin >= 0.75 ? 0.62 : 0.45;
  return { member: top[0], conf };
}
