/**
 * Local timing check (not part of the test suite): tags a ~790k-word text
 * (the King James Bible from Debian's bible-kjv package, `bible -f
 * 'gen1:1-rev22:21'`) with `tagModel`, beside wink's own tokenise-and-tag
 * pass over the same text with the same pipe (`readDoc`, then the tags read
 * out), done two ways: as one document, and as the same sentence chunks
 * `tagModel` reads. Prints median wall and CPU times, the ratios, and the peak
 * memory of each pass (each in its own child process).
 * Run: npx node tests/nlp/timing.local.ts
 */
import { execFileSync, spawnSync } from 'node:child_process';
import type { ItsFunction } from 'wink-nlp';
import { buildTextModel } from '../../pipeline/text/build.ts';
import type { TextModel } from '../../pipeline/text/model.ts';
import { sentenceChunks, tagModel } from '../../pipeline/nlp/tag.ts';
import { wink } from '../../pipeline/nlp/wink.ts';

function bibleText(): string {
  try {
    return execFileSync('bible', ['-f', 'gen1:1-rev22:21'], {
      encoding: 'utf8',
      maxBuffer: 64 * 1024 * 1024,
      stdio: ['ignore', 'pipe', 'ignore'],
    });
  } catch {
    console.error('This check needs the bible-kjv package (the `bible` command).');
    process.exit(1);
  }
}

type Pass = 'whole' | 'chunks' | 'ours';

function run(pass: Pass, model: TextModel): number {
  const { nlp, its } = wink();
  const tagsOf = (text: string): number =>
    (
      nlp
        .readDoc(text)
        .tokens()
        .out(its.pos as ItsFunction<string>) as string[]
    ).length;
  if (pass === 'whole') return tagsOf(model.text);
  if (pass === 'chunks') return sentenceChunks(model).reduce((n, c) => n + tagsOf(model.text.slice(c.start, c.end)), 0);
  // A shallow copy is a new key for the per-model memo, so every run tags afresh.
  return tagModel({ ...model }).pos.length;
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)]!;
}

const cpuMs = (): number => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
};

const arg = process.argv[2];
const model = buildTextModel(bibleText(), { id: 'bible' });

if (arg?.startsWith('--peak-')) {
  wink();
  const before = process.resourceUsage().maxRSS;
  run(arg.slice('--peak-'.length) as Pass, model);
  console.log(JSON.stringify({ before: before / 1024, peak: process.resourceUsage().maxRSS / 1024 }));
  process.exit(0);
}

const t0 = performance.now();
wink();
const loadMs = performance.now() - t0;
const passes: Pass[] = ['whole', 'chunks', 'ours'];
const wall: Record<Pass, number[]> = { whole: [], chunks: [], ours: [] };
const cpu: Record<Pass, number[]> = { whole: [], chunks: [], ours: [] };
for (const p of passes) run(p, model); // warm-up
for (let r = 0; r < 5; r++) {
  for (const p of passes) {
    const w = performance.now();
    const c = cpuMs();
    run(p, model);
    cpu[p].push(cpuMs() - c);
    wall[p].push(performance.now() - w);
  }
}
const label: Record<Pass, string> = { whole: 'wink, one document  ', chunks: 'wink, same chunks   ', ours: 'tagModel            ' };
console.log(
  `${model.text.length.toLocaleString('en-GB')} characters, ${model.tokens.count.toLocaleString('en-GB')} word tokens, ${sentenceChunks(model).length} chunks`,
);
console.log(`model load ${loadMs.toFixed(0)} ms (once per process)`);
for (const p of passes) console.log(`${label[p]} wall ${median(wall[p]).toFixed(0)} ms · CPU ${median(cpu[p]).toFixed(0)} ms`);
for (const base of ['whole', 'chunks'] as const) {
  console.log(
    `tagModel ÷ wink (${base}): wall ${(median(wall.ours) / median(wall[base])).toFixed(2)}× · CPU ${(median(cpu.ours) / median(cpu[base])).toFixed(2)}×`,
  );
}
for (const p of passes) {
  const r = spawnSync(process.execPath, [import.meta.filename, `--peak-${p}`], { encoding: 'utf8' });
  const { before, peak } = JSON.parse(r.stdout) as { before: number; peak: number };
  console.log(`peak RSS, ${label[p]}: ${peak.toFixed(0)} MB (${before.toFixed(0)} MB before the pass: Node, text model, wink model)`);
}
