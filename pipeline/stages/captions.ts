/**
 * The caption stage of pipeline/exhibit.ts: the caption and introduction files
 * the site renders are checked on every preparation (the exhibit cache keeps
 * stages 1–5, which never read a caption). A check of what a caption holds
 * belongs here, so that it runs whenever a caption changes.
 */
import { realpathSync } from 'node:fs';
import { checkFile } from '../plan/files.ts';
import type { Wording } from '../plan/raw.ts';

/** Problems with the caption files, worded as the plan's file checks word them; none when all are in place. */
export async function checkCaptions(files: readonly string[], dir: string, shownDir: string): Promise<Wording[]> {
  const realDir = realpathSync(dir);
  const out: Wording[] = [];
  for (const f of files) out.push(...(await checkFile(f, { what: 'caption', mdx: true }, dir, realDir, shownDir)).problems);
  return out;
}
