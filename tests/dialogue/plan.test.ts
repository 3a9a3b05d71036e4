// Positions: 1-based lines and columns as editors show them — common practice, no source.
// Plans are written as arrays of lines: line N of the plan is element N-1.
import { afterEach, describe, expect, it } from 'vitest';
import { loadPlan } from '../../pipeline/plan/load.ts';
import type { PlanResult } from '../../pipeline/plan/load.ts';
import { fakeRegistry } from '../plan/fake-registry.ts';
import { baseFiles, tempExhibit } from '../plan/temp-exhibit.ts';

const cleanups: (() => Promise<void>)[] = [];
afterEach(async () => {
  for (const clean of cleanups.splice(0)) await clean();
});

async function load(dialogue: readonly string[]): Promise<PlanResult> {
  const lines = [
    'version: 1', //                                 1
    'exhibit:', //                                   2
    '  title: The Ferryman’s Ledger', //             3
    '  organiser: The Quayside Reading Circle', //   4
    'texts:', //                                     5
    '  - id: ledger', //                             6
    '    source: texts/ledger.txt', //               7
    '    dialogue:', //                              8
    ...dialogue.map((l) => `      ${l}`), //        9…
    'cast:',
    '  - { id: ada, name: Ada Fenn }',
    'rooms:',
    '  - id: shape',
    '    title: Shape',
    '    panels:',
    '      - { id: lengths, title: Lengths, measure: structure, chart: bars, caption: captions/a.mdx }',
  ];
  const temp = await tempExhibit(lines, baseFiles);
  cleanups.push(temp.remove);
  return loadPlan(temp.plan, fakeRegistry, { cwd: temp.root });
}

const errors = (r: PlanResult) => r.problems.filter((p) => p.severity === 'error').map((p) => [p.line, p.column, p.path, p.code, p.message, p.hint]);

describe('the plan fixes the speech marks and the narrator', () => {
  it('accepts one name for the text, or a default and chapters', async () => {
    for (const marks of [['marks: single'], ['marks: { default: double, chapters: { 3: single, 7: dash } }'], ['marks:', '  chapters:', '    2: guillemets']]) {
      const r = await load(marks);
      expect(errors(r)).toEqual([]);
    }
    const r = await load(['marks: { chapters: { 3: single } }', 'narrator: ada']);
    expect(r.plan!.texts[0].dialogue).toMatchObject({ marks: { default: 'auto', chapters: { 3: 'single' } }, narrator: 'ada' });
  });

  it('names the line and column of a misspelt convention, with the accepted names', async () => {
    const r = await load(['marks: sinlge']);
    expect(errors(r)).toEqual([[9, 14, 'texts[0].dialogue.marks', 'plan/invalid-value', 'the text "sinlge" is not one of the accepted values', expect.stringContaining('did you mean "single"?')]]);
  });

  it('refuses a chapter that is not a number, and a narrator outside the cast', async () => {
    const r = await load(['marks: { chapters: { three: single, 4: dashes } }', 'narrator: hugh']);
    expect(errors(r)).toEqual([
      [9, 35, 'texts[0].dialogue.marks.chapters.three', 'plan/invalid-key', expect.stringContaining('a chapter is named by its number'), expect.any(String)],
      [9, 46, 'texts[0].dialogue.marks.chapters["4"]', 'plan/invalid-value', expect.any(String), expect.stringContaining('did you mean "dash"?')],
      [10, 17, 'texts[0].dialogue.narrator', 'plan/unknown-cast', 'unknown cast member "hugh"', 'the cast ids are: "ada"'],
    ]);
  });
});
