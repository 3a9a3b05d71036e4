/**
 * Alternation: runs of adjacent turns (each starting in the paragraph after
 * the previous one) are read as two people taking turns.
 *
 * In each run, turns whose speaker is known (pin, tag, beat, resolved pronoun,
 * or the scene seed below) are anchors. The turns between two anchors are
 * filled by parity: with anchors A … B an odd number of turns apart, A's
 * parity is A's and the rest B's; with A … A an even number apart, the other
 * parity is the other side of A's exchange. Where anchors disagree with
 * parity (a third voice, a speaker going on), each turn follows its nearer
 * anchor (the earlier one on a tie), with a lower confidence. Turns before the
 * first anchor and after the last follow that anchor's parity.
 *
 * A speaker who addresses someone by name or by tag ("You've no fire, Miss
 * Quarry") is answered by them: the next turn, if unknown, is theirs (0.8),
 * and counts as an anchor; when the speaker is not known, only a name that
 * opens the speech counts as the call ("Tomas, take the bag up.").
 *
 * The other side of X's exchange is, in order: the speaker of the nearest turn
 * of the run spoken by someone else (anchors, and turns already filled to the
 * left), or whom X addresses there (tag or vocative) — the first who fits the
 * nearest turn to fill; else the cast on stage in the narrative around the run
 * (subjects first, latest first) or the latest speakers before it in its
 * chapter — the first who fits every turn of its parity (pronoun gender, names
 * addressed, ambiguous name's owners); else the most frequent speakers of the
 * 40 turns before it, likewise.
 *
 * Someone outside the cast, once known (a tag such as "said the maid", or
 * the seed below), is an anchor like any other speaker: the turns that answer
 * them go to the other side of their exchange, and the turns their parity
 * gives them stay outside the cast (rule "outsider"). Their speech never
 * feeds a cast member's parity.
 *
 * Only turns of pure dialogue, or with a tag or a beat that names nobody for
 * sure ("said the old man", "The old man smiled.", "she said", "said
 * Calloway" when two share the name), are filled. Another turn
 * whose speaker is unknown ends the run.
 *
 * Scene seed: a run that starts right after a paragraph of narrative, with no
 * anchor of its own at its start, is given to the cast member who acts there
 * (see seed()).
 *
 * A turn whose tag resumes the speech before it ("he went on", "she
 * continued") keeps the previous turn's speaker and does not count as a turn
 * of the alternation.
 *
 * Confidence: 0.88 between agreeing anchors, 0.85 beside one anchor (0.7 when
 * the other side comes from the narrative or the chapter's speakers, 0.6 when
 * from the text's frequent speakers), less 0.02 per turn from the nearer
 * anchor; 0.6 where anchors disagree.
 */

import type { CastMember } from '../text/model.ts';
import { fitsGender } from './refs.ts';
import { adjacent, recentSpeakers, type Scene } from './scene.ts';
import type { Turn } from './turns.ts';

export interface ChainContext {
  cast: CastMember[];
  scene: Scene;
  turns: Turn[];
  /** First paragraph of each chapter. */
  chapterStart: (chapter: number) => number;
  /** Paragraphs that hold a turn. */
  withTurns: ReadonlySet<number>;
  /** The stand-in speaker for someone outside the cast, by name or description (an index past the cast). */
  outsider: (name: string) => number;
}

/** Speakers of the 40 turns before turn i, in any chapter, most turns first: who the text is mostly about lately. */
export function frequentSpeakers(turns: readonly Turn[], i: number): number[] {
  const count = new Map<number, number>();
  for (let k = Math.max(0, i - 40); k < i; k++) {
    const s = turns[k].speaker;
    if (s !== null) count.set(s, (count.get(s) ?? 0) + 1);
  }
  return [...count.entries()].sort((a, b) => b[1] - a[1] || a[0] - b[0]).map(([m]) => m);
}

