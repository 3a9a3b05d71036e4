// Values a curator can get wrong without the YAML being wrong: blank names, runaway lengths,
// invisible direction controls, a base that is not a path; and one message per syntax fault.
// Plans are written as arrays of lines: line N of the plan is element N-1; columns counted by hand.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import fc from 'fast-check';
import { afterEach, describe, expect, it } from 'vitest';
import { loadPlan } from '../../pipeline/plan/load.ts';
import type { PlanResult } from '../../pipeline/plan/load.ts';
import { basePathProblem, LIMITS } from '../../pipeline/plan/schema.ts';
import { misleadingControl } from '../../pipeline/plan/check-ids.ts';
import { readPlanSource } from '../../pipeline/plan/source.ts';
import { formatProblem } from '../../pipeline/problems/problem.ts';
import type { Problem } from '../../pipeline/problems/problem.ts';
import { fakeRegistry } from './fake-registry.ts';
import { baseFiles, tempExhibit } from './temp-exhibit.ts';

const cleanups: (() => Promise<void>)[] = [];
afterEach(async () => {
  for (const clean of cleanups.splice(0)) await clean();
});

async function load(lines: readonly string[], files: Record<string, string | Uint8Array> = baseFiles): Promise<PlanResult> {
  const temp = await tempExhibit(lines, files as Record<string, string>);
  cleanups.push(temp.remove);
  return loadPlan(temp.plan, fakeRegistry, { cwd: temp.root });
}

const where = (p: Problem) => [p.line, p.column, p.path, p.code];

const plan = (exhibit: string[], cast: string[] = []): string[] => [
  'version: 1', //                              1
  'exhibit:', //                                2
  ...exhibit, //                                3…
  'texts:',
  '  - id: ledger',
  '    source: texts/ledger.txt',
  ...cast,
  'rooms:',
  '  - id: shape',
  '    title: Shape',
  '    panels:',
  '      - id: lengths',
  '        title: Lengths',
  '        measure: structure',
  '        chart: bars',
  '        caption: captions/a.mdx',
];
const exhibit = ["  title: The Ferryman's Ledger", '  organiser: The Quayside Reading Circle'];

