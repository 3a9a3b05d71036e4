/**
 * Reading the word lists a plan names (stage 2 of pipeline/exhibit.ts): each
 * file is decoded strictly (UTF-8, or UTF-16), then parsed once; every
 * malformed line is reported with its position.
 */
import { readFileSync } from 'node:fs';
import type { LexiconJob } from './jobs.ts';
import type { WordCategories } from '../measures/types.ts';
import type { Problem } from '../problems/problem.ts';
import { problem } from '../problems/problem.ts';
import { parseCategoryLexicon } from '../lexicons/categories.ts';
import { readFileText } from '../text/decode.ts';

export function readLexicons(jobs: LexiconJob[], problems: Problem[]): Record<string, WordCategories> {
  const out: Record<string, WordCategories> = {};
  for (const job of jobs) {
    let bytes: Uint8Array;
    try {
      bytes = readFileSync(job.file);
    } catch (e) {
      problems.push(problem('lexicon/unreadable', { reason: (e as NodeJS.ErrnoException).code ?? String(e) }, { file: job.display }));
      continue;
    }
    // Decoded as strictly as a text: a Latin-1 list would otherwise lose its accented words to replacement characters.
    const decoded = readFileText(bytes, job.display);
    problems.push(...decoded.problems);
    if (decoded.text === null) continue;
    const parsed = parseCategoryLexicon(decoded.text, job.display, job.id);
    for (const p of parsed.problems) {
      problems.push(problem('lexicon/malformed', { detail: p.message, ...(p.hint ? { hint: p.hint } : {}) }, { file: job.display, line: p.line, column: p.column }));
    }
    if (parsed.lexicon) out[job.id] = parsed.lexicon;
  }
  return out;
}
