// Positions: the YAML 1.2 spec's positions are 1-based lines/cols as editors show them — common practice, no source.
// Every expected line:col below was counted by hand on the fixture or on the lines written in the test.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterEach, describe, expect, it } from 'vitest';
import { loadPlan } from '../../pipeline/plan/load.ts';
import { formatProblem } from '../../pipeline/problems/problem.ts';
import type { Problem } from '../../pipeline/problems/problem.ts';
import { fakeRegistry } from './fake-registry.ts';
import { baseFiles, tempExhibit } from './temp-exhibit.ts';
import type { TempExhibit } from './temp-exhibit.ts';

const repo = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const fixtures = path.join(repo, 'tests/fixtures/plans');

const brief = (p: Problem) => [p.line, p.column, p.path, p.code, p.severity];

let temp: TempExhibit | undefined;
afterEach(async () => {
  await temp?.remove();
  temp = undefined;
});

describe('the exact form of a problem', () => {
  it('gives file:line:col, the path, the message and a did-you-mean for a misspelt measure', async () => {
    // The plan is content/exhibit.yaml under the working directory; line 31 is
    // "    measure: presense": "measure" starts in column 5, its value in column 14.
    const result = await loadPlan('content/exhibit.yaml', fakeRegistry, { cwd: path.join(fixtures, 'example') });
    expect(result.plan).toBeNull();
    expect(result.problems).toHaveLength(1);
    expect(result.problems[0]).toEqual({
      severity: 'error',
      code: 'plan/unknown-measure',
      file: 'content/exhibit.yaml',
      line: 31,
      column: 14,
      path: 'rooms[1].panels[2].measure',
      message: 'unknown measure "presense"',
      hint: 'did you mean "presence"?',
    });
    expect(formatProblem(result.problems[0])).toBe(
      'content/exhibit.yaml:31:14 rooms[1].panels[2].measure: unknown measure "presense" — did you mean "presence"?',
    );
  });
});

describe('YAML syntax errors', () => {
  it('points at a tab used for indentation and says what to do', async () => {
    // Source: YAML 1.2.2 spec §6.1 "Indentation Spaces" — tabs must not be used in indentation; from memory.
    temp = await tempExhibit(['version: 1', 'exhibit:', '  title: The Ferryman\'s Ledger', '\torganiser: The Quayside Reading Circle'], baseFiles);
    const result = await loadPlan(temp.plan, fakeRegistry, { cwd: temp.root });
    expect(result.plan).toBeNull();
    expect(result.problems).toHaveLength(1);
    expect(formatProblem(result.problems[0])).toBe(
      'content/exhibit.yaml:4:1: the YAML is not well-formed here: a tab is used for indentation — indent with spaces',
    );
    expect(result.problems[0].code).toBe('plan/yaml-syntax');
  });

  it('points at a quoted value left open', async () => {
    temp = await tempExhibit(['version: 1', 'exhibit:', '  title: "The Ferryman\'s Ledger', '  organiser: The Quayside Reading Circle'], baseFiles);
    const result = await loadPlan(temp.plan, fakeRegistry, { cwd: temp.root });
    expect(result.plan).toBeNull();
    const open = result.problems.find((p) => p.message.includes('quoted value is not closed'));
    // The parser only finds out at the end of the file (line 5, column 1, after the last newline).
    expect(open).toMatchObject({ line: 5, column: 1, code: 'plan/yaml-syntax', hint: 'add the closing quote' });
  });

  it('reports a duplicate key at the second occurrence, with its path', async () => {
    // Source: YAML 1.2.2 spec §3.2.1.1 "Nodes" — the keys of a mapping are unique; from memory.
    temp = await tempExhibit(
      [
        'version: 1', //                                  1
        'exhibit:', //                                    2
        "  title: The Ferryman's Ledger", //              3
        '  organiser: The Quayside Reading Circle', //    4
        '  title: The Ledger Again', //                   5
        'texts:',
        '  - id: ledger',
        '    source: texts/ledger.txt',
        'rooms:',
        '  - id: shape',
        '    title: Shape',
        '    panels:',
        '      - id: lengths',
        '        title: Lengths',
        '        measure: structure',
        '        chart: bars',
        '        caption: captions/a.mdx',
      ],
      baseFiles,
    );
    const result = await loadPlan(temp.plan, fakeRegistry, { cwd: temp.root });
    expect(result.plan).toBeNull();
    expect(result.problems.map(brief)).toEqual([[5, 3, 'exhibit.title', 'plan/duplicate-key', 'error']]);
    expect(result.problems[0].message).toBe('the key "title" appears twice in the same mapping');
  });
});

