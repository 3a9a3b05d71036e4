/**
 * npx node bench/eval-dialogue.ts [--json] [--errors]
 *
 * Speaker and addressee attribution scored against hand-annotated gold lists
 * of original texts in tests/fixtures/dialogue/:
 *   - corran-reach: the main evaluation text (double marks, several chapters,
 *     seven characters, every convention the quotation finder reads);
 *   - saltings: a smaller held-out text in another style (single marks with
 *     double marks inside, British punctuation), written before the rules
 *     were tuned on the main text;
 *   - lantern-row: a third small text (straight marks, introductions, a
 *     female captain), written after the rules were tuned;
 *   - harrow: a fourth (colon tags, a three-way scene, a speaker outside the
 *     cast), written last.
 * Prints accuracy over spoken quotations with a cast speaker, accuracy per
 * rule, the null rate and addressee accuracy. --errors lists every wrong or
 * null speaker.
 */
import { readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { parse as parseYaml } from 'yaml';
import type { CastMember } from '../pipeline/text/model.ts';
import { evaluateText, type EvalFigures } from '../pipeline/dialogue/evaluate.ts';

const root = resolve(import.meta.dirname, '..');
const dir = join(root, 'tests/fixtures/dialogue');
const json = process.argv.includes('--json');
const showErrors = process.argv.includes('--errors');

/** Evaluate one fixture text by its base name. */
export function evaluateFixture(name: string): EvalFigures {
  const text = readFileSync(join(dir, `${name}.txt`), 'utf8');
  const cast = (parseYaml(readFileSync(join(dir, `${name}.cast.yaml`), 'utf8')) as CastMember[]).map((c) => ({ ...c, aliases: c.aliases ?? [] }));
  const gold = readFileSync(join(dir, `${name}.gold.tsv`), 'utf8');
  return evaluateText(text, cast, gold);
}

const pct = (x: number): string => `${(x * 100).toFixed(1)}%`;

function report(name: string, f: EvalFigures): void {
  console.log(`\n${name}`);
  console.log(`  quotations: ${f.gold} in the gold list, ${f.matched} found (${f.missed.length} missed, ${f.extra} found that the gold list lacks)`);
  console.log(`  speakers:   ${pct(f.speakers.accuracy)} correct (${f.speakers.correct}/${f.speakers.total} spoken quotations with a cast speaker)`);
  console.log(`  null rate:  ${pct(f.speakers.nullRate)} (${f.speakers.nulls} left without a speaker)`);
  console.log(`  outsiders:  ${f.outsiders.nulls}/${f.outsiders.total} quotations by someone outside the cast left null`);
  console.log(`  addressees: ${pct(f.addressees.accuracy)} correct (${f.addressees.correct}/${f.addressees.total}; ${f.addressees.nulls} null)`);
  console.log(`  kinds:      ${pct(f.kinds.accuracy)} (speech or written words)`);
  console.log('  per rule:');
  for (const [rule, s] of Object.entries(f.perRule).sort((a, b) => b[1].total - a[1].total)) {
    console.log(`    ${rule.padEnd(12)} ${String(s.correct).padStart(4)}/${String(s.total).padEnd(4)} ${pct(s.accuracy)}`);
  }
  if (showErrors) {
    for (const e of f.errors) console.log(`    #${e.n} ch.${e.chapter} “${e.firstWords}” gold ${e.gold} got ${e.got ?? 'null'} (${e.rule} ${e.confidence})`);
    for (const m of f.missed) console.log(`    missed #${m.n} ch.${m.chapter} “${m.firstWords}”`);
  }
}

if (import.meta.main) {
  const texts = [
    ['main', 'corran-reach', 'Main evaluation text'],
    ['heldOut', 'saltings', 'Held-out text'],
    ['third', 'lantern-row', 'Third text'],
    ['fourth', 'harrow', 'Fourth text'],
  ] as const;
  const figures = texts.map(([key, file, title]) => ({ key, file, title, f: evaluateFixture(file) }));
  if (json) {
    console.log(JSON.stringify(Object.fromEntries(figures.map((x) => [x.key, { ...x.f, errors: x.f.errors.length }])), null, 2));
  } else {
    for (const x of figures) report(`${x.title} (${x.file})`, x.f);
  }
}
