// The dialogue readings end to end, through the CLI as a curator runs it, on the project's own original
// evaluation texts (tests/fixtures/dialogue). Which marks each chapter uses is how the texts were written.
import { describe, it, expect, afterAll } from 'vitest';
import { copyFileSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';
import { ROOT, vitrine } from './helpers.ts';

const scratch: string[] = [];
afterAll(() => {
  for (const d of scratch) rmSync(d, { recursive: true, force: true });
});

const fixtures = join(ROOT, 'tests/fixtures/dialogue');

/** A one-panel exhibit reading `name` from the dialogue fixtures, with `dialogue` lines under the text. */
function exhibit(name: string, dialogue: string[] = []): string {
  const dir = mkdtempSync(join(tmpdir(), 'vitrine-dialogue-'));
  scratch.push(dir);
  mkdirSync(join(dir, 'texts'));
  mkdirSync(join(dir, 'captions'));
  copyFileSync(join(fixtures, `${name}.txt`), join(dir, 'texts', `${name}.txt`));
  writeFileSync(join(dir, 'captions', 'speech.mdx'), 'Who speaks.\n');
  const plan = join(dir, 'exhibit.yaml');
  writeFileSync(
    plan,
    [
      'version: 1',
      'exhibit: { title: Dialogue, organiser: The Quayside Reading Circle }',
      'texts:',
      `  - id: t`,
      `    source: texts/${name}.txt`,
      ...(dialogue.length ? ['    dialogue:', ...dialogue.map((l) => `      ${l}`)] : []),
      'cast:',
      ...require_cast(name),
      'rooms:',
      '  - id: voices',
      '    title: Voices',
      '    panels:',
      '      - { id: who-speaks, title: Who speaks, measure: speech, chart: bars, caption: captions/speech.mdx }',
      '',
    ].join('\n'),
  );
  return plan;
}

/** The fixture's cast, as plan lines under "cast:". */
function require_cast(name: string): string[] {
  return readFileSync(join(fixtures, `${name}.cast.yaml`), 'utf8')
    .split('\n')
    .filter((l) => l.trim() !== '' && !l.startsWith('#'))
    .map((l) => `  ${l}`);
}

describe('vitrine check reads the speech marks chapter by chapter', () => {
  it('prints the marks of each chapter, and of the scene that switches', () => {
    const r = vitrine(['check', exhibit('harbour-book')]);
    expect(r.status).toBe(0);
    const out = r.stdout;
    expect(out).toMatch(/1\. Chapter I: The Pilot's Wife\b.*\n\s+speech in double marks “…” \(read from its marks\)/);
    expect(out).toMatch(/2\. Chapter II: The Captain's Visit\b.*\n\s+speech in single marks ‘…’ \(read from its marks\)/);
    expect(out).toMatch(/3\. Chapter III: The Steam Boat\b.*\n\s+speech in double marks “…” \(read from its marks\)\n\s+from paragraph 1 \(line \d+\): double marks “…”.*\n\s+from paragraph \d+ \(line \d+\): single marks ‘…’ \(read from its marks\)/);
    expect(out).toMatch(/4\. Chapter IV: .*\n\s+speech in guillemets «…»/);
    expect(out).toMatch(/5\. Chapter V: .*\n\s+speech in low-high marks „…“/);
  });

  it('warns where a chapter fixed in the plan has marks but no speech, and refuses a chapter the text lacks', () => {
    const warned = vitrine(['check', exhibit('harbour-book', ['marks: { chapters: { 4: double } }'])]);
    expect(warned.status).toBe(0);
    expect(warned.stderr + warned.stdout).toMatch(/harbour-book\.txt:\d+.*chapter 4, paragraph \d+: this chapter has \d+ quotation marks or dashes, but no speech was found in it when read as double marks/);
    const refused = vitrine(['check', exhibit('harbour-book', ['marks: { chapters: { 9: single } }'])]);
    expect(refused.status).toBe(1);
    expect(refused.stderr).toMatch(/exhibit\.yaml:\d+:\d+ texts\[0\]\.dialogue\.marks\.chapters\["9"\]: chapter 9 is named in dialogue\.marks, but .* has 5 chapters/);
  });

  it('lists the speakers outside the cast heard most often', () => {
    const r = vitrine(['check', exhibit('cobb-fair', ['narrator: hugh'])]);
    expect(r.status).toBe(0);
    const listed = /Speakers outside the cast .*:\n\s+(.*)/.exec(r.stdout)?.[1] ?? '';
    expect(listed).toMatch(/^the second fisherman ×3, /);
    for (const who of ['the first fisherman', 'the old lady', 'a boy', 'the landlord']) expect(listed).toContain(`${who} ×`);
  });
});

describe('vitrine measure --measure speech keeps its JSON contract', () => {
  it('gives every quotation text, speaker, addressee, chapter, turn, rule and confidence, and outsiders by description', () => {
    const r = vitrine(['measure', '--text', join(fixtures, 'cobb-fair.txt'), '--cast', join(fixtures, 'cobb-fair.cast.yaml'), '--measure', 'speech']);
    expect(r.status).toBe(0);
    const data = JSON.parse(r.stdout);
    for (const q of data.quotes) {
      expect(Object.keys(q)).toEqual(expect.arrayContaining(['text', 'speaker', 'addressee', 'chapter', 'turn', 'rule', 'confidence', 'outsider']));
    }
    // "Gingerbread, sir!": the boy with the tray, outside the cast.
    const boy = data.quotes.find((q: { text: string }) => q.text.startsWith('Gingerbread, sir!'));
    expect(boy).toMatchObject({ speaker: null, rule: 'outsider', outsider: 'a boy', chapter: 1, turn: expect.any(Number) });
    expect(data.outsiders.map((o: { name: string }) => o.name)).toEqual(expect.arrayContaining(['the first fisherman', 'the second fisherman', 'the old lady']));
  });
});
