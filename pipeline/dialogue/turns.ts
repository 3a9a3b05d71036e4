/**
 * Turns: the speech of one paragraph (or of a speech running over several
 * paragraphs), with the evidence gathered around its quotations. Two
 * quotations of one paragraph are two turns only when each has its own tag and
 * the tags cannot name the same person ("“Yes,” said Ada. “No,” said Tom.").
 */

import type { Quote } from './quotes.ts';
import type { VerbList } from './verbs.ts';
import type { Gender } from './refs.ts';
import { sameReferent } from './refs.ts';
import { findBeats, findIntroduction, findSelfName, findTag, findVocatives, stretches, type Beat, type Stretch, type Tag } from './tags.ts';
import type { TokenView } from './view.ts';

export type Rule = 'pin' | 'tag' | 'outsider' | 'tag-pronoun' | 'beat' | 'self-naming' | 'alternation' | 'vocative' | 'scene' | 'none' | 'text';

export interface Turn {
  /** Indices into the quotation list. */
  quotes: number[];
  chapter: number;
  firstPara: number;
  lastPara: number;
  /** The first tag among the turn's quotations. */
  tag: Tag | null;
  /** Narrative stretches before and after the turn's quotations, in its paragraphs. */
  stretches: Stretch[];
  /** Cast members addressed by name inside the turn (outside quotations within it). */
  vocatives: number[];
  /** A cast member the speaker names as themselves ("My name is Vell"). */
  selfNamed: number | null;
  /** Action beats, nearest first. */
  beats: Beat[];
  /** Every paragraph of the turn holds nothing but this turn's quotations. */
  pure: boolean;
  /** Offset of the first opening mark. */
  anchorOffset: number;
  /** Cast index of the speaker, or null. */
  speaker: number | null;
  rule: Rule;
  conf: number;
  /** Settled by a pin, a tag, a beat or a resolved pronoun: a known speaker that sequence rules start from. */
  fixed: boolean;
  /** The speaker is outside the cast (named, described, or pinned as nobody in the cast). */
  outsider: boolean;
  /** How the text names or describes the speaker outside the cast ("the maid"), when it does. */
  outsiderName: string | null;
  /** A cast member the turn opens by naming, as a reply to "Who are you?" would ("Lucy Venn, ma'am."). */
  introduces: number | null;
  /** Cast members the turn calls by name at the opening of one of its quotations ("Tomas, take the bag up."). */
  calls: number[];
  /** Who the speaker may be, from an ambiguous tag or beat. */
  candidates: number[] | null;
  /** The pronoun of a tag or beat that could not be resolved on its own. */
  gender: Gender | null;
  /** The pronoun's token and whether its verb carries on a speech ("went on"). */
  pronoun: { gender: Gender; token: number; continuing: boolean; inTag: boolean } | null;
  pinAddressee: number | null | undefined;
  /** The tag's addressee, when it names a cast member. */
  explicitTo: number | null;
  /** The nearest beat's subject is a description or a name outside the cast ("The old man smiled."). */
  described: boolean;
  /** The tag's verb resumes the previous paragraph's speech ("he went on"): same speaker as the turn before. */
  resumes: boolean;
}

function newTurn(q: Quote): Turn {
  return {
    quotes: [], chapter: q.chapter, firstPara: q.paragraph, lastPara: q.paragraph, tag: null, stretches: [], vocatives: [], selfNamed: null,
    beats: [], pure: false, anchorOffset: q.open, speaker: null, rule: 'none', conf: 0, fixed: false, outsider: false, outsiderName: null, introduces: null, calls: [], candidates: null,
    gender: null, pronoun: null, pinAddressee: undefined, explicitTo: null, described: false, resumes: false,
  };
}

/** Group the speech quotations into turns and gather their evidence. */
export function buildTurns(v: TokenView, quotes: readonly Quote[], verbs: VerbList, genderOf: (m: number) => string | undefined): Turn[] {
  const speech = quotes.filter((q) => q.kind === 'speech');
  const ev = new Map<number, { tag: Tag | null; before: Stretch; after: Stretch | null; vocatives: number[]; self: number | null; intro: number | null }>();
  speech.forEach((q, k) => {
    const prev = k > 0 && speech[k - 1].paragraph === q.paragraph ? speech[k - 1] : null;
    const next = k + 1 < speech.length && speech[k + 1].paragraph === q.paragraph ? speech[k + 1] : null;
    const s = stretches(v, q, prev, next);
    ev.set(q.index, {
      tag: findTag(v, verbs, s.before, s.after),
      before: s.before,
      after: s.after,
      vocatives: findVocatives(v, q),
      self: findSelfName(v, q),
      intro: findIntroduction(v, q),
    });
  });

  const turns: Turn[] = [];
  let last: Quote | null = null;
  for (const q of speech) {
    const e = ev.get(q.index)!;
    let cur = turns[turns.length - 1];
    let same = last !== null && cur !== undefined && (q.paragraph === last.paragraph || (q.continuation && last.continued));
    if (same && e.tag && cur.tag) {
      const lastTag = ev.get(last!.index)!.tag;
      const shared = lastTag !== null && lastTag.stretch === e.tag.stretch;
      if (!shared && !sameReferent(cur.tag.speaker, e.tag.speaker, genderOf)) same = false;
    }
    if (!same) {
      cur = newTurn(q);
      turns.push(cur);
      cur.stretches.push(e.before);
      cur.introduces = e.intro;
    } else if (!cur.stretches.some((s) => s.start === e.before.start)) {
      cur.stretches.push(e.before);
    }
    if (e.after) cur.stretches.push(e.after);
    cur.quotes.push(q.index);
    cur.lastPara = q.paragraph;
    if (!cur.tag && e.tag) cur.tag = e.tag;
    if (cur.selfNamed === null && e.self !== null) cur.selfNamed = e.self;
    if (e.intro !== null && e.vocatives.includes(e.intro) && !cur.calls.includes(e.intro)) cur.calls.push(e.intro);
    for (const m of e.vocatives) if (!cur.vocatives.includes(m)) cur.vocatives.push(m);
    last = q;
  }

  // Pure dialogue: no narrative words in the turn's paragraphs, and no other turn there.
  const turnsInPara = new Map<number, number>();
  for (const t of turns) for (let p = t.firstPara; p <= t.lastPara; p++) turnsInPara.set(p, (turnsInPara.get(p) ?? 0) + 1);
  const hasNarrative = (p: number): boolean => {
    for (let t = v.paraFirst[p]; t < v.paraEnd[p]; t++) {
      const qi = v.quoteOf[t];
      if (qi < 0 || quotes[qi].kind === 'text') return true;
    }
    return false;
  };
  for (const t of turns) {
    let pure = true;
    for (let p = t.firstPara; p <= t.lastPara && pure; p++) pure = !hasNarrative(p) && turnsInPara.get(p) === 1;
    t.pure = pure;
    t.beats = findBeats(v, t.stretches, t.anchorOffset);
  }
  return turns;
}

/** Whether a paragraph holds a turn. */
export function paragraphsWithTurns(turns: readonly Turn[]): Set<number> {
  const s = new Set<number>();
  for (const t of turns) for (let p = t.firstPara; p <= t.lastPara; p++) s.add(p);
  return s;
}
