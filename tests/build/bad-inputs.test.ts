/**
 * The catalogue of bad inputs, kept as tests: each row breaks a fresh copy of
 * the demo exhibit in one way a curator could, runs the command a curator
 * would, and checks the exit status, the codes of the problems reported, what
 * the message says, and that nothing of the curator's was touched and no site
 * was written.
 *
 * Rows run in this process, through the CLI's own `main` (so the codes of the
 * problems can be read as data), each in its own folder as working directory.
 * Rows that leave the measures as they are share one warm cache; rows about
 * the cache bring their own. Expected messages are the project's own wording.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cpSync, existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';
import { main } from '../../pipeline/cli.ts';
import type { Problem } from '../../pipeline/problems/problem.ts';
import { ROOT, positionOf, replaceIn, treeHashes } from './helpers.ts';

/** A copy of the demo exhibit to break: `root` is the working directory, `content/` the exhibit folder. */
export interface Exhibit {
  root: string;
  dir: string;
  plan: string;
  text: string;
  lexicon: string;
}

export interface BadInput {
  /** The case, in the words of the catalogue. */
  name: string;
  /** Breaks the copy. */
  setup?: (ex: Exhibit) => void;
  /** The command, run in `root` (default: check the plan). */
  args?: (ex: Exhibit) => string[];
  /** Cache: "shared" (warm, default), "own" (`root`/.vitrine/cache, as a curator's run has), or "none" (--no-cache). */
  cache?: 'shared' | 'own' | 'none';
  status: number;
  /** The codes of every problem reported (errors and warnings), in any order. */
  codes: string[];
  /** What the output says (stderr, then stdout). */
  says: (RegExp | ((ex: Exhibit) => RegExp))[];
  /** At most this many lines on stderr: one fault, one message. */
  maxErrorLines?: number;
  /** Further checks on the finished run. */
  after?: (ex: Exhibit, run: Run) => void;
}

interface Run {
  status: number;
  stdout: string;
  stderr: string;
  problems: Problem[];
}

const scratch: string[] = [];
afterAll(() => {
  for (const d of scratch) rmSync(d, { recursive: true, force: true });
});

function demoExhibit(): Exhibit {
  const root = mkdtempSync(join(tmpdir(), 'vitrine-bad-'));
  scratch.push(root);
  cpSync(join(ROOT, 'content'), join(root, 'content'), { recursive: true });
  const dir = join(root, 'content');
  return {
    root,
    dir,
    plan: join(dir, 'exhibit.yaml'),
    text: join(dir, 'texts/the-lamps-of-wendle-staithe.txt'),
    lexicon: join(dir, 'data/moods.tsv'),
  };
}

/** Runs the CLI in-process in `cwd`, as `vitrine ARGS` would run there. */
async function vitrineHere(args: string[], cwd: string, env: Record<string, string | undefined>): Promise<Run> {
  const saved = Object.fromEntries(Object.keys(env).map((k) => [k, process.env[k]]));
  const before = process.cwd();
  let stdout = '';
  let stderr = '';
  const problems: Problem[] = [];
  for (const [k, v] of Object.entries(env)) {
    if (v === undefined) delete process.env[k];
    else process.env[k] = v;
  }
  process.chdir(cwd);
  try {
    const status = await main(args, { out: (s) => (stdout += s), err: (s) => (stderr += s), problems: (p) => problems.push(...p) });
    return { status, stdout, stderr, problems };
  } finally {
    process.chdir(before);
    for (const [k, v] of Object.entries(saved)) {
      if (v === undefined) delete process.env[k];
      else process.env[k] = v;
    }
  }
}

let sharedCache: string;
/** The demo's own check: what an unbroken exhibit prints. */
let baseline: Run;

beforeAll(async () => {
  sharedCache = mkdtempSync(join(tmpdir(), 'vitrine-bad-cache-'));
  scratch.push(sharedCache);
  const ex = demoExhibit();
  baseline = await vitrineHere(['check', ex.plan, '--cache', sharedCache], ex.root, {});
  expect(baseline.stderr).toBe('');
  expect(baseline.status).toBe(0);
});

