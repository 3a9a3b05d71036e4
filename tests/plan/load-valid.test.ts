// Positions: the YAML 1.2 spec's positions are 1-based lines/cols as editors show them — common practice, no source.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';
import { loadPlan } from '../../pipeline/plan/load.ts';
import type { Plan, PlanResult } from '../../pipeline/plan/load.ts';
import { fakeRegistry } from './fake-registry.ts';

const repo = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const fixture = path.join(repo, 'tests/fixtures/plans/valid');

describe('a valid plan', () => {
  let result: PlanResult;
  let plan: Plan;
  beforeAll(async () => {
    result = await loadPlan('tests/fixtures/plans/valid/exhibit.yaml', fakeRegistry, { cwd: repo });
    plan = result.plan!;
  });

  it('loads without problems', () => {
    expect(result.problems).toEqual([]);
    expect(plan).not.toBeNull();
    expect(result.file).toBe(path.join(fixture, 'exhibit.yaml'));
    expect(result.dir).toBe(fixture);
    expect(plan.file).toBe(result.file);
    expect(plan.dir).toBe(fixture);
  });

  it('fills the defaults of the plan format', () => {
    expect(plan.version).toBe(1);
    expect(plan.exhibit.language).toBe('en');
    expect(plan.exhibit.base).toBe('/');
    expect(plan.exhibit.subtitle).toBeUndefined();
    expect(plan.texts[0].format).toBe('plain');
    expect(plan.cast[1].aliases).toEqual([]);
    expect(plan.rooms[0].panels[0].notes).toEqual([]);
  });

  it("fills params and options with the registry's defaults", () => {
    const [lengths, who] = plan.panels;
    expect(lengths.params).toEqual({ unit: 'words' });
    expect(lengths.options).toEqual({ orientation: 'horizontal', sorted: false });
    expect(who.params).toEqual({ segments: 8 });
    expect(who.options).toEqual({ height: 16 });
  });

  it('resolves every file to an absolute path and keeps the path as written', () => {
    expect(plan.exhibit.intro).toEqual({ written: 'captions/intro.mdx', absolute: path.join(fixture, 'captions/intro.mdx') });
    expect(plan.texts[0].source).toEqual({ written: 'texts/ledger.txt', absolute: path.join(fixture, 'texts/ledger.txt') });
    expect(plan.panels[1].caption).toEqual({ written: 'captions/who-appears.md', absolute: path.join(fixture, 'captions/who-appears.md') });
  });

  it('gives each panel its room, its text (the only one) and its place in the YAML', () => {
    const [lengths, who] = plan.panels;
    expect(lengths.room).toBe('shape');
    expect(lengths.text).toBe('ledger');
    // Line 22 is "      - id: entry-lengths": "id" starts in column 9.
    expect(lengths.where).toEqual({ file: 'tests/fixtures/plans/valid/exhibit.yaml', line: 22, column: 9, path: 'rooms[0].panels[0]' });
    // Line 27 is "      - id: who-appears".
    expect(who.where).toMatchObject({ line: 27, column: 9, path: 'rooms[0].panels[1]' });
    expect(plan.rooms[0].panels).toEqual(plan.panels);
  });

  it('places notes, texts, cast and rooms too', () => {
    // Line 36 is "          - at: { character: tam }": "at" starts in column 13.
    expect(plan.panels[1].notes[0]).toEqual({
      at: { character: 'tam' },
      text: 'Tam leaves the quay here.',
      where: { file: 'tests/fixtures/plans/valid/exhibit.yaml', line: 36, column: 13, path: 'rooms[0].panels[1].notes[0]' },
    });
    expect(plan.panels[1].notes[1].at).toEqual({ chapter: 2 });
    expect(plan.panels[1].notes[1].where).toMatchObject({ line: 38, column: 13 });
    expect(plan.texts[0].where).toMatchObject({ line: 8, column: 5, path: 'texts[0]' });
    expect(plan.cast[0].where).toMatchObject({ line: 12, column: 5, path: 'cast[0]' });
    expect(plan.rooms[0].where).toMatchObject({ line: 19, column: 5, path: 'rooms[0]' });
  });

  it('keeps the fields as written', () => {
    expect(plan.exhibit.title).toBe("The Ferryman's Ledger");
    // "\\d" in YAML double quotes is a backslash and a d.
    // Source: YAML 1.2.2 spec §5.7 Escaped Characters ("\\" is a backslash); from memory.
    expect(plan.texts[0].chapters).toBe('^Entry \\d+');
    expect(plan.cast[0]).toMatchObject({ id: 'orla', name: 'Orla Brannock', aliases: ['Orla', 'the ferrywoman'], pronoun: 'she' });
  });
});
