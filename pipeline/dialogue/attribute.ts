/**
 * Speaker and addressee attribution: a sieve of explainable rules over turns
 * (turns.ts). All parts of a turn — a speech interrupted by its tag, the
 * paragraphs of a long speech — share its speaker and addressee.
 *
 * Rules, strongest first; each attribution records its rule and confidence:
 *   pin          a curator's pin (1.0)
 *   tag          a tag naming a cast member by name or alias: "said Ada",
 *                "the ferryman replied", "said Mrs. Orme gloomily" (0.95)
 *   outsider     a tag naming someone outside the cast: the speaker is null (0.9)
 *   self-naming  the speaker names themselves: "My name is Vell." (0.85)
 *   beat         the nearest clause of the paragraph has a cast member as its
 *                subject: "Ada put down her cup." (0.8)
 *   tag-pronoun  a tag (or a beat) with a pronoun: first from the paragraph's
 *                own mentions, then from the alternation of the exchange, then
 *                from the wider context (pronouns.ts); a pronoun whose latest
 *                possible referent is a named outsider makes the speaker null
 *                (rule "outsider")
 *   alternation  two people taking turns through adjacent paragraphs (chains.ts)
 *   scene        a run of dialogue right after narrative starts with the cast
 *                member on stage there (0.6–0.7)
 *   vocative     a speech addressing X by name is not X's; failing all else,
 *                the speaker is the latest other person on stage (0.55)
 * A tag with an ambiguous name (a surname two members share) is not
 * attributed by that name: it only narrows the other rules to its owners. A
 * tag or beat with a description outside the cast ("said the old man") admits
 * the sequence rules. Below MIN_CONFIDENCE the speaker is null (rule "none").
 * Addressees: see addressees.ts.
 */

import type { CastMember, Mentions, TextModel } from '../text/model.ts';
import type { DialogueSettings } from '../measures/types.ts';
import { findQuotes, type Quote, type QuoteProblem } from './quotes.ts';
import { marksSetting, type Convention, type ConventionMap } from './conventions.ts';
import { CONTINUING_VERBS, RESUMING_VERBS, speechVerbs } from './verbs.ts';
import { buildView } from './view.ts';
import { matchPins } from './pins.ts';
import { buildTurns, paragraphsWithTurns, type Rule, type Turn } from './turns.ts';
import { adjacent, recentSpeakers, sceneIndex } from './scene.ts';
import { mayBeEpithet, namesPerson, outsiderDescription, relationPronoun } from './refs.ts';
import { asksWho } from './tags.ts';
import { resolvePronoun } from './pronouns.ts';
import { allowed, chains, fillable, fillRun, seed, type ChainContext } from './chains.ts';
import { findAddressees } from './addressees.ts';

export type { Rule } from './turns.ts';

/** Attributions with a lower confidence leave the speaker null. */
export const MIN_CONFIDENCE = 0.5;

export interface AttributedQuote extends Quote {
  /** 0-based turn, shared by the parts of one speech; null for written words. */
  turn: number | null;
  /** Cast id, or null (unknown, outside the cast, or written words). */
  speaker: string | null;
  addressee: string | null;
  rule: Rule;
  /** 0..1, rounded to two decimals. */
  confidence: number;
  /** Rule "outsider": how the text names or describes the speaker outside the cast ("the maid", "Mrs Threlkeld"), when it does. */
  outsider: string | null;
}

export interface DialogueTurn {
  index: number;
  /** Indices into `quotes`. */
  quotes: number[];
  /** 0-based chapter. */
  chapter: number;
  speaker: string | null;
  addressee: string | null;
  rule: Rule;
  confidence: number;
  /** Rule "outsider": the speaker's name or description in the text, when it gives one. */
  outsider: string | null;
  words: number;
}

export interface DialogueAnalysis {
  /** The convention of most of the text. */
  convention: Convention;
  /** The convention of every chapter and scene. */
  conventions: ConventionMap;
  quotes: AttributedQuote[];
  turns: DialogueTurn[];
  problems: QuoteProblem[];
}

export interface DialogueInput {
  model: TextModel;
  cast: CastMember[];
  mentions: Mentions;
  dialogue?: DialogueSettings;
}

function settle(t: Turn, member: number | null, rule: Rule, conf: number): void {
  t.speaker = member;
  t.rule = rule;
  t.conf = conf;
  t.fixed = true;
}