/** Whether a turn with an unknown speaker may be filled by alternation. */
export function fillable(t: Turn): boolean {
  return !t.fixed && (t.pure || t.tag !== null || t.described || t.pronoun !== null || t.candidates !== null);
}

/** Whether speaker m may speak turn t. m past the cast is someone outside it (of unknown pronoun). */
export function allowed(cast: CastMember[], t: Turn, m: number): boolean {
  return !t.vocatives.includes(m) && (t.candidates === null || t.candidates.includes(m)) && (t.gender === null || fitsGender(cast[m]?.pronoun, t.gender));
}

/** Runs of adjacent turns, split at turns that can be neither anchors nor filled. */
export function chains(turns: readonly Turn[]): number[][] {
  const out: number[][] = [];
  let cur: number[] = [];
  turns.forEach((t, i) => {
    const anchor = t.fixed && t.speaker !== null;
    const usable = anchor || fillable(t);
    if (cur.length && (!usable || !adjacent(turns[cur[cur.length - 1]], t))) {
      out.push(cur);
      cur = [];
    }
    if (usable) cur.push(i);
  });
  if (cur.length) out.push(cur);
  return out;
}

/**
 * Give the first turn of a run to whoever acts in the narrative paragraph just
 * before it: a cast member acting in its last sentence (the subjects of its
 * clauses first, in text order, then others named before a verb), else one
 * acting anywhere in that paragraph (the latest first) — the first who fits
 * the turn. When the last sentence's first actor is someone outside the
 * cast ("Clem stood on the step", "The maid put her head in at the door")
 * and the turn is pure dialogue, the turn is theirs: no cast speaker.
 */
export function seed(ctx: ChainContext, run: readonly number[]): void {
  const t = ctx.turns[run[0]];
  if (t.fixed) return;
  const p = t.firstPara - 1;
  if (p < ctx.chapterStart(t.chapter) || ctx.withTurns.has(p)) return;
  const agents = ctx.scene.mentionsOf(p).filter((m) => m.agent);
  if (agents.length === 0) return;
  const lastSentence = agents[agents.length - 1].sentence;
  // In the last sentence the main clause's subject comes first ("He had carried for them since before Wilf was born").
  const lastOnes = agents.filter((m) => m.sentence === lastSentence);
  const inLast = [...lastOnes.filter((m) => m.subject), ...lastOnes.filter((m) => !m.subject)];
  if (inLast[0].member < 0) {
    if (!t.pure) return; // the turn's own tag or beat may say otherwise
    t.speaker = ctx.outsider(inLast[0].name ?? 'someone outside the cast');
    t.outsiderName = inLast[0].name;
    t.rule = 'outsider';
    t.conf = 0.6;
    t.fixed = true;
    t.outsider = true;
    return;
  }
  const pool = [...inLast, ...[...agents].reverse()].filter((m) => m.member >= 0);
  const pick = pool.find((m) => allowed(ctx.cast, t, m.member));
  if (pick === undefined) return;
  t.speaker = pick.member;
  t.rule = t.pronoun?.inTag ? 'tag-pronoun' : 'scene';
  t.conf = pick.sentence === lastSentence ? 0.7 : 0.6;
  t.fixed = true;
}

/** Where the other side of an exchange was found: among the run's speakers, on stage, or among the text's frequent speakers. */
type Tier = 'run' | 'scene' | 'prior';

