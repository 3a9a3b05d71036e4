/**
 * The curators' list of problems (docs/problems.md), written from the
 * catalogue: `npm run docs` rewrites it, and a test fails when the file on
 * disk differs from what the catalogue gives.
 */
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { catalogue } from './catalogue.ts';
import type { CatalogueEntry, ProblemCode } from './catalogue.ts';

/** Headings for the first part of a code; a part not listed here is shown as it is. */
const AREAS: Record<string, string> = {
  plan: 'The plan (exhibit.yaml)',
  file: 'Reading files (texts, word lists, cast files, the plan)',
  text: 'Texts',
  lexicon: 'Word lists',
  dialogue: 'Dialogue',
  panel: 'Panels',
  note: 'Notes',
  caption: 'Captions',
  build: 'Building the site',
  cache: 'The result cache',
  cli: 'The command line',
  cast: 'The cast (in the plan or a --cast file)',
};

export const DOCS_FILE = 'docs/problems.md';

export function problemsDoc(): string {
  const out: string[] = [
    '# Problems Vitrine reports',
    '',
    '<!-- Written by `npm run docs` from pipeline/problems/catalogue.ts: edit the catalogue, not this file. -->',
    '',
    'Every message names the file, line and column (and, for the plan, the path inside it, such as',
    '`rooms[1].panels[2].measure`), says what is wrong, and after the dash what to do. **Errors** stop',
    '`vitrine check` and `vitrine build` before anything is written; **warnings** say what was done instead,',
    'and the build goes on. The code in brackets is stable: search this page for it.',
    '',
  ];
  const byArea = new Map<string, ProblemCode[]>();
  for (const code of Object.keys(catalogue) as ProblemCode[]) {
    const area = AREAS[code.split('/')[0]!] ?? code.split('/')[0]!;
    byArea.set(area, [...(byArea.get(area) ?? []), code]);
  }
  for (const [area, codes] of byArea) {
    out.push(`## ${area}`, '');
    for (const code of codes) {
      const e = catalogue[code] as unknown as CatalogueEntry<unknown>;
      const hint = e.hint(e.example);
      out.push(`### ${e.title} (\`${code}\`)`, '');
      out.push(`${e.severity === 'error' ? 'Error' : 'Warning'}. For example:`, '');
      out.push(`> ${e.message(e.example)}${hint ? ` — ${hint}` : ''}`, '');
    }
  }
  return out.join('\n');
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const target = fileURLToPath(new URL(`../../${DOCS_FILE}`, import.meta.url));
  writeFileSync(target, problemsDoc());
  console.log(`Wrote ${DOCS_FILE}`);
}
