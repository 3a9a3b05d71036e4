/**
 * Problems found in a curator's files. Every message a user sees goes through
 * here: what happened, where (file:line:col and the path inside the plan), and
 * what to do. Errors stop the build; warnings say what the pipeline did instead.
 * The wording of each code lives in ./catalogue.ts.
 */
import { catalogue } from './catalogue.ts';
import type { CatalogueEntry, ProblemArgs, ProblemCode } from './catalogue.ts';

export type Severity = 'error' | 'warning';

export interface Problem {
  severity: Severity;
  /** Stable code from the catalogue, e.g. "plan/unknown-measure". */
  code: ProblemCode;
  /** Path of the file, relative to the working directory when possible. */
  file?: string;
  line?: number;
  column?: number;
  /** Path inside the plan, e.g. "rooms[1].panels[2].measure". */
  path?: string;
  /** What is wrong, in one sentence. */
  message: string;
  /** What to do about it. */
  hint?: string;
}

export function formatProblem(p: Problem): string {
  let where = '';
  if (p.file) {
    where = p.file;
    if (p.line !== undefined) where += `:${p.line}`;
    if (p.line !== undefined && p.column !== undefined) where += `:${p.column}`;
  }
  const head = [where, p.path].filter(Boolean).join(' ');
  const label = p.severity === 'warning' ? 'warning: ' : '';
  const body = `${label}${p.message}${p.hint ? ` — ${p.hint}` : ''}`;
  return head ? `${head}: ${body}` : body;
}

export function hasErrors(problems: readonly Problem[]): boolean {
  return problems.some((p) => p.severity === 'error');
}

/** Problems in reading order: by file, then line, then column; problems about a whole file before those at a place in it. */
export function sortProblems(problems: readonly Problem[]): Problem[] {
  return [...problems].sort(
    (a, b) => (a.file ?? '').localeCompare(b.file ?? '') || (a.line ?? 0) - (b.line ?? 0) || (a.column ?? 0) - (b.column ?? 0),
  );
}

/** Where a problem is: any of file, line, column and the path inside the plan. */
export type ProblemPlace = Pick<Problem, 'file' | 'line' | 'column' | 'path'>;

/** The code, message and hint of a catalogued problem, worded from its arguments. */
export function wording<C extends ProblemCode>(code: C, args: ProblemArgs<C>): { code: C; message: string; hint?: string } {
  const e = catalogue[code] as unknown as CatalogueEntry<ProblemArgs<C>>;
  const hint = e.hint(args);
  return hint === undefined ? { code, message: e.message(args) } : { code, message: e.message(args), hint };
}

/** A catalogued problem at a place, with the catalogue's severity unless one is given. */
export function problem<C extends ProblemCode>(code: C, args: ProblemArgs<C>, place: ProblemPlace = {}, severity?: Severity): Problem {
  const e = catalogue[code] as unknown as CatalogueEntry<ProblemArgs<C>>;
  const w = wording(code, args);
  const p: Problem = { severity: severity ?? e.severity, code, ...definedOnly(place), message: w.message };
  if (w.hint !== undefined) p.hint = w.hint;
  return p;
}

function definedOnly(place: ProblemPlace): ProblemPlace {
  return Object.fromEntries(Object.entries(place).filter(([, v]) => v !== undefined)) as ProblemPlace;
}