/** Fill the unknown turns of one run by alternation. */
export function fillRun(ctx: ChainContext, run: readonly number[]): void {
  const T = ctx.turns;
  // Slots: a turn whose tag resumes the speech before it ("he went on") shares its predecessor's slot.
  const slots: number[][] = [];
  run.forEach((ti, k) => {
    if (k > 0 && T[ti].resumes) slots[slots.length - 1].push(ti);
    else slots.push([ti]);
  });
  const n = slots.length;
  const fixedSpeaker = (k: number): number | null => {
    for (const ti of slots[k]) if (T[ti].fixed && T[ti].speaker !== null) return T[ti].speaker;
    return null;
  };
  const fits = (k: number, m: number): boolean => slots[k].every((ti) => T[ti].fixed || allowed(ctx.cast, T[ti], m));

  /** Who the turns of a slot address by name or by tag. */
  const addressed = (k: number, s: number): number | null => {
    for (const ti of slots[k]) {
      const u = T[ti];
      const to = u.pinAddressee ?? u.explicitTo ?? u.vocatives.find((m) => m !== s);
      if (to !== undefined && to !== null && to !== s) return to;
    }
    return null;
  };

  // A known speaker who addresses someone by name or tag is answered by them in the next turn.
  const replies = new Map<number, number>();
  for (let k = 0; k + 1 < n; k++) {
    if (fixedSpeaker(k + 1) !== null) continue;
    // The person addressed answers; when the speaker is unknown, only a call that opens the speech counts
    // ("Tomas, take the bag up." — "Which room?"), not a name in passing ("Dunmore, his name is.").
    const known = fixedSpeaker(k);
    const s = known ?? -1;
    const to = known !== null ? addressed(k, s) : (slots[k].flatMap((ti) => T[ti].calls).find((m) => m !== s) ?? null);
    if (to !== null && fits(k + 1, to)) replies.set(k + 1, to);
  }
  const speakerOf = (k: number): number | null => fixedSpeaker(k) ?? replies.get(k) ?? null;
  const anchors: number[] = [];
  for (let k = 0; k < n; k++) if (speakerOf(k) !== null) anchors.push(k);
  if (anchors.length === 0) return;

  /** The other side of speaker s, seen from slot a, fitting the slots `positions`, never one of `exclude`. */
  const other = (s: number, a: number, positions: number[], exclude: number[]): { member: number; tier: Tier } | null => {
    const strong: number[] = [];
    const recent = recentSpeakers(T, run[0]);
    const order = slots.map((_, k) => k).sort((x, y) => Math.abs(x - a) - Math.abs(y - a) || x - y);
    for (const k of order) {
      const sp = slots[k].map((ti) => T[ti].speaker).find((m) => m !== null);
      if (sp === undefined || sp === null) continue;
      const m = sp === s ? addressed(k, s) : sp;
      if (m !== null) strong.push(m);
    }
    const first = T[run[0]];
    const last = T[run[run.length - 1]];
    // On stage: the narrative's subjects, then whoever spoke lately, then others named in the narrative.
    const around = [last.lastPara, last.lastPara - first.firstPara + 3, ctx.chapterStart(first.chapter)] as const;
    // Someone outside the cast who spoke lately comes after the cast named in the narrative just before the run,
    // and before cast members named further back: their part in a scene is usually brief.
    const inCast = (m: number): boolean => m < ctx.cast.length;
    const justBefore = first.firstPara > ctx.chapterStart(first.chapter) ? ctx.scene.members(first.firstPara - 1, 0, ctx.chapterStart(first.chapter)) : [];
    const weak = [
      ...ctx.scene.members(...around, true),
      ...recent.filter(inCast),
      ...justBefore,
      ...recent.filter((m) => !inCast(m)),
      ...ctx.scene.members(...around),
    ];
    const prior = frequentSpeakers(T, run[0]);
    const ok = (m: number): boolean => m !== s && !exclude.includes(m);
    // Someone who speaks in the run: the first who fits the nearest turn to fill (a clash further on ends the alternation there).
    const nearest = [...positions].sort((x, y) => Math.abs(x - a) - Math.abs(y - a))[0];
    const st = strong.find((m) => ok(m) && (nearest === undefined || fits(nearest, m)));
    if (st !== undefined) return { member: st, tier: 'run' };
    // Someone on stage or who spoke lately: the first who fits every turn to fill; else the latest speakers of the text.
    const wk = weak.find((m) => ok(m) && positions.every((k) => fits(k, m)));
    if (wk !== undefined) return { member: wk, tier: 'scene' };
    const pr = prior.find((m) => ok(m) && positions.every((k) => fits(k, m)));
    return pr !== undefined ? { member: pr, tier: 'prior' } : null;
  };
  const base = (q: { tier: Tier } | null): number => (q?.tier === 'run' ? 0.85 : q?.tier === 'scene' ? 0.7 : 0.6);

  for (let ai = -1; ai < anchors.length; ai++) {
    const a = ai >= 0 ? anchors[ai] : -1;
    const b = ai + 1 < anchors.length ? anchors[ai + 1] : n;
    if (b - a <= 1) continue;
    const Sa = a >= 0 ? speakerOf(a) : null;
    const Sb = b < n ? speakerOf(b) : null;
    const gap: number[] = [];
    for (let k = a + 1; k < b; k++) gap.push(k);
    const fromA = (k: number): boolean => (k - a) % 2 === 0;
    const fromB = (k: number): boolean => (b - k) % 2 === 0;
    const decay = (k: number): number => 0.02 * (Math.min(a >= 0 ? k - a : Infinity, b < n ? b - k : Infinity) - 1);

    let assign: (k: number) => { member: number | null; conf: number };
    if (Sa !== null && Sb !== null && (b - a) % 2 === 1 && Sa !== Sb) {
      assign = (k) => ({ member: fromA(k) ? Sa : Sb, conf: 0.88 - decay(k) });
    } else if (Sa !== null && Sb !== null && (b - a) % 2 === 0 && Sa === Sb) {
      const q = other(Sa, a, gap.filter((k) => !fromA(k)), []);
      assign = (k) => (fromA(k) ? { member: Sa, conf: 0.88 - decay(k) } : { member: q?.member ?? null, conf: base(q) - decay(k) });
    } else {
      // One anchor, or anchors that break the alternation: follow the nearer anchor. Where they break it,
      // neither is the other's partner (else the alternation would hold).
      const broken = Sa !== null && Sb !== null;
      const nearA = (k: number): boolean => Sa !== null && (Sb === null || k - a <= b - k);
      const qa = Sa !== null ? other(Sa, a, gap.filter((k) => nearA(k) && !fromA(k)), broken ? [Sb!] : []) : null;
      const qb = Sb !== null ? other(Sb, b, gap.filter((k) => !nearA(k) && !fromB(k)), broken ? [Sa!] : []) : null;
      assign = (k) => {
        const useA = nearA(k);
        const even = useA ? fromA(k) : fromB(k);
        const q = useA ? qa : qb;
        if (even) return { member: useA ? Sa : Sb, conf: (broken ? 0.6 : 0.85) - decay(k) };
        return { member: q?.member ?? null, conf: (broken ? 0.6 : base(q)) - decay(k) };
      };
    }
    for (const k of gap) {
      const r = assign(k);
      if (r.member === null) continue;
      for (const ti of slots[k]) {
        const t = T[ti];
        if (t.fixed || !allowed(ctx.cast, t, r.member)) continue;
        t.speaker = r.member;
        t.conf = Math.round(r.conf * 100) / 100;
        t.rule = t.pronoun?.inTag ? 'tag-pronoun' : 'alternation';
      }
    }
  }
  for (const [k, m] of replies) {
    for (const ti of slots[k]) {
      const t = T[ti];
      if (t.fixed || !allowed(ctx.cast, t, m)) continue;
      t.speaker = m;
      t.conf = 0.8;
      t.rule = t.pronoun?.inTag ? 'tag-pronoun' : 'alternation';
    }
  }
  // Turns sharing an anchor's slot ("he went on" after a known speaker) take its speaker.
  for (const k of anchors) {
    const sp = speakerOf(k)!;
    for (const ti of slots[k]) {
      const t = T[ti];
      if (t.fixed || !allowed(ctx.cast, t, sp)) continue;
      t.speaker = sp;
      t.conf = 0.85;
      t.rule = t.pronoun?.inTag ? 'tag-pronoun' : 'alternation';
    }
  }
}