/** Analyse the dialogue of a text: quotations, turns, speakers, addressees. */
export function analyseDialogue(input: DialogueInput): DialogueAnalysis {
  const { model, mentions } = input;
  const settings: DialogueSettings = { verbs: input.dialogue?.verbs ?? [], pins: input.dialogue?.pins ?? [] };
  const verbs = speechVerbs(settings.verbs);
  const scan = findQuotes(model, settings.verbs, marksSetting(input.dialogue?.marks));
  const quotes = scan.quotes;
  const idIndex = new Map(input.cast.map((c, i) => [c.id, i]));
  // A first-person narrator is "I" in the narrative, never "he" or "she".
  const narrator = input.dialogue?.narrator ? (idIndex.get(input.dialogue.narrator) ?? null) : null;
  const cast: CastMember[] = input.cast.map((c, i) => (i === narrator ? { ...c, pronoun: 'i' as CastMember['pronoun'] } : c));

  // Pins: a pinned quotation is speech.
  const pinOf = new Map<number, DialogueSettings['pins'][number]>();
  matchPins(quotes, settings.pins).forEach((m, i) => {
    if (m.length > 0 && !pinOf.has(m[0])) pinOf.set(m[0], settings.pins[i]);
  });
  for (const qi of pinOf.keys()) {
    if (quotes[qi].kind !== 'text') continue;
    quotes[qi].kind = 'speech';
    for (let k = qi + 1; k < quotes.length && quotes[k - 1].continued && quotes[k].continuation; k++) quotes[k].kind = 'speech';
  }

  const v = buildView(model, cast, mentions, quotes);
  const turns = buildTurns(v, quotes, verbs, (m) => cast[m]?.pronoun);
  // Heads of descriptions that speak in tags ("said the porter"): the text's own people outside the cast.
  const speaking = new Set<string>();
  for (const t of turns) {
    const r = t.tag?.speaker;
    const d = r ? outsiderDescription(r) : null;
    if (d !== null && r?.kind === 'desc') speaking.add(d.split(' ').at(-1)!.toLowerCase());
  }
  const scene = sceneIndex(v, model, verbs, speaking);
  const chapterStart = (c: number): number => model.chapters[c].firstParagraph;
  // Someone outside the cast gets a stand-in index past the cast while the rules run.
  const outsiderNames: string[] = [];
  const outsiderIndex = new Map<string, number>();
  const outsider = (name: string): number => {
    const key = name.toLowerCase();
    let k = outsiderIndex.get(key);
    if (k === undefined) {
      k = cast.length + outsiderNames.length;
      outsiderIndex.set(key, k);
      outsiderNames.push(name);
    }
    return k;
  };
  const ctx: ChainContext = { cast, scene, turns, chapterStart, withTurns: paragraphsWithTurns(turns), outsider };
  const pctx = { model, cast, scene, turns };
  const isOutside = (t: Turn, name: string | null, rule: Rule, conf: number): void => {
    settle(t, name === null ? null : outsider(name), rule, conf);
    t.outsider = true;
    t.outsiderName = name;
  };

  // 1. Pins; tags and beats that name someone; self-naming.
  turns.forEach((t, i) => {
    if (t.tag?.to?.kind === 'cast') t.explicitTo = t.tag.to.member;
    const pin = t.quotes.map((qi) => pinOf.get(qi)).find((p) => p !== undefined);
    if (pin) {
      settle(t, pin.speaker === null ? null : (idIndex.get(pin.speaker) ?? null), 'pin', 1);
      if (pin.speaker === null) t.outsider = true;
      if (pin.addressee !== undefined) t.pinAddressee = pin.addressee === null ? null : (idIndex.get(pin.addressee) ?? null);
      return;
    }
    const r = t.tag?.speaker;
    if (r?.kind === 'cast') {
      settle(t, r.member, 'tag', 0.95);
      return;
    }
    const described = r ? outsiderDescription(r) : null;
    if (described !== null) {
      isOutside(t, described, 'outsider', 0.9);
      return;
    }
    if (r?.kind === 'pronoun' && r.gender === 'i' && narrator !== null) {
      settle(t, narrator, 'tag-pronoun', 0.9);
      return;
    }
    if (r?.kind === 'ambiguous') t.candidates = r.candidates;
    const kin = r ? relationPronoun(r) : null;
    if (kin !== null) t.gender = kin; // "said his mother": a woman, whoever she is
    if (r?.kind === 'pronoun') t.pronoun = { gender: r.gender, token: t.tag!.token, continuing: CONTINUING_VERBS.has(t.tag!.verb), inTag: true };
    if (t.tag && RESUMING_VERBS.has(t.tag.verb)) t.resumes = true;
    if (t.selfNamed !== null && allowed(cast, t, t.selfNamed)) {
      settle(t, t.selfNamed, 'self-naming', 0.85);
      return;
    }
    // A reply that gives a name to "Who are you?" is that person's: "Lucy Venn, ma'am."
    const prev = turns[i - 1];
    if (t.introduces !== null && adjacent(prev, t) && asksWho(prev.quotes.map((qi) => quotes[qi].text).join(' '))) {
      // The name is given, not called out: it is no vocative.
      const m = t.introduces;
      t.vocatives = t.vocatives.filter((x) => x !== m);
      settle(t, m, 'self-naming', 0.85);
      return;
    }
    if (r) return;
    const b = t.beats[0]?.subject;
    const bd = b ? outsiderDescription(b) : null;
    if (b?.kind === 'cast' && allowed(cast, t, b.member)) settle(t, b.member, 'beat', 0.8);
    else if (b?.kind === 'ambiguous') t.candidates = b.candidates;
    else if (b?.kind === 'pronoun' && b.gender === 'i' && narrator !== null) settle(t, narrator, 'beat', 0.8);
    else if (b?.kind === 'pronoun') t.pronoun = { gender: b.gender, token: t.beats[0].token, continuing: false, inTag: false };
    else if (bd !== null && (b!.kind === 'outsider' || (namesPerson(bd, speaking) && !mayBeEpithet(bd)))) isOutside(t, bd, 'outsider', 0.75);
    else if (b?.kind === 'desc' || b?.kind === 'outsider') t.described = true;
  });

  // 2. Pronouns settled by their own paragraph (or by being the only fitting member).
  const pronounRule = (t: Turn): Rule => (t.pronoun?.inTag ? 'tag-pronoun' : 'beat');
  turns.forEach((t, i) => {
    if (t.fixed || !t.pronoun) return;
    const res = t.pronoun.continuing ? null : resolvePronoun(pctx, i, t.pronoun.gender, t.pronoun.token, { local: true });
    if (res?.member === -1) {
      isOutside(t, res.name ?? null, 'outsider', res.conf);
    } else if (res && res.conf >= 0.62 && allowed(cast, t, res.member)) settle(t, res.member, pronounRule(t), t.pronoun.inTag ? res.conf : Math.round(res.conf * 90) / 100);
    else t.gender = t.pronoun.gender;
  });

  // 3. Alternation through runs of adjacent turns, each run seeded from the narrative before it.
  const alternate = (): void => {
    for (const t of turns) {
      if (!t.fixed) {
        t.speaker = null;
        t.rule = 'none';
        t.conf = 0;
      }
    }
    for (const run of chains(turns)) {
      seed(ctx, run);
      fillRun(ctx, run);
    }
  };
  alternate();

  // 4. Pronouns left over: resolved in the wider context, with alternation's guess as a hint; then alternate again.
  let changed = false;
  turns.forEach((t, i) => {
    if (t.fixed || !t.pronoun) return;
    if (t.speaker !== null && t.speaker < cast.length && allowed(cast, t, t.speaker)) return; // the exchange settled it
    const expected = t.speaker;
    const res = resolvePronoun(pctx, i, t.pronoun.gender, t.pronoun.token, { expected, continuing: t.pronoun.continuing });
    if (res && res.member >= 0 && res.conf >= MIN_CONFIDENCE && allowed(cast, t, res.member)) {
      settle(t, res.member, pronounRule(t), t.pronoun.inTag ? res.conf : Math.round(res.conf * 90) / 100);
      changed = true;
    }
  });
  if (changed) alternate();

  // 5. Vocatives: a turn still unknown that addresses someone by name goes to the latest other person on stage.
  turns.forEach((t, i) => {
    if (t.speaker !== null || t.fixed || t.vocatives.length === 0 || !fillable(t)) return;
    const prev = adjacent(turns[i - 1], t) ? turns[i - 1].speaker : null;
    const pool = [...scene.members(t.firstPara, 3, chapterStart(t.chapter)), ...recentSpeakers(turns, i)].filter((m) => allowed(cast, t, m));
    const pick = pool.find((m) => m !== prev) ?? pool[0];
    if (pick !== undefined) {
      t.speaker = pick;
      t.rule = 'vocative';
      t.conf = 0.55;
    }
  });

  // 6. Threshold; turns given to someone outside the cast have no speaker.
  for (const t of turns) {
    if (t.speaker !== null && t.conf < MIN_CONFIDENCE) {
      t.speaker = null;
      t.rule = 'none';
      t.conf = 0;
    }
    if (t.speaker !== null && t.speaker >= cast.length) {
      t.outsiderName = outsiderNames[t.speaker - cast.length];
      t.outsider = true;
      t.speaker = null;
      t.rule = 'outsider';
    }
  }

  // Results.
  const addressees = findAddressees(turns, cast, scene, chapterStart);
  const out: AttributedQuote[] = quotes.map((q) => ({ ...q, turn: null, speaker: null, addressee: null, rule: 'text', confidence: 1, outsider: null }));
  const result: DialogueTurn[] = turns.map((t, i) => {
    const speaker = t.speaker === null ? null : cast[t.speaker].id;
    const a = addressees[i];
    const addressee = a === null ? null : cast[a].id;
    const confidence = Math.round(t.conf * 100) / 100;
    const outsider = t.rule === 'outsider' ? t.outsiderName : null;
    let words = 0;
    for (const qi of t.quotes) {
      Object.assign(out[qi], { turn: i, speaker, addressee, rule: t.rule, confidence, outsider });
      words += quotes[qi].words;
    }
    return { index: i, quotes: t.quotes, chapter: t.chapter, speaker, addressee, rule: t.rule, confidence, outsider, words };
  });
  return { convention: scan.convention, conventions: scan.conventions, quotes: out, turns: result, problems: scan.problems };
}
