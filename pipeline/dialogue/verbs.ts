/**
 * Speech verbs: the verbs of a dialogue tag ("said Ada", "she whispered").
 *
 * Each entry is "present past": the present form gives "says", "asks"; the
 * past form is the one most tags use. Phrasal verbs ("went on", "broke in")
 * are listed with their particle and only count with it. The list gathers the
 * reporting verbs of English fiction as listed in grammars of reported speech
 * (e.g. Quirk et al. 1985, §14.29–14.31, from memory) and the tag verbs used by
 * quotation-attribution studies (Elson & McKeown 2010; Muzny et al. 2017).
 */

const ENTRIES = `
say said|ask asked|answer answered|reply replied|cry cried|call called|repeat repeated|whisper whispered
mutter muttered|murmur murmured|shout shouted|exclaim exclaimed|add added|continue continued|begin began
explain explained|declare declared|remark remarked|observe observed|insist insisted|admit admitted|agree agreed
protest protested|demand demanded|inquire inquired|enquire enquired|retort retorted|return returned
rejoin rejoined|respond responded|suggest suggested|urge urged|warn warned|beg begged|plead pleaded
promise promised|announce announced|mumble mumbled|stammer stammered|stutter stuttered|sob sobbed|sigh sighed
gasp gasped|groan groaned|moan moaned|laugh laughed|chuckle chuckled|giggle giggled|snap snapped|snarl snarled
growl growled|hiss hissed|bark barked|roar roared|bellow bellowed|yell yelled|scream screamed|shriek shrieked
wail wailed|howl howled|grumble grumbled|complain complained|object objected|interrupt interrupted
interpose interposed|confess confessed|concede conceded|conclude concluded|counter countered|echo echoed
falter faltered|breathe breathed|hazard hazarded|muse mused|note noted|offer offered|order ordered
command commanded|prompt prompted|propose proposed|quaver quavered|query queried|reason reasoned
reassure reassured|recite recited|remind reminded|resume resumed|scold scolded|sneer sneered|soothe soothed
speak spoke|tell told|tease teased|venture ventured|vow vowed|bawl bawled|blurt blurted|boom boomed
chirp chirped|coax coaxed|croak croaked|drawl drawled|grunt grunted|lament lamented|lisp lisped|purr purred
rasp rasped|snort snorted|squeak squeaked|swear swore|taunt taunted|thunder thundered|whine whined
whimper whimpered|holler hollered|jeer jeered|assent assented|assert asserted|affirm affirmed|advise advised
caution cautioned|inform informed|instruct instructed|demur demurred|persist persisted|pursue pursued
proceed proceeded|bid bade|call-out called-out|cry-out cried-out|go-on went-on|break-in broke-in|put-in put-in
cut-in cut-in|burst-out burst-out|chime-in chimed-in|break-off broke-off|speak-up spoke-up|sing-out sang-out
`;

function present(base: string): string {
  if (/[^aeiou]y$/.test(base)) return `${base.slice(0, -1)}ies`;
  if (/(s|sh|ch|x|z|o)$/.test(base)) return `${base}es`;
  return `${base}s`;
}

/** One-word verb forms. */
export const SPEECH_VERBS: ReadonlySet<string> = new Set();
/** First word of a phrasal verb → the particles that complete it. */
export const PHRASAL_VERBS: ReadonlyMap<string, ReadonlySet<string>> = new Map();

/** Verbs whose object names the person spoken to ("asked Tom", "told her"). */
export const ADDRESSING_VERBS: ReadonlySet<string> = new Set(
  'ask asks asked tell tells told answer answers answered warn warns warned urge urges urged beg begs begged remind reminds reminded reassure reassures reassured assure assures assured inform informs informed order orders ordered command commands commanded bid bids bade advise advises advised caution cautions cautioned instruct instructs instructed scold scolds scolded tease teases teased coax coaxes coaxed soothe soothes soothed taunt taunts taunted prompt prompts prompted'.split(' '),
);

