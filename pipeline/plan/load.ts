/**
 * Loading an exhibit plan: read the YAML with positions, validate it against
 * the schema and the registry, check every file it names, and resolve it.
 * Every problem is reported in one run, sorted by position; the plan is
 * returned only when there is no error.
 */
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import type { Problem } from '../problems/problem.ts';
import { hasErrors, problem, sortProblems, wording } from '../problems/problem.ts';
import { checkFiles } from './check-files.ts';
import { checkNameCharacters, checkSharedNames, checkUniqueIds } from './check-ids.ts';
import { checkPanels } from './check-panels.ts';
import { displayPath } from './files.ts';
import { issueProblems } from './issues.ts';
import { asRecord, makeReporter } from './raw.ts';
import type { Registry } from './registry.ts';
import { resolvePlan } from './resolve.ts';
import { planSchema } from './schema.ts';
import { readPlanSource } from './source.ts';
import { readFileText } from '../text/decode.ts';
import type { LoadOptions, PlanResult } from './types.ts';

export type { LoadOptions, Plan, PlanResult } from './types.ts';

function reason(error: unknown): string {
  const code = (error as { code?: unknown }).code;
  if (code === 'ENOENT') return 'the file does not exist';
  if (code === 'EISDIR') return 'it is a folder, not a file';
  if (code === 'EACCES') return 'permission denied';
  return error instanceof Error ? error.message : String(error);
}

/**
 * Loads the plan at `planPath` (relative to `opts.cwd`, default the working
 * directory) and checks it against `registry`.
 */
export async function loadPlan(planPath: string, registry: Registry, opts: LoadOptions = {}): Promise<PlanResult> {
  const cwd = path.resolve(opts.cwd ?? process.cwd());
  const file = path.resolve(cwd, planPath);
  const dir = path.dirname(file);
  const shownFile = displayPath(file, cwd);
  const done = (problems: Problem[], plan: PlanResult['plan'] = null): PlanResult => ({ plan, problems: sortProblems(problems), dir, file });

  let bytes: Uint8Array;
  try {
    bytes = await readFile(file);
  } catch (error) {
    return done([
      problem('plan/unreadable', { reason: reason(error) }, { file: shownFile }),
    ]);
  }
  const decoded = readFileText(bytes, shownFile);
  if (decoded.text === null) return done(decoded.problems);
  let text = decoded.text;
  if (text.startsWith('\uFEFF')) text = text.slice(1);

  const source = readPlanSource(text);
  const syntax: Problem[] = source.problems.map((p) => ({ ...p, file: shownFile }));
  syntax.push(...decoded.problems);
  if (source.data === undefined) return done(syntax);
  if (source.data === null) {
    return done([
      ...syntax,
      problem('plan/empty', { what: 'plan' }, { file: shownFile, line: 1, column: 1 }),
    ]);
  }

  const raw = asRecord(source.data);
  const r = makeReporter(source, shownFile);
  r.problems.push(...syntax);
  const parsed = planSchema.safeParse(source.data);
  if (!parsed.success) {
    r.problems.push(
      ...issueProblems(parsed.error.issues, {
        file: shownFile,
        source,
        schema: planSchema,
        value: source.data,
        base: [],
        unknownKey: { word: (key, hint) => wording('plan/unknown-key', { key, hint }), plural: 'keys allowed here' },
      }),
    );
  }
  if (raw === undefined) return done(r.problems);

  checkUniqueIds(raw, r);
  checkSharedNames(raw, r);
  checkNameCharacters(raw, r);
  const settings = checkPanels(raw, registry, r);
  const files = await checkFiles(raw, dir, cwd, r);

  if (!parsed.success || hasErrors(r.problems)) return done(r.problems);
  const plan = resolvePlan({ data: parsed.data, source, shownFile, file, dir, files, settings });
  return done(r.problems, plan);
}
