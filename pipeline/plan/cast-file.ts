/**
 * A cast file for ad-hoc measuring (`vitrine measure --text FILE --cast
 * CAST.yaml`): a YAML list of cast entries, checked as strictly as the plan's
 * own `cast:` list — the same schema, duplicate ids, names given to two
 * characters, invisible direction controls — with file:line:col for each.
 */
import { readFile } from 'node:fs/promises';
import { z } from 'zod';
import type { Problem } from '../problems/problem.ts';
import { problem, wording } from '../problems/problem.ts';
import { readFileText } from '../text/decode.ts';
import type { CastMember } from '../text/model.ts';
import { checkNameCharacters, checkSharedNames, checkUniqueIds } from './check-ids.ts';
import { issueProblems } from './issues.ts';
import { makeReporter } from './raw.ts';
import { castMemberSchema } from './schema.ts';
import { formatPath, readPlanSource } from './source.ts';
import type { PathSegment, PlanSource, Position } from './source.ts';

export interface Place {
  file: string;
  line: number;
  column: number;
  path: string;
}

export interface CastFile {
  /** The cast, or empty when there is any error. */
  cast: CastMember[];
  /** Per member: where its name and each alias are written. */
  places: { name: Place; aliases: Place[] }[];
  problems: Problem[];
}

/** The file's source seen as the plan's `cast:` list, so that the plan's checks place their problems in it. */
function asCastSection(source: PlanSource): PlanSource {
  const strip = (path: readonly PathSegment[]): PathSegment[] => (path[0] === 'cast' ? path.slice(1) : [...path]);
  return {
    data: { cast: source.data },
    problems: source.problems,
    at: (path) => source.at(strip(path)),
    keyAt: (path, key) => source.keyAt(strip(path), key),
    find: (path, needle) => source.find(strip(path), needle),
  };
}

export async function readCastFile(file: string, shown: string): Promise<CastFile> {
  const none = (problems: Problem[]): CastFile => ({ cast: [], places: [], problems });
  let bytes: Uint8Array;
  try {
    bytes = await readFile(file);
  } catch (e) {
    return none([problem('cast/unreadable', { reason: (e as NodeJS.ErrnoException).code ?? String(e) }, { file: shown })]);
  }
  const decoded = readFileText(bytes, shown);
  if (decoded.text === null) return none(decoded.problems);
  const source = readPlanSource(decoded.text.replace(/^\uFEFF/, ''));
  const problems: Problem[] = [...decoded.problems, ...source.problems.map((p) => ({ ...p, file: shown }))];
  if (source.data === undefined) return none(problems);
  if (!Array.isArray(source.data)) {
    const at: Position = source.at([]);
    return none([...problems, problem('cast/not-a-list', {}, { file: shown, line: at.line, column: at.column })]);
  }
  const section = asCastSection(source);
  const r = makeReporter(section, shown);
  const plan = { cast: source.data };
  const schema = z.object({ cast: z.array(castMemberSchema) });
  const parsed = schema.safeParse(plan);
  if (!parsed.success) {
    r.problems.push(
      ...issueProblems(parsed.error.issues, {
        file: shown,
        source: section,
        schema,
        value: plan,
        base: [],
        unknownKey: { word: (key, hint) => wording('plan/unknown-key', { key, hint }), plural: 'keys of a cast entry' },
      }),
    );
  }
  checkUniqueIds(plan, r);
  checkSharedNames(plan, r);
  checkNameCharacters(plan, r);
  problems.push(...r.problems);
  if (!parsed.success || problems.some((p) => p.severity === 'error')) return none(problems);
  const place = (path: PathSegment[]): Place => ({ file: shown, ...section.at(path), path: formatPath(path) });
  return {
    cast: parsed.data.cast.map((c) => ({ id: c.id, name: c.name, aliases: c.aliases, ...(c.pronoun ? { pronoun: c.pronoun } : {}) })),
    places: parsed.data.cast.map((c, i) => ({ name: place(['cast', i, 'name']), aliases: c.aliases.map((_, k) => place(['cast', i, 'aliases', k])) })),
    problems,
  };
}