describe('one fault, one message', () => {
  it('reports a tab used for indentation once, where the tab is, however many lines follow it', async () => {
    const r = await load(plan(['\ttitle: The Ferryman\'s Ledger', '  organiser: The Quayside Reading Circle', '  language: en', '  base: /']));
    expect(r.problems.map(formatProblem)).toEqual(['content/exhibit.yaml:3:1: the YAML is not well-formed here: a tab is used for indentation — indent with spaces']);
  });

  it('reports a { mapping } left open once, at the brace, and nothing after it', async () => {
    const r = await load(
      plan(exhibit, [
        'cast:', //                                           8
        '  - { id: orla, name: Orla Brannock, aliases: [Orla]', // 9: the brace at column 5
        '  - { id: wren, name: Wren Brannock }',
      ]),
    );
    expect(r.problems.map(formatProblem)).toEqual([
      'content/exhibit.yaml:9:5: the YAML is not well-formed here: the { mapping } that opens here is not closed — add the closing }; if the value goes on over several lines, indent them further than its key',
    ]);
  });

  it('still reports independent faults in different sections, one each', async () => {
    const lines = plan(exhibit);
    lines[2] = '\ttitle: The Ferryman\'s Ledger';
    const rooms = lines.indexOf('    title: Shape');
    lines[rooms] = '\ttitle: Shape';
    const r = await load(lines);
    expect(r.problems.map((p) => [p.line, p.column])).toEqual([
      [3, 1],
      [rooms + 1, 1],
    ]);
  });

  it('gives at most one message for any single tab, lost bracket, quote or colon in the demo plan', () => {
    // The demo plan is the largest plan there is; each mutation is one keystroke a curator could make.
    const demo = readFileSync(path.resolve(import.meta.dirname, '../../content/exhibit.yaml'), 'utf8');
    const lines = demo.split('\n');
    const indented = lines.map((l, i) => (/^ +\S/.test(l) ? i : -1)).filter((i) => i >= 0);
    const marks = [...demo.matchAll(/[{}[\]":]/g)].map((m) => m.index);
    const mutation = fc.oneof(
      fc.constantFrom(...indented).map((i) => {
        const copy = [...lines];
        copy[i] = copy[i]!.replace(/^ {1,2}/, '\t');
        return { what: `tab on line ${i + 1}`, text: copy.join('\n') };
      }),
      fc.constantFrom(...marks).map((at) => ({ what: `"${demo[at]}" dropped at offset ${at}`, text: demo.slice(0, at) + demo.slice(at + 1) })),
    );
    fc.assert(
      fc.property(mutation, ({ text }) => {
        expect(readPlanSource(text).problems.length).toBeLessThanOrEqual(1);
      }),
      { seed: 8, numRuns: 150 },
    );
  });
});

describe('blank values and runaway lengths', () => {
  it('refuses a name or alias of white space only, at the value', async () => {
    const r = await load(
      plan(exhibit, [
        'cast:', //                          8
        '  - id: orla', //                   9
        '    name: "   "', //                10: value col 11
        '    aliases: [Orla, "  "]', //      11: second alias col 21
      ]),
    );
    expect(r.problems.map(where)).toEqual([
      [10, 11, 'cast[0].name', 'plan/blank'],
      [11, 21, 'cast[0].aliases[1]', 'plan/blank'],
    ]);
    expect(formatProblem(r.problems[0]!)).toBe('content/exhibit.yaml:10:11 cast[0].name: the value is only white space — write a value, or remove it');
  });

  it('refuses a 5 MB title with its length and the limit, without quoting it all', async () => {
    const huge = 'A'.repeat(5 * 1024 * 1024);
    const r = await load(plan([`  title: ${huge}`, '  organiser: The Quayside Reading Circle']));
    expect(r.plan).toBeNull();
    expect(r.problems.map(where)).toEqual([[3, 10, 'exhibit.title', 'plan/too-long']]);
    const line = formatProblem(r.problems[0]!);
    expect(line).toContain(`at most ${LIMITS.title} characters long, and this one has 5,242,880`);
    expect(line.length).toBeLessThan(400);
  });

  it('limits every kind of plan string: paths, notes and names too', async () => {
    const long = (n: number) => 'x'.repeat(n + 1);
    const lines = plan(exhibit, ['cast:', '  - id: orla', `    name: ${long(LIMITS.name)}`]);
    lines[lines.length - 1] = `        caption: ${long(LIMITS.path)}.mdx`;
    lines.push('        notes:', `          - { at: { chapter: 1 }, text: ${long(LIMITS.prose)} }`);
    const r = await load(lines);
    expect(r.problems.filter((p) => p.code === 'plan/too-long').map((p) => p.path)).toEqual([
      'cast[0].name',
      'rooms[0].panels[0].caption',
      'rooms[0].panels[0].notes[0].text',
    ]);
  });
});

describe('invisible direction controls in names', () => {
  it('refuses an override or isolate anywhere, and a mark in a name without right-to-left letters, at the character', async () => {
    const r = await load(
      plan(exhibit, [
        'cast:', //                                    8
        '  - id: orla', //                             9
        '    name: Orla Bran\u202Enock', //            10: value col 11, U+202E is character 10 → col 20
        '    aliases: [Orla, "Miss \u2066Brannock"]', // 11: the alias starts col 21 (quote), U+2066 at col 27
        '  - id: dov', //                              12
        '    name: \u05D3\u05D5\u05D1 Levy\u200F', //   13: a right-to-left mark beside Hebrew letters is allowed
      ]),
    );
    expect(r.problems.map(where)).toEqual([
      [10, 20, 'cast[0].name', 'cast/direction-control'],
      [11, 27, 'cast[0].aliases[1]', 'cast/direction-control'],
    ]);
    expect(r.problems[0]!.message).toMatch(/U\+202E RIGHT-TO-LEFT OVERRIDE \(character 10\)/);
    expect(r.problems[0]!.hint).toMatch(/retype the name/);
  });

  it.each([
    ['Orla\u200E', 'LEFT-TO-RIGHT MARK'],
    ['\u202DOrla', 'LEFT-TO-RIGHT OVERRIDE'],
    ['Or\u2069la', 'POP DIRECTIONAL ISOLATE'],
  ])('names the control in %j', (name, control) => {
    expect(misleadingControl(name)?.name).toBe(control);
  });

  it('names the invisible character in an id', async () => {
    const r = await load(plan(exhibit, ['cast:', '  - id: "or\u202Ela"', '    name: Orla']));
    expect(r.problems[0]).toMatchObject({ path: 'cast[0].id', message: '"or\u202Ela" is not a valid id: it holds the invisible character U+202E' });
  });
});

describe('the base path', () => {
  it.each([
    ['//cdn.example/', /names another host/],
    ['http://example.org/weir/', /is a web address/],
    ['https:/weir/', /is a web address/],
    ['\\\\server\\share\\', /names another host/],
    ['/weir', /must start and end with "\/"/],
    ['/weir/../', /"\." or "\.\." step/],
    ['/weir /', /has no place in a path/],
    ['/weir/?x=1/', /has no place in a path/],
  ])('refuses %j', (base, message) => {
    expect(basePathProblem(base)?.message).toMatch(message);
  });

  it.each(['/', '/weir/', '/exhibits/lamps-2026/', '/caf%C3%A9/'])('accepts %j', (base) => {
    expect(basePathProblem(base)).toBeUndefined();
  });

  it('is checked in the plan, at the value, with what to write instead', async () => {
    const r = await load(plan([...exhibit, '  base: //cdn.example/'])); // line 5: value col 9
    expect(r.problems.map(where)).toEqual([[5, 9, 'exhibit.base', 'plan/bad-base']]);
    expect(r.problems[0]!.hint).toMatch(/"\/weir\/" for a sub-folder/);
  });
});

describe('the plan file itself is decoded strictly', () => {
  it('refuses a Latin-1 plan at the first bad byte', async () => {
    const text = plan(["  title: The Ferryman's Caf\u00e9", '  organiser: The Quayside Reading Circle']).join('\n') + '\n';
    const temp = await tempExhibit(['version: 1'], baseFiles);
    cleanups.push(temp.remove);
    const { writeFile } = await import('node:fs/promises');
    await writeFile(path.join(temp.dir, 'exhibit.yaml'), Buffer.from(text, 'latin1'));
    const r = await loadPlan(temp.plan, fakeRegistry, { cwd: temp.root });
    expect(r.problems.map(where)).toEqual([[3, 28, undefined, 'file/not-utf8']]);
    expect(r.problems[0]!.message).toContain('0xE9');
  });
});
