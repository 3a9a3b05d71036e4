import type { Problem, ProblemPlace } from '../problems/problem.ts';
import { problem } from '../problems/problem.ts';
import type { ProblemArgs, ProblemCode } from '../problems/catalogue.ts';
import type { Where } from './jobs.ts';

/** A catalogued problem at a place in the plan. */
export function atWhere<C extends ProblemCode>(where: Where, code: C, args: ProblemArgs<C>): Problem {
  const place: ProblemPlace = { file: where.file, line: where.line, column: where.column, path: where.path };
  return problem(code, args, place);
}