/** Gives the copy its own cache, a copy of the warm one with every entry rewritten. */
function warmCacheRewritten(ex: Exhibit, rewrite: (entry: string) => string): void {
  const dir = join(ex.root, '.vitrine/cache');
  mkdirSync(dir, { recursive: true });
  cpSync(sharedCache, dir, { recursive: true });
  for (const f of readdirSync(dir)) writeFileSync(join(dir, f), rewrite(readFileSync(join(dir, f), 'utf8')));
}

/** The "Text …: N words, M chapters" line and the chapter list of a check's output. */
const reading = (stdout: string): string[] => stdout.split('\n').filter((l) => /^Text "|^\s+\d+\. /.test(l));

const TEXT = 'content/texts/the-lamps-of-wendle-staithe.txt';

export const rows: BadInput[] = [
  // ——— Silent wrong readings ———
  {
    name: 'a text saved as UTF-16 without a byte order mark is decoded, with a warning',
    setup: (ex) => writeFileSync(ex.text, Buffer.from(readFileSync(ex.text, 'utf8'), 'utf16le')),
    status: 0,
    codes: ['file/utf16-no-bom'],
    says: [new RegExp(`${TEXT} texts\\[0\\]: warning: ${TEXT} has no byte order mark, but the pattern of its zero bytes shows it is UTF-16 \\(little-endian\\)`)],
    // Read as the UTF-8 original is: the same words and chapters.
    after: (_ex, run) => expect(reading(run.stdout)).toEqual(reading(baseline.stdout)),
  },
  {
    name: 'an empty text is an error naming the file',
    setup: (ex) => writeFileSync(ex.text, ''),
    status: 1,
    codes: ['text/empty'],
    says: [new RegExp(`${TEXT} texts\\[0\\]: the text "lamps" has no words between its start and end markers, so there is nothing to measure — check that the "start:" and "end:" markers`)],
  },
  {
    name: 'a common word as an alias is a warning with the counts',
    setup: (ex) => replaceIn(ex.plan, 'aliases: [Tamsin, Miss Rook, Tam, Tansy, the lamplighter]', 'aliases: [Tamsin, Miss Rook, Tam, Tansy, the lamplighter, the]'),
    status: 0,
    codes: ['cast/common-word-alias'],
    says: [
      (ex) => {
        const at = positionOf(ex.plan, 'the]');
        return new RegExp(`content/exhibit\\.yaml:${at.line}:${at.column} cast\\[0\\]\\.aliases\\[5\\]: warning: the alias "the" of "tamsin" is a common word, so it counts every "the" in the text as Tamsin Rook: in "lamps" it matched [\\d,]+ times, against [\\d,]+ times for all the other names of Tamsin Rook together`);
      },
    ],
  },
  {
    name: 'a text with no headings found is read as one chapter, with a warning that says how to mark chapters',
    // Measured ad hoc: the demo's notes and pins name chapters 2 to 6, which would then be errors of their own.
    setup: (ex) => writeFileSync(join(ex.root, 'tale.txt'), readFileSync(ex.text, 'utf8').replace(/^CHAPTER .*$/gm, '')),
    args: () => ['measure', '--text', 'tale.txt', '--measure', 'structure'],
    status: 0,
    codes: ['text/no-headings'],
    says: [/^tale\.txt: warning: no chapter headings were found in the text "tale\.txt", so the whole text is read as one chapter, "Whole text" — if it has chapters, put each heading on a line of its own/],
    after: (_ex, run) => expect(JSON.parse(run.stdout).chapters.map((c: { title: string }) => c.title)).toEqual(['Whole text']),
  },
  {
    name: 'a Latin-1 word list is an error at the first bad byte',
    setup: (ex) => writeFileSync(ex.lexicon, Buffer.concat([readFileSync(ex.lexicon), Buffer.from('café\tcomfort\n', 'latin1')])),
    status: 1,
    codes: ['file/not-utf8'],
    says: [
      (ex) => {
        const line = readFileSync(ex.lexicon, 'latin1').split('\n').length - 1;
        return new RegExp(`content/data/moods\\.tsv:${line}:4: content/data/moods\\.tsv is not valid UTF-8: the byte 0xE9 at line ${line}, column 4`);
      },
    ],
  },

  // ——— Crashes and leftovers ———
  {
    name: 'a cache entry of the wrong shape is computed again, with a warning',
    cache: 'own',
    // Every entry keeps its envelope but loses its result.
    setup: (ex) => warmCacheRewritten(ex, (entry) => JSON.stringify({ ...JSON.parse(entry), value: {} })),
    status: 0,
    codes: ['cache/bad-entry'],
    says: [/warning: \d+ cached results could not be used \(.*\), so they were computed again and saved afresh/],
    after: (_ex, run) => expect(reading(run.stdout)).toEqual(reading(baseline.stdout)),
  },
  {
    name: 'cache entries that are not cache entries at all are computed again when measuring a panel',
    cache: 'own',
    setup: (ex) => warmCacheRewritten(ex, () => '[]'),
    args: (ex) => ['measure', ex.plan, '--panel', 'chapter-lengths'],
    status: 0,
    codes: ['cache/bad-entry'],
    says: [/it is not a cache entry of this version of Vitrine/],
    after: (_ex, run) => expect(JSON.parse(run.stdout).chapters).toHaveLength(6),
  },
  {
    name: 'a file where the cache folder should be: measured without a cache, with a warning',
    cache: 'own',
    setup: (ex) => {
      mkdirSync(join(ex.root, '.vitrine'));
      writeFileSync(join(ex.root, '.vitrine/cache'), 'a curator’s file\n');
    },
    status: 0,
    codes: ['cache/unusable-folder'],
    says: [/^\.vitrine\/cache: warning: the cache folder cannot be used: it, or a folder above it, is a file; every measure was computed afresh/m],
    after: (ex) => expect(readFileSync(join(ex.root, '.vitrine/cache'), 'utf8')).toBe('a curator’s file\n'),
  },
  {
    name: '"base: //host/" in the plan is an error: the base must be a path',
    setup: (ex) => replaceIn(ex.plan, 'base: /', 'base: //cdn.example/'),
    status: 1,
    codes: ['plan/bad-base'],
    says: [/exhibit\.base: the base path "\/\/cdn\.example\/" names another host .* — write only the path the site is served under/],
  },
  {
    name: '"--base http://…" is refused before anything is built',
    args: (ex) => ['build', ex.plan, '--base', 'http://example.org/weir/'],
    status: 2,
    codes: [],
    says: [/^--base: the base path "http:\/\/example\.org\/weir\/" is a web address, not a path — /],
  },
  {
    name: 'one missing } gives one error, at the brace',
    setup: (ex) => replaceIn(ex.plan, 'speaker: jory, addressee: tamsin }', 'speaker: jory, addressee: tamsin'),
    status: 1,
    codes: ['plan/yaml-syntax'],
    maxErrorLines: 1,
    says: [
      (ex) => {
        const at = positionOf(ex.plan, '{ chapter: 2, startsWith: "You’ve grown');
        return new RegExp(`^content/exhibit\\.yaml:${at.line}:${at.column}: the YAML is not well-formed here: the \\{ mapping \\} that opens here is not closed — add the closing \\}`);
      },
    ],
  },
  {
    name: 'one tab gives one error, at the tab',
    setup: (ex) => replaceIn(ex.plan, '\n    pronoun: she', '\n\t  pronoun: she'),
    status: 1,
    codes: ['plan/yaml-syntax'],
    maxErrorLines: 1,
    says: [
      (ex) => {
        const at = positionOf(ex.plan, '\t  pronoun: she');
        return new RegExp(`^content/exhibit\\.yaml:${at.line}:1: the YAML is not well-formed here: a tab is used for indentation — indent with spaces`);
      },
    ],
  },
  {
    name: 'a 5 MB title is refused with its length, in a short message',
    setup: (ex) => replaceIn(ex.plan, 'title: Lamps and High Water', `title: ${'Lamps '.repeat(900_000)}`),
    status: 1,
    codes: ['plan/too-long'],
    says: [/exhibit\.title: the text may be at most 200 characters long, and this one has 5,399,999 — shorten it/],
    after: (_ex, run) => expect(run.stderr.length).toBeLessThan(1000),
  },
  {
    name: 'bad ad-hoc --param values get the plan’s hints: nearest name, expected type, documented default',
    args: () => ['measure', '--text', TEXT, '--measure', 'concordance', '--param', 'nod=lamp', '--param', 'width=wide'],
    status: 2,
    codes: ['plan/unknown-param', 'plan/wrong-type'],
    says: [
      /^--param nod: unknown parameter "nod" for measure "concordance" — did you mean "node"\? \("node" is required\)$/m,
      /^--param width: expected a number, found the text "wide" — Words of context on each side of the node.* Default: 8\.$/m,
    ],
  },
  {
    name: 'an ad-hoc cast file with a duplicate id, a blank alias and a direction control, each at file:line:col',
    setup: (ex) =>
      writeFileSync(
        join(ex.root, 'cast.yaml'),
        ['- id: tamsin', '  name: Tamsin Rook', '  aliases: [Tamsin, " "]', '- id: tamsin', '  name: "Jory \u202ERook"', ''].join('\n'),
      ),
    args: () => ['measure', '--text', TEXT, '--measure', 'presence', '--cast', 'cast.yaml'],
    status: 1,
    codes: ['plan/blank', 'plan/duplicate-id', 'cast/direction-control'],
    says: [/^cast\.yaml:3:21 cast\[0\]\.aliases\[1\]: the value is only white space/m, /^cast\.yaml:4:7 cast\[1\]\.id: the cast id "tamsin" is used more than once/m, /^cast\.yaml:5:15 cast\[1\]\.name: the name holds an invisible direction control, U\+202E RIGHT-TO-LEFT OVERRIDE/m],
  },
  {
    name: 'an alias of white space only in the plan is an error at the alias',
    setup: (ex) => replaceIn(ex.plan, 'aliases: [Jory, Mr Rook', 'aliases: ["   ", Mr Rook'),
    status: 1,
    codes: ['plan/blank'],
    says: [/cast\[1\]\.aliases\[0\]: the value is only white space — write a value, or remove it/],
  },
];

describe('the bad-input catalogue', () => {
  it.each(rows.map((row) => [row.name, row] as const))('%s', async (_name, row) => {
    const ex = demoExhibit();
    row.setup?.(ex);
    const before = treeHashes(ex.dir);
    const args = row.args?.(ex) ?? ['check', ex.plan];
    const cache = row.cache ?? 'shared';
    const run = await vitrineHere(cache === 'none' ? [...args, '--no-cache'] : cache === 'shared' ? [...args, '--cache', sharedCache] : args, ex.root, {});
    const output = `${run.stderr}\n${run.stdout}`;
    expect(output).not.toMatch(/internal error|\n\s+at .*:\d+:\d+\)?\n/);
    expect({ status: run.status, codes: run.problems.map((p) => p.code).sort() }).toEqual({ status: row.status, codes: [...row.codes].sort() });
    for (const says of row.says) expect(output).toMatch(typeof says === 'function' ? says(ex) : says);
    if (row.maxErrorLines !== undefined) expect(run.stderr.trim().split('\n')).toHaveLength(row.maxErrorLines);
    // Nothing of the curator's was touched, and no site was written.
    expect(treeHashes(ex.dir)).toEqual(before);
    expect(existsSync(join(ex.root, 'dist'))).toBe(false);
    row.after?.(ex, run);
  });
});
