/**
 * Turning zod's validation issues into curator-facing problems: a plain
 * sentence, a hint (often the field's own description), and the line and
 * column of the offending value in the YAML.
 */
import type { z } from 'zod';
import type { Problem } from '../problems/problem.ts';
import { wording } from '../problems/problem.ts';
import type { Wording } from './raw.ts';
import { allowedKeys, descriptionOf, schemaAt } from './schema-walk.ts';
import { formatPath } from './source.ts';
import type { PathSegment, PlanSource } from './source.ts';
import { nearest, suggestionHint } from './suggest.ts';

type Issue = z.core.$ZodIssue;

export interface UnknownKeyWording {
  /** The problem for an unknown key, given the suggestion hint; e.g. (key, hint) => wording('plan/unknown-option', { key, chart: 'bars', hint }). */
  word: (key: string, hint: string) => Wording;
  /** E.g. `options of "bars"`, as in "the options of "bars" are: …". */
  plural: string;
}

export interface IssueContext {
  /** The plan file as shown to the user. */
  file: string;
  source: PlanSource;
  /** The schema the value was checked against. */
  schema: z.ZodType;
  /** The value that was checked. */
  value: unknown;
  /** Where the value sits in the plan. */
  base: readonly PathSegment[];
  /** How to report keys the schema does not know: code, the message for a key, and the plural used in "the … are:". */
  unknownKey: UnknownKeyWording;
}

/** Plain data at a path, or undefined. */
export function valueAt(value: unknown, path: readonly PathSegment[]): unknown {
  let current = value;
  for (const seg of path) {
    if (current === null || typeof current !== 'object') return undefined;
    current = (current as Record<string | number, unknown>)[seg];
  }
  return current;
}

function quoteShort(s: string): string {
  return JSON.stringify(s.length > 40 ? `${s.slice(0, 37)}…` : s);
}

/** "text "abc"", "the number 3", "a list", … */
export function describeValue(value: unknown): string {
  if (value === undefined) return 'nothing';
  if (value === null) return 'an empty value';
  if (typeof value === 'string') return `the text ${quoteShort(value)}`;
  if (typeof value === 'number') return `the number ${value}`;
  if (typeof value === 'boolean') return `${value}`;
  if (Array.isArray(value)) return 'a list';
  if (typeof value === 'object') return 'a mapping (key: value lines)';
  return typeof value;
}

const EXPECTED: Record<string, string> = {
  string: 'text',
  number: 'a number',
  int: 'a whole number',
  boolean: 'true or false',
  array: 'a list',
  object: 'a mapping (key: value lines)',
  record: 'a mapping (key: value lines)',
  map: 'a mapping (key: value lines)',
};

function lastKey(path: readonly PathSegment[]): string {
  for (let i = path.length - 1; i >= 0; i--) {
    const seg = path[i];
    if (typeof seg === 'string') return seg;
  }
  return 'value';
}

function listValues(values: readonly unknown[]): string {
  return values.map((v) => JSON.stringify(v)).join(', ');
}

/** Words one issue; `about` is the description of the field, used as the hint when nothing better is known. */
function wordIssue(issue: Issue, value: unknown, about: string | undefined): Wording {
  switch (issue.code) {
    case 'invalid_type': {
      const expected = EXPECTED[issue.expected] ?? issue.expected;
      if (value === undefined) {
        const key = lastKey(issue.path as PathSegment[]);
        return wording('plan/missing-key', { key, about });
      }
      let hint = about;
      if (value === null) {
        hint = `write a value after the colon, or remove the line if the key is optional${about ? ` (${about})` : ''}`;
      } else if (issue.expected === 'string' && (typeof value === 'number' || typeof value === 'boolean')) {
        hint = `put the value in quotes: "${String(value)}"`;
      } else if (issue.expected === 'int' && typeof value === 'number') {
        hint = 'use a whole number';
      }
      return wording('plan/wrong-type', { expected, found: describeValue(value), hint });
    }
    case 'invalid_value': {
      const values = issue.values;
      if (values.length === 1) {
        return wording('plan/invalid-value', { detail: `must be ${JSON.stringify(values[0])}, found ${describeValue(value)}`, hint: about });
      }
      const close = typeof value === 'string' ? nearest(value, values.filter((v): v is string => typeof v === 'string')) : undefined;
      return wording('plan/invalid-value', {
        detail: `${describeValue(value)} is not one of the accepted values`,
        hint: close !== undefined ? `did you mean "${close}"? (accepted: ${listValues(values)})` : `accepted: ${listValues(values)}`,
      });
    }
    case 'too_small': {
      const min = Number(issue.minimum);
      if (issue.origin === 'array' || issue.origin === 'set') {
        return wording('plan/too-few', { min, hint: about });
      }
      if (issue.origin === 'string') {
        return min <= 1 ? wording('plan/empty', { what: 'value', hint: about }) : wording('plan/too-short', { min, hint: about });
      }
      const bound = issue.inclusive ? `${min} or more` : `more than ${min}`;
      return wording('plan/too-small', { bound, found: describeValue(value), hint: about });
    }
    case 'too_big': {
      const max = Number(issue.maximum);
      if (issue.origin === 'array' || issue.origin === 'set') {
        return wording('plan/too-many', { max, hint: about });
      }
      if (issue.origin === 'string') {
        return wording('plan/too-long', { max, ...(typeof value === 'string' ? { length: value.length } : {}), hint: about });
      }
      const bound = issue.inclusive ? `${max} or less` : `less than ${max}`;
      return wording('plan/too-big', { bound, found: describeValue(value), hint: about });
    }
    case 'not_multiple_of':
      return wording('plan/invalid-value', { detail: `must be a multiple of ${String(issue.divisor)}, found ${describeValue(value)}`, hint: about });
    case 'invalid_format': {
      // Messages set in a schema are kept; zod's own generic ones are reworded.
      const own = !issue.message.startsWith('Invalid');
      return wording('plan/bad-format', {
        detail: own ? issue.message : `${describeValue(value)} is not in the expected form (${issue.pattern ?? issue.format})`,
        hint: about,
      });
    }
    case 'custom': {
      const params = (issue.params ?? {}) as { hint?: unknown; code?: unknown };
      const hint = typeof params.hint === 'string' ? params.hint : about;
      // Checks in the schema that have a catalogue entry of their own name it in params.code.
      if (params.code === 'plan/blank') return wording('plan/blank', {});
      if (params.code === 'plan/bad-base') return wording('plan/bad-base', { detail: issue.message, hint: hint ?? '' });
      if (params.code === 'plan/bad-url') return wording('plan/bad-url', { detail: issue.message, hint: hint ?? '' });
      return wording('plan/invalid', { detail: issue.message, hint });
    }
    case 'invalid_key': {
      const inner = (issue as { issues?: { message?: string }[] }).issues?.[0]?.message;
      const key = lastKey(issue.path as PathSegment[]);
      return wording('plan/invalid-key', { key, reason: inner && !inner.startsWith('Invalid') ? inner : undefined, hint: about });
    }
    case 'invalid_union':
      return wording('plan/invalid', { detail: `${describeValue(value)} matches none of the accepted forms`, hint: about });
    default:
      return wording('plan/invalid', { detail: issue.message, hint: about });
  }
}

