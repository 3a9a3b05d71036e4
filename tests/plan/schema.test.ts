import { describe, expect, it } from 'vitest';
import type { z } from 'zod';
import { idSchema, planSchema, RESERVED_ROOM_IDS, roomSchema } from '../../pipeline/plan/schema.ts';
import { allowedKeys, descriptionOf, schemaAt } from '../../pipeline/plan/schema-walk.ts';
import type { PathSegment } from '../../pipeline/plan/source.ts';

/** Every [path, field schema] of the plan, following lists (index 0) and mappings. */
function fields(schema: z.ZodType, path: PathSegment[] = []): [string, z.ZodType][] {
  const out: [string, z.ZodType][] = [];
  const keys = allowedKeys(schema);
  const item = schemaAt(schema, [0]);
  if (item !== undefined && keys === undefined) return fields(item, [...path, 0]);
  for (const key of keys ?? []) {
    const child = schemaAt(schema, [key])!;
    out.push([[...path, key].join('.'), child], ...fields(child, [...path, key]));
  }
  return out;
}

describe('the plan schema', () => {
  const all = fields(planSchema);

  it('covers every field of the plan format', () => {
    const names = all.map(([name]) => name);
    for (const name of [
      'version',
      'exhibit.title',
      'exhibit.subtitle',
      'exhibit.organiser',
      'exhibit.language',
      'exhibit.base',
      'exhibit.credit',
      'exhibit.intro',
      'exhibit.rights',
      'texts.0.id',
      'texts.0.source',
      'texts.0.format',
      'texts.0.start',
      'texts.0.end',
      'texts.0.chapters',
      'texts.0.edition',
      'cast.0.id',
      'cast.0.name',
      'cast.0.aliases',
      'cast.0.pronoun',
      'rooms.0.id',
      'rooms.0.title',
      'rooms.0.intro',
      'rooms.0.panels.0.id',
      'rooms.0.panels.0.title',
      'rooms.0.panels.0.text',
      'rooms.0.panels.0.measure',
      'rooms.0.panels.0.params',
      'rooms.0.panels.0.chart',
      'rooms.0.panels.0.options',
      'rooms.0.panels.0.caption',
      'rooms.0.panels.0.alt',
      'rooms.0.panels.0.notes',
      'rooms.0.panels.0.notes.0.at',
      'rooms.0.panels.0.notes.0.at.chapter',
      'rooms.0.panels.0.notes.0.at.character',
      'rooms.0.panels.0.notes.0.at.word',
      'rooms.0.panels.0.notes.0.at.segment',
      'rooms.0.panels.0.notes.0.text',
    ]) {
      expect(names).toContain(name);
    }
  });

  it('describes every field, saying whether it is required or what its default is', () => {
    for (const [name, schema] of all) {
      const text = descriptionOf(schema);
      expect(text, name).toBeTruthy();
      expect(text, name).toMatch(/Required|Optional|Default|One or more/);
    }
  });

  it('accepts ids of lower-case letters, digits and hyphens only', () => {
    for (const good of ['weir', 'chapter-lengths', '1848-notes', 'a']) expect(idSchema.safeParse(good).success, good).toBe(true);
    for (const bad of ['', '-weir', 'Weir', 'chapter_lengths', 'wéir', 'two words']) expect(idSchema.safeParse(bad).success, bad).toBe(false);
  });

  it('refuses the reserved room ids', () => {
    const room = (id: string) => ({ id, title: 'T', panels: [{ id: 'p', title: 'P', measure: 'm', chart: 'c', caption: 'c.mdx' }] });
    for (const id of RESERVED_ROOM_IDS) expect(roomSchema.safeParse(room(id)).success, id).toBe(false);
    expect(roomSchema.safeParse(room('shape')).success).toBe(true);
  });
});
