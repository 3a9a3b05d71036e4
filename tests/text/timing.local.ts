/**
 * Local timing check (not part of the test suite): builds the text model and
 * the cast mentions of a generated ~790k-word, hard-wrapped, CRLF text and
 * prints wall and CPU times. Run: npx node tests/text/timing.local.ts
 */
import { buildTextModel } from '../../pipeline/text/build.ts';
import { findMentions } from '../../pipeline/text/mentions.ts';

function generatedText(targetWords: number): string {
  let seed = 42;
  const rnd = (): number => (seed = (seed * 1103515245 + 12345) & 0x7fffffff) / 0x7fffffff;
  const syllables = ['ra', 'len', 'mo', 'ta', 'vik', 'sor', 'el', 'an', 'ber', 'lo', 'quin', 'da', 'fe', 'nor', 'wick', 'ul', 'é', 'ør'];
  // 30,000 distinct invented words (index written in base 18 with syllables as digits), a few names first.
  const vocab: string[] = ['the', 'and', 'Mr.', 'Ada', 'Fenwick', 'don’t', 'well-kept', 'Tolley', '“Go!”', '1,000'];
  for (let i = 1; i <= 30000; i++) {
    let w = '';
    for (let n = i; n > 0; n = Math.floor(n / syllables.length)) w += syllables[n % syllables.length];
    vocab.push(w);
  }
  const lines: string[] = [];
  let words = 0;
  let chapter = 0;
  while (words < targetWords) {
    if (words >= chapter * 20000) lines.push(`CHAPTER ${++chapter}.`, '');
    let line = '';
    let inSentence = 0;
    for (let i = 0, n = 40 + Math.floor(rnd() * 120); i < n; i++, words++) {
      let w = vocab[Math.floor(rnd() ** 2.5 * vocab.length)];
      if (inSentence++ === 0) w = w[0].toUpperCase() + w.slice(1);
      if (inSentence > 8 && rnd() < 0.15) {
        w += rnd() < 0.8 ? '.' : '?';
        inSentence = 0;
      } else if (rnd() < 0.08) w += ',';
      if (line.length + w.length > 70) {
        lines.push(line);
        line = '';
      }
      line += (line ? ' ' : '') + w;
    }
    lines.push(`${line}.`, '');
  }
  return lines.join('\r\n');
}

const source = generatedText(790_000);
console.log(`${source.length.toLocaleString('en-GB')} characters`);
for (let run = 1; run <= 3; run++) {
  const cpu = process.cpuUsage();
  const t0 = performance.now();
  const model = buildTextModel(source, { id: 'timing' });
  const t1 = performance.now();
  const used = process.cpuUsage(cpu);
  const mentions = findMentions(model, [
    { id: 'ada', name: 'Ada Fenwick', aliases: [], pronoun: 'she' },
    { id: 'jrt', name: 'J. R. Tolley', aliases: [], pronoun: 'he' },
  ]);
  const t2 = performance.now();
  console.log(
    `run ${run}: model ${(t1 - t0).toFixed(0)} ms (CPU ${((used.user + used.system) / 1000).toFixed(0)} ms), mentions ${(t2 - t1).toFixed(0)} ms; ` +
      `${model.tokens.count.toLocaleString('en-GB')} tokens, ${model.sentences.count.toLocaleString('en-GB')} sentences, ` +
      `${model.chapters.length} chapters, ${model.vocab.length.toLocaleString('en-GB')} types, ${mentions.count} mentions`,
  );
}