/** Verbs that carry on a speech already begun ("she went on", "he added"): its speaker spoke lately. common practice, no source. */
export const CONTINUING_VERBS: ReadonlySet<string> = new Set([
  'went on', 'goes on', 'continued', 'continues', 'resumed', 'resumes', 'added', 'adds', 'pursued', 'pursues',
  'proceeded', 'proceeds', 'persisted', 'persists',
]);

/** Verbs that resume the previous paragraph's speech after a pause: the same speaker. common practice, no source. */
export const RESUMING_VERBS: ReadonlySet<string> = new Set(['went on', 'goes on', 'continued', 'continues', 'resumed', 'resumes', 'pursued', 'pursues', 'proceeded', 'proceeds']);

function addForm(set: Set<string>, phrasal: Map<string, Set<string>>, form: string): void {
  const parts = form.split('-');
  if (parts.length === 1) {
    set.add(form);
    return;
  }
  const [head, particle] = parts;
  let ps = phrasal.get(head);
  if (!ps) phrasal.set(head, (ps = new Set()));
  ps.add(particle);
}

for (const entry of ENTRIES.split(/[|\n]/)) {
  const [base, past] = entry.trim().split(/\s+/);
  if (!base || !past) continue;
  const set = SPEECH_VERBS as Set<string>;
  const phrasal = PHRASAL_VERBS as Map<string, Set<string>>;
  addForm(set, phrasal, past);
  if (base.includes('-')) {
    const [head, particle] = base.split('-');
    addForm(set, phrasal, `${present(head)}-${particle}`);
  } else {
    addForm(set, phrasal, present(base));
  }
}

/**
 * The speech verbs: the built-in list plus `extra` (the plan's verbs, each as
 * it appears in a tag, e.g. "quavered"; a phrasal verb with a space, "piped
 * up"). Lower-cased.
 */
export interface VerbList {
  single: ReadonlySet<string>;
  phrasal: ReadonlyMap<string, ReadonlySet<string>>;
}

export function speechVerbs(extra: readonly string[] = []): VerbList {
  if (extra.length === 0) return { single: SPEECH_VERBS, phrasal: PHRASAL_VERBS };
  const single = new Set(SPEECH_VERBS);
  const phrasal = new Map<string, Set<string>>([...PHRASAL_VERBS].map(([k, v]) => [k, new Set(v)]));
  for (const v of extra) {
    const words = v.trim().toLowerCase().replace(/\u2019/g, "'").split(/\s+/).filter(Boolean);
    if (words.length === 1) single.add(words[0]);
    else if (words.length === 2) addForm(single, phrasal, `${words[0]}-${words[1]}`);
  }
  return { single, phrasal };
}

/** Number of words of the speech verb that starts at word `k` of `words` (0 when none). */
export function verbLength(verbs: VerbList, words: readonly string[], k: number): number {
  const w = words[k];
  if (w === undefined) return 0;
  const particles = verbs.phrasal.get(w);
  if (particles && words[k + 1] !== undefined && particles.has(words[k + 1])) return 2;
  return verbs.single.has(w) ? 1 : 0;
}

/** Common irregular past forms of verbs of action and being. common practice, no source. */
export const IRREGULAR_PASTS: ReadonlySet<string> = new Set([
  'was', 'had', 'came', 'went', 'stood', 'sat', 'saw', 'took', 'ran', 'held', 'put', 'got', 'gave', 'made', 'knew',
  'thought', 'felt', 'left', 'brought', 'began', 'kept', 'found', 'drew', 'threw', 'rode', 'drove', 'wore', 'shook',
  'spoke', 'said', 'told', 'lay', 'rose', 'fell', 'struck', 'caught', 'bent', 'swung', 'hung', 'led', 'set', 'let',
  'could', 'would', 'did', 'stepped',
]);

/** Whether a lower-case word looks like a past-tense verb: a regular -ed form or a common irregular one. */
export function looksPast(w: string): boolean {
  return (w.length > 3 && w.endsWith('ed')) || IRREGULAR_PASTS.has(w);
}
