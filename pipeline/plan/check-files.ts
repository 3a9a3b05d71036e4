/**
 * Every file the plan names: the exhibit's intro and rights statement, each
 * text's source, each room's intro and each panel's caption.
 */
import { realpath } from 'node:fs/promises';
import { checkFile, displayPath } from './files.ts';
import type { FileRule } from './files.ts';
import { asList, asRecord, asText, panelsOf } from './raw.ts';
import type { RawRecord, Reporter } from './raw.ts';
import type { PathSegment } from './source.ts';
import { formatPath } from './source.ts';

interface Named {
  path: PathSegment[];
  written: string;
  rule: FileRule;
}

function namedFiles(plan: RawRecord): Named[] {
  const out: Named[] = [];
  const add = (path: PathSegment[], value: unknown, rule: FileRule): void => {
    const written = asText(value);
    if (written !== undefined) out.push({ path, written, rule });
  };
  const exhibit = asRecord(plan.exhibit);
  add(['exhibit', 'intro'], exhibit?.intro, { what: 'introduction', mdx: true });
  add(['exhibit', 'rights'], exhibit?.rights, { what: 'rights statement', mdx: true });
  asList(plan.texts).forEach((text, i) => add(['texts', i, 'source'], asRecord(text)?.source, { what: 'text', mdx: false }));
  asList(plan.rooms).forEach((room, i) => add(['rooms', i, 'intro'], asRecord(room)?.intro, { what: 'room introduction', mdx: true }));
  for (const { panel, path } of panelsOf(plan)) add([...path, 'caption'], panel.caption, { what: 'caption', mdx: true });
  asList(plan.lexicons).forEach((lex, i) => add(['lexicons', i, 'file'], asRecord(lex)?.file, { what: 'word list', mdx: false }));
  return out;
}

/** Checks every named file; returns the absolute path of each good one, keyed by its plan path. */
export async function checkFiles(plan: RawRecord, dir: string, cwd: string, r: Reporter): Promise<Map<string, string>> {
  const resolved = new Map<string, string>();
  let realDir = dir;
  try {
    realDir = await realpath(dir);
  } catch {
    // The folder was just read from; if it vanished, every file will be reported missing.
  }
  const shownDir = displayPath(dir, cwd);
  const results = await Promise.all(namedFiles(plan).map(async (f) => ({ f, result: await checkFile(f.written, f.rule, dir, realDir, shownDir) })));
  for (const { f, result } of results) {
    for (const wording of result.problems) r.report(f.path, wording);
    if (result.problems.length === 0 && result.absolute !== undefined) resolved.set(formatPath(f.path), result.absolute);
  }
  return resolved;
}