describe('several problems in one run', () => {
  // tests/fixtures/plans/errors/exhibit.yaml, counted by hand:
  //  3  "  organiser: …"                          exhibit has no title: point at the mapping (col 3)
  //  9  "    source: ../secret.txt"               value at col 13
  // 16  "    aliases: [Miss Brannock]"            "Miss" at col 15 (a warning)
  // 17  "  - id: tam"                              cast entry without name: mapping at col 5
  // 28  "        options: { colour: red, sortd: true }"   "colour" col 20, "sortd" col 33
  // 29  "        caption: captions/missing.mdx"  value at col 18
  // 35  "        text: legder"                    value at col 15
  // 36  "        measure: presense"               value at col 18
  // 39  "      - id: entry-lengths"               value at col 13 (second use of the id)
  // 45  "          windw: 3"                       key at col 11
  // 46  "        chart: pie"                      value at col 16
  // 47  "        caption: captions/people.txt"   value at col 18
  it('reports every problem, sorted by line, each at its place', async () => {
    const result = await loadPlan('tests/fixtures/plans/errors/exhibit.yaml', fakeRegistry, { cwd: repo });
    expect(result.plan).toBeNull();
    expect(result.problems.map(brief)).toEqual([
      [3, 3, 'exhibit.title', 'plan/missing-key', 'error'],
      [9, 13, 'texts[1].source', 'plan/path-outside', 'error'],
      [16, 15, 'cast[1].aliases[0]', 'plan/shared-alias', 'warning'],
      [17, 5, 'cast[2].name', 'plan/missing-key', 'error'],
      [28, 20, 'rooms[0].panels[0].options.colour', 'plan/unknown-option', 'error'],
      [28, 33, 'rooms[0].panels[0].options.sortd', 'plan/unknown-option', 'error'],
      [29, 18, 'rooms[0].panels[0].caption', 'plan/missing-file', 'error'],
      [35, 15, 'rooms[1].panels[0].text', 'plan/unknown-text', 'error'],
      [36, 18, 'rooms[1].panels[0].measure', 'plan/unknown-measure', 'error'],
      [39, 13, 'rooms[1].panels[1].id', 'plan/duplicate-id', 'error'],
      [45, 11, 'rooms[1].panels[1].params.windw', 'plan/unknown-param', 'error'],
      [46, 16, 'rooms[1].panels[1].chart', 'plan/unknown-chart', 'error'],
      [47, 18, 'rooms[1].panels[1].caption', 'plan/not-mdx', 'error'],
    ]);
    for (const p of result.problems) expect(p.file).toBe('tests/fixtures/plans/errors/exhibit.yaml');
  });

  it('words each one so the curator knows what to do', async () => {
    const result = await loadPlan('tests/fixtures/plans/errors/exhibit.yaml', fakeRegistry, { cwd: repo });
    const lines = result.problems.map(formatProblem);
    const file = 'tests/fixtures/plans/errors/exhibit.yaml';
    expect(lines).toContain(`${file}:3:3 exhibit.title: "title" is missing — add "title:" here (Title of the exhibit, at most 200 characters. Required.)`);
    expect(lines).toContain(
      `${file}:9:13 texts[1].source: the text path "../secret.txt" leads outside the exhibit folder — paths must stay inside the exhibit folder (tests/fixtures/plans/errors); move the file into it and write the path relative to it`,
    );
    expect(lines).toContain(`${file}:28:33 rooms[0].panels[0].options.sortd: unknown option "sortd" for chart "bars" — did you mean "sorted"?`);
    expect(lines).toContain(
      `${file}:28:20 rooms[0].panels[0].options.colour: unknown option "colour" for chart "bars" — the options of "bars" are: "orientation", "sorted"`,
    );
    expect(lines).toContain(
      `${file}:29:18 rooms[0].panels[0].caption: the caption file "captions/missing.mdx" does not exist — looked for tests/fixtures/plans/errors/captions/missing.mdx; create it or correct the path`,
    );
    expect(lines).toContain(`${file}:35:15 rooms[1].panels[0].text: unknown text "legder" — did you mean "ledger"?`);
    expect(lines).toContain(
      `${file}:39:13 rooms[1].panels[1].id: the panel id "entry-lengths" is used more than once — it is first used on line 23; give each panel its own id`,
    );
    expect(lines).toContain(
      `${file}:46:16 rooms[1].panels[1].chart: unknown chart "pie" — "frequency" can be drawn as: "bars", "lines", "strip"`,
    );
    const shared = result.problems.find((p) => p.code === 'plan/shared-alias')!;
    expect(shared.message).toBe('the name "Miss Brannock" is given to both "orla" and "wren"');
    expect(shared.hint).toMatch(/ambiguous/);
  });
});

describe('a missing required key', () => {
  it('points at the mapping that lacks it', async () => {
    temp = await tempExhibit(
      [
        'version: 1',
        'exhibit:',
        "  title: The Ferryman's Ledger",
        '  organiser: The Quayside Reading Circle',
        'texts:',
        '  - id: ledger',
        '    source: texts/ledger.txt',
        'rooms:', //                           8
        '  - id: shape', //                    9
        '    title: Shape', //                 10
        '    panels:', //                      11
        '      - id: lengths', //              12: the panel mapping starts at col 9
        '        measure: structure',
        '        chart: bars',
        '        caption: captions/a.mdx',
      ],
      baseFiles,
    );
    const result = await loadPlan(temp.plan, fakeRegistry, { cwd: temp.root });
    expect(result.plan).toBeNull();
    expect(result.problems).toHaveLength(1);
    expect(result.problems[0]).toMatchObject({
      line: 12,
      column: 9,
      path: 'rooms[0].panels[0].title',
      code: 'plan/missing-key',
      message: '"title" is missing',
    });
    expect(result.problems[0].hint).toContain('Title of the panel');
  });

  it('points at the key when its value is left empty', async () => {
    temp = await tempExhibit(['version: 1', 'exhibit:', '  title:', '  organiser: The Quayside Reading Circle'], baseFiles);
    const result = await loadPlan(temp.plan, fakeRegistry, { cwd: temp.root });
    const title = result.problems.find((p) => p.path === 'exhibit.title')!;
    expect(title).toMatchObject({ line: 3, column: 3, code: 'plan/wrong-type', message: 'expected text, found an empty value' });
    // texts and rooms are missing from the top-level mapping, which starts at 1:1.
    expect(result.problems.filter((p) => p.code === 'plan/missing-key').map(brief)).toEqual([
      [1, 1, 'texts', 'plan/missing-key', 'error'],
      [1, 1, 'rooms', 'plan/missing-key', 'error'],
    ]);
  });
});
