// Positions: the YAML 1.2 spec's positions are 1-based lines/cols as editors show them — common practice, no source.
// Plans are written as arrays of lines: line N of the plan is element N-1.
import { mkdir, mkdtemp, rm, symlink, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { loadPlan } from '../../pipeline/plan/load.ts';
import type { PlanResult } from '../../pipeline/plan/load.ts';
import type { Problem } from '../../pipeline/problems/problem.ts';
import { fakeRegistry } from './fake-registry.ts';
import { baseFiles, tempExhibit } from './temp-exhibit.ts';
import type { TempExhibit } from './temp-exhibit.ts';

const cleanups: (() => Promise<void>)[] = [];
afterEach(async () => {
  for (const clean of cleanups.splice(0)) await clean();
});

async function load(lines: readonly string[], files: Record<string, string> = baseFiles): Promise<PlanResult & { temp: TempExhibit }> {
  const temp = await tempExhibit(lines, files);
  cleanups.push(temp.remove);
  return { ...(await loadPlan(temp.plan, fakeRegistry, { cwd: temp.root })), temp };
}

const head = [
  'version: 1', //                                 1
  'exhibit:', //                                   2
  "  title: The Ferryman's Ledger", //             3
  '  organiser: The Quayside Reading Circle', //   4
  'texts:', //                                     5
  '  - id: ledger', //                             6
  '    source: texts/ledger.txt', //               7
];

/**
 * A one-panel room. After `head` its lines are: 8 "rooms:", 9 "  - id: shape",
 * 10 title, 11 "    panels:", 12 "      - id: lengths", then `panelLines` from line 13.
 */
function room(panelLines: readonly string[]): string[] {
  return ['rooms:', '  - id: shape', '    title: Shape', '    panels:', '      - id: lengths', ...panelLines];
}

const where = (p: Problem) => [p.line, p.column, p.path, p.code];
const errors = (r: PlanResult) => r.problems.filter((p) => p.severity === 'error');

describe('texts named by panels', () => {
  it('uses the only text when a panel names none', async () => {
    const r = await load([...head, ...room(['        title: Lengths', '        measure: structure', '        chart: bars', '        caption: captions/a.mdx'])]);
    expect(r.problems).toEqual([]);
    expect(r.plan!.panels[0].text).toBe('ledger');
  });

  it('requires a text on each panel when there are several', async () => {
    const r = await load([
      ...head,
      '  - id: almanac', //                          8
      '    source: texts/almanac.txt', //            9
      ...room(['        title: Lengths', '        measure: structure', '        chart: bars', '        caption: captions/a.mdx']),
      // rooms: 10, "  - id: shape" 11, title 12, panels 13, "      - id: lengths" 14
    ]);
    expect(errors(r).map(where)).toEqual([[14, 9, 'rooms[0].panels[0].text', 'plan/missing-text']]);
    expect(r.problems[0].hint).toBe('add "text:" with one of: "ledger", "almanac"');
    expect(r.plan).toBeNull();
  });
});

describe('measures and charts from the registry', () => {
  it('lists the valid measures when no name is close', async () => {
    const r = await load([...head, ...room(['        title: Lengths', '        measure: sentiment', '        chart: bars', '        caption: captions/a.mdx'])]);
    // Line 14 is "        measure: sentiment": value at col 18.
    expect(errors(r).map(where)).toEqual([[14, 18, 'rooms[0].panels[0].measure', 'plan/unknown-measure']]);
    expect(r.problems[0].hint).toBe('the measures are: "frequency", "presence", "structure"');
  });

  it('says which charts a measure supports', async () => {
    const r = await load([...head, ...room(['        title: Lengths', '        measure: structure', '        chart: strip', '        caption: captions/a.mdx'])]);
    // Line 15 is "        chart: strip": value at col 16.
    expect(errors(r).map(where)).toEqual([[15, 16, 'rooms[0].panels[0].chart', 'plan/chart-not-supported']]);
    expect(r.problems[0].message).toBe('the measure "structure" cannot be drawn as "strip"');
    expect(r.problems[0].hint).toBe('it can be drawn as: "bars", "lines"');
  });

  it('suggests a close chart name', async () => {
    const r = await load([...head, ...room(['        title: Lengths', '        measure: structure', '        chart: line', '        caption: captions/a.mdx'])]);
    expect(errors(r).map((p) => [p.message, p.hint])).toEqual([['unknown chart "line"', 'did you mean "lines"?']]);
  });

  it('refuses a measure that needs a cast when the plan has none', async () => {
    const r = await load([...head, ...room(['        title: Who', '        measure: presence', '        chart: strip', '        caption: captions/a.mdx'])]);
    // Line 14 is "        measure: presence".
    expect(errors(r).map(where)).toEqual([[14, 18, 'rooms[0].panels[0].measure', 'plan/needs-cast']]);
  });

  it('checks params against the measure schema, at the offending value', async () => {
    const r = await load([
      ...head,
      ...room([
        '        title: Lengths', //          13
        '        measure: frequency', //      14
        '        params:', //                 15
        '          top: -2', //               16: value at col 16
        '          tpo: 4', //                17: key at col 11
        '        chart: bars', //             18
        '        caption: captions/a.mdx',
      ]),
    ]);
    expect(errors(r).map(where)).toEqual([
      [16, 16, 'rooms[0].panels[0].params.top', 'plan/too-small'],
      [17, 11, 'rooms[0].panels[0].params.tpo', 'plan/unknown-param'],
    ]);
    expect(r.problems[1].hint).toBe('did you mean "top"?');
  });

  it('checks option values against the chart schema', async () => {
    const r = await load([
      ...head,
      ...room(['        title: Lengths', '        measure: structure', '        chart: bars', '        options: { orientation: diagonal }', '        caption: captions/a.mdx']),
    ]);
    // Line 16 is "        options: { orientation: diagonal }": "diagonal" at col 33.
    expect(errors(r).map(where)).toEqual([[16, 33, 'rooms[0].panels[0].options.orientation', 'plan/invalid-value']]);
    expect(r.problems[0].hint).toBe('accepted: "horizontal", "vertical"');
  });
});

describe('the cast', () => {
  const castLines = [
    'cast:', //                                8
    '  - id: orla', //                         9
    '    name: Orla Brannock', //              10
    '    aliases: [Orla, Miss Brannock]', //   11
    '  - id: wren', //                         12
    '    name: Wren Brannock', //              13
    '    aliases: [Wren, Miss Brannock]', //   14: second "Miss Brannock" at col 21
  ];

  it('warns about a name shared by two characters, and still loads', async () => {
    const r = await load([
      ...head,
      ...castLines,
      ...room(['        title: Who', '        measure: presence', '        chart: strip', '        caption: captions/a.mdx']),
    ]);
    expect(r.problems.map(where)).toEqual([[14, 21, 'cast[1].aliases[1]', 'plan/shared-alias']]);
    expect(r.problems[0].severity).toBe('warning');
    expect(r.plan).not.toBeNull();
    expect(r.plan!.cast.map((c) => c.aliases)).toEqual([
      ['Orla', 'Miss Brannock'],
      ['Wren', 'Miss Brannock'],
    ]);
  });

  it('checks characters named by notes, with a did-you-mean', async () => {
    const r = await load([
      ...head,
      ...castLines,
      'rooms:', //                                      15
      '  - id: people', //                              16
      '    title: People', //                           17
      '    panels:', //                                 18
      '      - id: who', //                             19
      '        title: Who', //                          20
      '        measure: presence', //                   21
      '        chart: strip', //                        22
      '        caption: captions/a.mdx', //             23
      '        notes:', //                              24
      '          - at: { character: wrem }', //         25: "wrem" at col 30
      '            text: Wren takes the oars.', //      26
    ]);
    expect(errors(r).map(where)).toEqual([[25, 30, 'rooms[0].panels[0].notes[0].at.character', 'plan/unknown-cast']]);
    expect(r.problems.find((p) => p.code === 'plan/unknown-cast')!.hint).toBe('did you mean "wren"?');
  });
});

describe('ids', () => {
  it('refuses duplicated text, cast and room ids and reserved room ids', async () => {
    const r = await load([
      'version: 1',
      'exhibit:',
      "  title: The Ferryman's Ledger",
      '  organiser: The Quayside Reading Circle',
      'texts:',
      '  - id: ledger',
      '    source: texts/ledger.txt',
      '  - id: ledger', //                      8: value at col 9
      '    source: texts/almanac.txt',
      'cast:',
      '  - id: orla',
      '    name: Orla Brannock',
      '  - id: orla', //                        13
      '    name: Orla Quill',
      'rooms:',
      '  - id: methods', //                     16: reserved
      '    title: Methods',
      '    panels:',
      '      - { id: a, title: A, text: ledger, measure: structure, chart: bars, caption: captions/a.mdx }',
      '  - id: methods', //                     20: reserved and repeated
      '    title: Methods again',
      '    panels:',
      '      - { id: b, title: B, text: ledger, measure: structure, chart: bars, caption: captions/b.mdx }',
    ]);
    expect(errors(r).map(where)).toEqual([
      [8, 9, 'texts[1].id', 'plan/duplicate-id'],
      [13, 9, 'cast[1].id', 'plan/duplicate-id'],
      [16, 9, 'rooms[0].id', 'plan/invalid'],
      [20, 9, 'rooms[1].id', 'plan/invalid'],
      [20, 9, 'rooms[1].id', 'plan/duplicate-id'],
    ]);
    expect(r.problems[2].message).toBe('the room id "methods" is reserved for the site\'s own pages');
  });

  it('refuses ids that are not lower-case letters, digits and hyphens', async () => {
    const r = await load([...head.slice(0, 5), '  - id: Ledger_1', '    source: texts/ledger.txt']);
    const id = r.problems.find((p) => p.path === 'texts[0].id')!;
    expect(id).toMatchObject({ line: 6, column: 9, message: '"Ledger_1" is not a valid id' });
  });
});

describe('files', () => {
  const panel = (caption: string) => room(['        title: Lengths', '        measure: structure', '        chart: bars', `        caption: ${caption}`]);

  it('refuses an absolute path', async () => {
    const r = await load([...head, ...panel('/etc/hostname')]);
    // Line 16 is "        caption: /etc/hostname": value at col 18.
    expect(errors(r).map(where)).toEqual([[16, 18, 'rooms[0].panels[0].caption', 'plan/path-outside']]);
    expect(r.problems[0].hint).toMatch(/^paths must stay inside the exhibit folder \(content\)/);
  });

  it('refuses a symbolic link that leads outside the exhibit folder', async () => {
    const outside = await mkdtemp(path.join(tmpdir(), 'vitrine-outside-'));
    cleanups.push(() => rm(outside, { recursive: true, force: true }));
    await writeFile(path.join(outside, 'elsewhere.mdx'), 'Not part of the exhibit.\n');
    const temp = await tempExhibit([...head, ...panel('captions/linked.mdx')], baseFiles);
    cleanups.push(temp.remove);
    await symlink(path.join(outside, 'elsewhere.mdx'), path.join(temp.dir, 'captions/linked.mdx'));
    const r = await loadPlan(temp.plan, fakeRegistry, { cwd: temp.root });
    expect(errors(r).map(where)).toEqual([[16, 18, 'rooms[0].panels[0].caption', 'plan/path-outside']]);
    expect(r.problems[0].message).toContain('through a symbolic link');
  });

  it('accepts a symbolic link that stays inside', async () => {
    const temp = await tempExhibit([...head, ...panel('captions/alias.mdx')], baseFiles);
    cleanups.push(temp.remove);
    await symlink(path.join(temp.dir, 'captions/a.mdx'), path.join(temp.dir, 'captions/alias.mdx'));
    const r = await loadPlan(temp.plan, fakeRegistry, { cwd: temp.root });
    expect(r.problems).toEqual([]);
    expect(r.plan!.panels[0].caption.absolute).toBe(path.join(temp.dir, 'captions/alias.mdx'));
  });

  it('refuses a folder where a file is expected', async () => {
    const temp = await tempExhibit([...head, ...panel('captions/more.mdx')], baseFiles);
    cleanups.push(temp.remove);
    await mkdir(path.join(temp.dir, 'captions/more.mdx'));
    const r = await loadPlan(temp.plan, fakeRegistry, { cwd: temp.root });
    expect(errors(r).map(where)).toEqual([[16, 18, 'rooms[0].panels[0].caption', 'plan/not-a-file']]);
  });

  it('checks intro and rights files of the exhibit', async () => {
    const r = await load([
      'version: 1',
      'exhibit:',
      "  title: The Ferryman's Ledger",
      '  organiser: The Quayside Reading Circle',
      '  intro: captions/welcome.mdx', //    5: missing
      '  rights: ../rights.mdx', //          6: outside
      ...head.slice(4),
      ...panel('captions/a.mdx'),
    ]);
    expect(errors(r).map(where)).toEqual([
      [5, 10, 'exhibit.intro', 'plan/missing-file'],
      [6, 11, 'exhibit.rights', 'plan/path-outside'],
    ]);
  });
});

describe('plan-level checks', () => {
  it('suggests a close key for an unknown one', async () => {
    const r = await load([...head, ...room(['        titel: Lengths', '        measure: structure', '        chart: bars', '        caption: captions/a.mdx'])]);
    const unknown = r.problems.find((p) => p.code === 'plan/unknown-key')!;
    // Line 13 is "        titel: Lengths": key at col 9.
    expect(where(unknown)).toEqual([13, 9, 'rooms[0].panels[0].titel', 'plan/unknown-key']);
    expect(unknown.hint).toBe('did you mean "title"? ("title" is required)');
    // One fault, one message: the misspelt key is not also reported as "title" missing.
    expect(r.problems).toEqual([unknown]);
  });

  it('asks for quotes when a number stands where text is expected', async () => {
    const r = await load(['version: 1', 'exhibit:', '  title: 1848', '  organiser: The Quayside Reading Circle', ...head.slice(4)]);
    const title = r.problems.find((p) => p.path === 'exhibit.title')!;
    expect(title).toMatchObject({ line: 3, column: 10, message: 'expected text, found the number 1848', hint: 'put the value in quotes: "1848"' });
  });

  it('checks the version, the base path, the language code and the chapter pattern', async () => {
    const r = await load([
      'version: 2', //                         1: value col 10
      'exhibit:',
      "  title: The Ferryman's Ledger",
      '  organiser: The Quayside Reading Circle',
      '  language: English', //                5: value col 13
      '  base: site', //                       6: value col 9
      'texts:',
      '  - id: ledger',
      '    source: texts/ledger.txt',
      '    chapters: "^Entry (\\\\d+"', //       10: value col 15
      ...room(['        title: Lengths', '        measure: structure', '        chart: bars', '        caption: captions/a.mdx']),
    ]);
    expect(errors(r).map(where)).toEqual([
      [1, 10, 'version', 'plan/invalid-value'],
      [5, 13, 'exhibit.language', 'plan/bad-format'],
      [6, 9, 'exhibit.base', 'plan/bad-base'],
      [10, 15, 'texts[0].chapters', 'plan/invalid'],
    ]);
    expect(r.problems[3].message).toMatch(/^the chapter pattern is not a valid regular expression/);
  });

  it('says so when the plan file is empty or missing', async () => {
    const empty = await load(['# nothing yet']);
    expect(empty.problems.map((p) => [p.code, p.message])).toEqual([['plan/empty', 'the exhibit plan is empty']]);
    const missing = await loadPlan('content/nowhere.yaml', fakeRegistry, { cwd: empty.temp.root });
    expect(missing.plan).toBeNull();
    expect(missing.problems).toEqual([
      {
        severity: 'error',
        code: 'plan/unreadable',
        file: 'content/nowhere.yaml',
        message: 'cannot read the exhibit plan: the file does not exist',
        hint: 'check the path given to the command; the plan is normally content/exhibit.yaml',
      },
    ]);
  });

  it('requires exactly one target in a note', async () => {
    const r = await load([
      ...head,
      ...room([
        '        title: Lengths',
        '        measure: structure',
        '        chart: bars',
        '        caption: captions/a.mdx',
        '        notes:',
        '          - at: { chapter: 2, word: lamp }', //   18: the mapping at col 17
        '            text: Two things at once.',
      ]),
    ]);
    expect(errors(r).map(where)).toEqual([[18, 17, 'rooms[0].panels[0].notes[0].at', 'plan/invalid']]);
    expect(r.problems[0].hint).toBe('give exactly one of: chapter, character, word, segment');
  });
});