/** A worded issue: where it is (relative to the checked value) and what to say. `key` is set for an unknown key (`path` then ends with it). */
export interface WordedIssue {
  path: PathSegment[];
  key?: string;
  wording: Wording;
}

/**
 * A misspelt key is one fault, not two: when an unknown key is a near miss of
 * a key that is missing, only the unknown key is reported, and its hint says
 * the intended key is required.
 */
export function foldMisspeltKeys(worded: WordedIssue[], siblingsOf: (path: readonly PathSegment[]) => readonly string[]): WordedIssue[] {
  const at = (path: readonly PathSegment[]) => JSON.stringify(path);
  const missing = new Set(worded.filter((w) => w.wording.code === 'plan/missing-key').map((w) => at(w.path)));
  const meant = new Set<string>();
  const out = worded.map((w) => {
    if (w.key === undefined) return w;
    const parent = w.path.slice(0, -1);
    const close = nearest(w.key, siblingsOf(parent));
    if (close === undefined || !missing.has(at([...parent, close]))) return w;
    meant.add(at([...parent, close]));
    return { ...w, wording: { ...w.wording, hint: `did you mean "${close}"? ("${close}" is required)` } };
  });
  return out.filter((w) => !(w.wording.code === 'plan/missing-key' && meant.has(at(w.path))));
}

/** One wording per issue, and one per unknown key, with paths relative to the checked value. */
export function wordIssues(issues: readonly Issue[], schema: z.ZodType, value: unknown, unknownKey: UnknownKeyWording): WordedIssue[] {
  const out: WordedIssue[] = [];
  for (const issue of issues) {
    const rel = issue.path.filter((s): s is PathSegment => typeof s === 'string' || typeof s === 'number');
    if (issue.code === 'unrecognized_keys') {
      const allowed = allowedKeys(schemaAt(schema, rel)) ?? [];
      for (const key of issue.keys) out.push({ path: [...rel, key], key, wording: unknownKey.word(key, suggestionHint(key, allowed, unknownKey.plural)) });
      continue;
    }
    // A value that takes one of several forms: when only one form fits its kind (a name, a mapping), word that form's issues.
    if (issue.code === 'invalid_union' && Array.isArray((issue as { errors?: unknown }).errors)) {
      const branches = (issue as unknown as { errors: Issue[][] }).errors;
      // Forms whose issues lie inside the value (a mapping with a wrong key) fit best; then forms of the right kind.
      const deep = branches.filter((b) => b.length > 0 && b.every((i) => i.path.length > 0));
      const fitting = deep.length ? deep : branches.filter((b) => b.length > 0 && !b.some((i) => i.code === 'invalid_type' && i.path.length === 0));
      if (fitting.length === 1) {
        out.push(...wordIssues(fitting[0].map((i) => ({ ...i, path: [...issue.path, ...i.path] }) as Issue), schema, value, unknownKey));
        continue;
      }
    }
    out.push({ path: rel, wording: wordIssue(issue, valueAt(value, rel), descriptionOf(schemaAt(schema, rel))) });
  }
  return foldMisspeltKeys(out, (parent) => allowedKeys(schemaAt(schema, parent)) ?? []);
}

function problem(ctx: IssueContext, path: readonly PathSegment[], line: number, column: number, w: Wording): Problem {
  const p: Problem = { severity: 'error', code: w.code, file: ctx.file, line, column, path: formatPath(path), message: w.message };
  if (w.hint !== undefined) p.hint = w.hint;
  return p;
}

/** One problem per issue, and one per unknown key, placed in the plan. */
export function issueProblems(issues: readonly Issue[], ctx: IssueContext): Problem[] {
  return wordIssues(issues, ctx.schema, ctx.value, ctx.unknownKey).map(({ path, key, wording }) => {
    const full = [...ctx.base, ...path];
    const pos = key !== undefined ? ctx.source.keyAt(full.slice(0, -1), key) : ctx.source.at(full);
    return problem(ctx, full, pos.line, pos.column, wording);
  });
}
