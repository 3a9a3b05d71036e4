/**
 * Problems found in a curator's files. Every message a user sees goes through
 * here: what happened, where (file:line:col and the path inside the plan), and
 * what to do. Errors stop the build; warnings say what the pipeline did instead.
 */

export type Severity = 'error' | 'warning';

export interface Problem {
  severity: Severity;
  /** Stable code, e.g. "plan/unknown-measure". */
  code: string;
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

/** Thrown when a stage cannot go on; carries every problem found so far. */
export class ProblemsError extends Error {
  readonly problems: Problem[];
  constructor(problems: Problem[]) {
    super(problems.map(formatProblem).join('\n'));
    this.name = 'ProblemsError';
    this.problems = problems;
  }
}

export function hasErrors(problems: readonly Problem[]): boolean {
  return problems.some((p) => p.severity === 'error');
}
