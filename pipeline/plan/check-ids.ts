/**
 * Ids that must be unique (texts, cast, rooms, panels across the exhibit) and
 * cast names shared between characters.
 */
import type { PathSegment } from './source.ts';
import { asList, asRecord, asText, idsOf, panelsOf } from './raw.ts';
import type { RawRecord, Reporter } from './raw.ts';
import { wording } from '../problems/problem.ts';

interface Entry {
  id: string;
  path: PathSegment[];
}

function reportDuplicates(entries: Entry[], label: string, r: Reporter): void {
  const first = new Map<string, Entry>();
  for (const entry of entries) {
    const earlier = first.get(entry.id);
    if (earlier === undefined) {
      first.set(entry.id, entry);
      continue;
    }
    const line = r.source.at(earlier.path).line;
    r.report(entry.path, wording('plan/duplicate-id', { label, id: entry.id, line }));
  }
}

export function checkUniqueIds(plan: RawRecord, r: Reporter): void {
  const listed = (key: string): Entry[] => idsOf(plan[key]).map(({ id, index }) => ({ id, path: [key, index, 'id'] }));
  reportDuplicates(listed('texts'), 'text', r);
  reportDuplicates(listed('cast'), 'cast', r);
  reportDuplicates(listed('rooms'), 'room', r);
  reportDuplicates(listed('lexicons'), 'word list', r);
  const panels: Entry[] = [];
  for (const { panel, path } of panelsOf(plan)) {
    const id = asText(panel.id);
    if (id !== undefined) panels.push({ id, path: [...path, 'id'] });
  }
  reportDuplicates(panels, 'panel', r);
}

/**
 * A name (full name or alias) given to two characters cannot tell them apart:
 * the text reader will count it as ambiguous. Warned once per name and pair,
 * at the later character.
 */
export function checkSharedNames(plan: RawRecord, r: Reporter): void {
  const owner = new Map<string, { member: number; id: string }>();
  const warned = new Set<string>();
  asList(plan.cast).forEach((entry, member) => {
    const record = asRecord(entry);
    if (!record) return;
    const id = asText(record.id) ?? `#${member + 1}`;
    const names: { name: string; path: PathSegment[] }[] = [];
    const name = asText(record.name);
    if (name !== undefined) names.push({ name, path: ['cast', member, 'name'] });
    asList(record.aliases).forEach((alias, k) => {
      const text = asText(alias);
      if (text !== undefined) names.push({ name: text, path: ['cast', member, 'aliases', k] });
    });
    for (const { name: raw, path } of names) {
      const key = raw.trim().replace(/\s+/g, ' ');
      const first = owner.get(key);
      if (first === undefined) {
        owner.set(key, { member, id });
        continue;
      }
      if (first.member === member || warned.has(`${key}\u0000${member}`)) continue;
      warned.add(`${key}\u0000${member}`);
      r.report(path, wording('plan/shared-alias', { name: key, first: first.id, second: id }), 'warning');
    }
  });
}
