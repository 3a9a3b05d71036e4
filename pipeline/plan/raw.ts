/**
 * Careful reading of the plan as parsed from YAML, before (or despite) schema
 * validation: cross-checks run on whatever is well-formed, so that one run
 * reports every problem.
 */
import type { Problem, Severity } from '../problems/problem.ts';
import type { ProblemCode } from '../problems/catalogue.ts';
import type { PathSegment, PlanSource, Position } from './source.ts';
import { formatPath } from './source.ts';

export type RawRecord = Record<string, unknown>;

export function asRecord(value: unknown): RawRecord | undefined {
  return value !== null && typeof value === 'object' && !Array.isArray(value) ? (value as RawRecord) : undefined;
}

export function asList(value: unknown): unknown[] {
  return Array.isArray(value) ? value : [];
}

export function asText(value: unknown): string | undefined {
  return typeof value === 'string' && value !== '' ? value : undefined;
}

/** Ids of a list of entries, with their index (entries without a string id are skipped). */
export function idsOf(list: unknown): { id: string; index: number }[] {
  const out: { id: string; index: number }[] = [];
  asList(list).forEach((entry, index) => {
    const id = asText(asRecord(entry)?.id);
    if (id !== undefined) out.push({ id, index });
  });
  return out;
}

/** Each panel of each room, with its path. */
export function panelsOf(plan: RawRecord): { panel: RawRecord; room: number; index: number; path: PathSegment[] }[] {
  const out: { panel: RawRecord; room: number; index: number; path: PathSegment[] }[] = [];
  asList(plan.rooms).forEach((room, r) => {
    asList(asRecord(room)?.panels).forEach((panel, p) => {
      const record = asRecord(panel);
      if (record) out.push({ panel: record, room: r, index: p, path: ['rooms', r, 'panels', p] });
    });
  });
  return out;
}

/** A catalogued problem's code, message and hint (from `wording()` in problems/problem.ts). */
export interface Wording {
  code: ProblemCode;
  message: string;
  hint?: string;
}

/** Collects problems, placing each at the YAML position of its path. */
export interface Reporter {
  source: PlanSource;
  file: string;
  problems: Problem[];
  /** A problem about the value at `path`, placed at the value (or, if missing, at the enclosing mapping). */
  report(path: readonly PathSegment[], wording: Wording, severity?: Severity): void;
  /** A problem about the key `key` of the mapping at `path`, placed at the key. */
  reportKey(path: readonly PathSegment[], key: string, wording: Wording, severity?: Severity): void;
  /** A problem about the value at `path`, placed at `pos` (e.g. one character inside it). */
  reportAt(path: readonly PathSegment[], pos: Position, wording: Wording, severity?: Severity): void;
}

export function makeReporter(source: PlanSource, file: string): Reporter {
  const problems: Problem[] = [];
  const push = (path: readonly PathSegment[], pos: Position, wording: Wording, severity: Severity): void => {
    const p: Problem = {
      severity,
      code: wording.code,
      file,
      line: pos.line,
      column: pos.column,
      path: formatPath(path),
      message: wording.message,
    };
    if (wording.hint !== undefined) p.hint = wording.hint;
    problems.push(p);
  };
  return {
    source,
    file,
    problems,
    report(path, wording, severity = 'error') {
      push(path, source.at(path), wording, severity);
    },
    reportKey(path, key, wording, severity = 'error') {
      push([...path, key], source.keyAt(path, key), wording, severity);
    },
    reportAt(path, pos, wording, severity = 'error') {
      push(path, pos, wording, severity);
    },
  };
}
