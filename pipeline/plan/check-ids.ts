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

const RIGHT_TO_LEFT = /[\p{Script=Hebrew}\p{Script=Arabic}\p{Script=Syriac}\p{Script=Thaana}\p{Script=Nko}\p{Script=Samaritan}\p{Script=Mandaic}\p{Script=Adlam}]/u;

const CONTROL_NAMES: Record<number, string> = {
  0x200e: 'LEFT-TO-RIGHT MARK',
  0x200f: 'RIGHT-TO-LEFT MARK',
  0x202a: 'LEFT-TO-RIGHT EMBEDDING',
  0x202b: 'RIGHT-TO-LEFT EMBEDDING',
  0x202c: 'POP DIRECTIONAL FORMATTING',
  0x202d: 'LEFT-TO-RIGHT OVERRIDE',
  0x202e: 'RIGHT-TO-LEFT OVERRIDE',
  0x2066: 'LEFT-TO-RIGHT ISOLATE',
  0x2067: 'RIGHT-TO-LEFT ISOLATE',
  0x2068: 'FIRST STRONG ISOLATE',
  0x2069: 'POP DIRECTIONAL ISOLATE',
};

/**
 * The first invisible direction control in `s` that can only mislead: any
 * embedding, override or isolate (U+202A–202E, U+2066–2069), and the
 * left-to-right and right-to-left marks (U+200E, U+200F) in a name without
 * right-to-left letters, where they have nothing to order. Such characters
 * make a name look like another one, and never match the text as printed.
 * Source: Unicode Standard Annex #9, "Unicode Bidirectional Algorithm",
 * section 2, "Directional Formatting Characters".
 */
export function misleadingControl(s: string): { index: number; char: string; name: string } | undefined {
  const marksAllowed = RIGHT_TO_LEFT.test(s);
  for (let i = 0; i < s.length; i++) {
    const c = s.charCodeAt(i);
    const control = (c >= 0x202a && c <= 0x202e) || (c >= 0x2066 && c <= 0x2069) || (!marksAllowed && (c === 0x200e || c === 0x200f));
    if (control) return { index: i, char: s[i]!, name: CONTROL_NAMES[c]! };
  }
  return undefined;
}

/** Names and aliases holding an invisible direction control, reported at the character itself. */
export function checkNameCharacters(plan: RawRecord, r: Reporter): void {
  asList(plan.cast).forEach((entry, member) => {
    const record = asRecord(entry);
    if (!record) return;
    const names: { value: unknown; path: PathSegment[]; what: 'name' | 'alias' }[] = [{ value: record.name, path: ['cast', member, 'name'], what: 'name' }];
    asList(record.aliases).forEach((alias, k) => names.push({ value: alias, path: ['cast', member, 'aliases', k], what: 'alias' }));
    for (const { value, path, what } of names) {
      const text = asText(value);
      const found = text === undefined ? undefined : misleadingControl(text);
      if (!found) continue;
      const code = `U+${found.char.charCodeAt(0).toString(16).toUpperCase()}`;
      r.reportAt(path, r.source.find(path, found.char), wording('cast/direction-control', { what, code, control: found.name, index: found.index + 1 }));
    }
  });
}
