/**
 * Every problem Vitrine can report, in one place: its stable code, a title,
 * the message and the hint (what to do) as functions of what the check found,
 * the usual severity, and an example for the curators' list of problems
 * (docs/problems.md, written from this file by `npm run docs`).
 *
 * A check never writes a message of its own: it names a code and gives the
 * arguments (`problem()` and `wording()` in ./problem.ts). Adding a check
 * means adding its entry here; tests/problems/catalogue.test.ts fails when a
 * code is used in the code base that this catalogue lacks.
 */
import type { Severity } from './problem.ts';

export interface CatalogueEntry<A> {
  /** A few words, for the list of problems. */
  title: string;
  /** Errors stop the build; warnings say what was done instead. */
  severity: Severity;
  /** What is wrong, in one sentence. */
  message: (args: A) => string;
  /** What to do about it (undefined when the message already says). */
  hint: (args: A) => string | undefined;
  /** Arguments of a typical case: the list of problems shows the message and hint they give. */
  example: A;
}

function entry<A>(e: CatalogueEntry<A>): CatalogueEntry<A> {
  return e;
}

/** A hint given as it is (often a field's own description from the plan schema). */
const given = (a: { hint?: string }): string | undefined => a.hint;

const STAY_INSIDE = (dir: string) => `paths must stay inside the exhibit folder (${dir}); move the file into it and write the path relative to it`;
const NOT_WELL_FORMED = 'the YAML is not well-formed here';
const RESAVE = 'open it in a text editor and save it again as UTF-8 (in most editors: Save As, then choose the "UTF-8" encoding), then run the command again';
/** What to write as a base path: shared by the plan's check and --base. */
export const BASE_HINT =
  'write only the path the site is served under, starting and ending with "/": "/" for the root of its domain, or e.g. "/weir/" for a sub-folder (the host name comes from wherever the site is served)';
const plural = (n: number, word: string): string => `${n.toLocaleString('en-GB')} ${word}${n === 1 ? '' : 's'}`;
/** How often an alias matched, against the character's other names. */
const tally = (a: { text: string; count: number; others: number; name: string }): string =>
  `in "${a.text}" it matched ${plural(a.count, 'time')}, against ${plural(a.others, 'time')} for all the other names of ${a.name} together`;
const UTF16 = { 'utf-16le': 'UTF-16 (little-endian)', 'utf-16be': 'UTF-16 (big-endian)' } as const;

export const catalogue = {
  // ——— the plan file ———
  'plan/unreadable': entry<{ reason: string }>({
    title: 'The plan cannot be read',
    severity: 'error',
    message: (a) => `cannot read the exhibit plan: ${a.reason}`,
    hint: () => 'check the path given to the command; the plan is normally content/exhibit.yaml',
    example: { reason: 'the file does not exist' },
  }),
  'plan/yaml-syntax': entry<{ detail: string; hint?: string; whole?: boolean }>({
    title: 'The plan is not well-formed YAML',
    severity: 'error',
    message: (a) => (a.whole ? a.detail : `${NOT_WELL_FORMED}: ${a.detail}`),
    hint: given,
    example: { detail: 'a tab is used for indentation', hint: 'indent with spaces' },
  }),
  'plan/duplicate-key': entry<{ key?: string }>({
    title: 'A key appears twice',
    severity: 'error',
    message: (a) => (a.key === undefined ? 'a key appears twice in the same mapping' : `the key "${a.key}" appears twice in the same mapping`),
    hint: () => 'keep only one of them',
    example: { key: 'title' },
  }),
  'plan/empty': entry<{ what: 'plan' | 'value'; hint?: string }>({
    title: 'Nothing written',
    severity: 'error',
    message: (a) => (a.what === 'plan' ? 'the exhibit plan is empty' : 'the value is empty'),
    hint: (a) => (a.what === 'plan' ? 'write "version: 1", then the "exhibit:", "texts:" and "rooms:" sections' : (a.hint ?? 'write a value, or remove the line')),
    example: { what: 'value' },
  }),
  'plan/unknown-key': entry<{ key: string; hint: string }>({
    title: 'A key the plan does not know',
    severity: 'error',
    message: (a) => `unknown key "${a.key}"`,
    hint: given,
    example: { key: 'titel', hint: 'did you mean "title"?' },
  }),

  // ——— values in the plan (worded from the schema's checks) ———
  'plan/missing-key': entry<{ key: string; about?: string }>({
    title: 'A required key is missing',
    severity: 'error',
    message: (a) => `"${a.key}" is missing`,
    hint: (a) => (a.about ? `add "${a.key}:" here (${a.about})` : `add "${a.key}:" here`),
    example: { key: 'organiser', about: 'Who puts on the exhibit, as credited on every page. Required.' },
  }),
  'plan/wrong-type': entry<{ expected: string; found: string; hint?: string }>({
    title: 'A value of the wrong kind',
    severity: 'error',
    message: (a) => `expected ${a.expected}, found ${a.found}`,
    hint: given,
    example: { expected: 'a whole number', found: 'the text "twelve"' },
  }),
  'plan/invalid-value': entry<{ detail: string; hint?: string }>({
    title: 'A value that is not accepted',
    severity: 'error',
    message: (a) => a.detail,
    hint: given,
    example: { detail: 'the text "bar" is not one of the accepted values', hint: 'did you mean "bars"? (accepted: "bars", "lines")' },
  }),
  'plan/too-few': entry<{ min: number; hint?: string }>({
    title: 'A list with too few entries',
    severity: 'error',
    message: (a) => `the list needs at least ${a.min} ${a.min === 1 ? 'entry' : 'entries'}`,
    hint: given,
    example: { min: 1 },
  }),
  'plan/too-many': entry<{ max: number; hint?: string }>({
    title: 'A list with too many entries',
    severity: 'error',
    message: (a) => `the list may have at most ${a.max} ${a.max === 1 ? 'entry' : 'entries'}`,
    hint: given,
    example: { max: 12 },
  }),
  'plan/too-short': entry<{ min: number; hint?: string }>({
    title: 'A text that is too short',
    severity: 'error',
    message: (a) => `the text must be at least ${a.min} characters long`,
    hint: given,
    example: { min: 3 },
  }),
  'plan/too-long': entry<{ max: number; length?: number; hint?: string }>({
    title: 'A text that is too long',
    severity: 'error',
    message: (a) => `the text may be at most ${a.max.toLocaleString('en-GB')} characters long${a.length !== undefined ? `, and this one has ${a.length.toLocaleString('en-GB')}` : ''}`,
    hint: (a) => (a.hint === undefined ? 'shorten it' : `shorten it (${a.hint})`),
    example: { max: 200, length: 5_242_880, hint: 'Title of the exhibit, at most 200 characters. Required.' },
  }),
  'plan/blank': entry<Record<string, never>>({
    title: 'A value of white space only',
    severity: 'error',
    message: () => 'the value is only white space',
    hint: () => 'write a value, or remove it',
    example: {},
  }),
  'plan/bad-url': entry<{ detail: string; hint: string }>({
    title: 'A public address that is not a web address',
    severity: 'error',
    message: (a) => a.detail,
    hint: given,
    example: { detail: 'the address "ftp://example.org/lamps/" must start with https:// or http://', hint: 'write the address readers will open, with http:// or https://, e.g. "https://example.org/lamps/"' },
  }),
  'plan/bad-base': entry<{ detail: string; hint: string }>({
    title: 'A base that is not a path',
    severity: 'error',
    message: (a) => a.detail,
    hint: given,
    example: {
      detail: 'the base path "//cdn.example/" names another host (it starts with "//"), so every page would load its stylesheets from there',
      hint: BASE_HINT,
    },
  }),
  'plan/too-small': entry<{ bound: string; found: string; hint?: string }>({
    title: 'A number that is too small',
    severity: 'error',
    message: (a) => `must be ${a.bound}, found ${a.found}`,
    hint: given,
    example: { bound: '2 or more', found: 'the number 1' },
  }),
  'plan/too-big': entry<{ bound: string; found: string; hint?: string }>({
    title: 'A number that is too big',
    severity: 'error',
    message: (a) => `must be ${a.bound}, found ${a.found}`,
    hint: given,
    example: { bound: '1000 or less', found: 'the number 5000' },
  }),
  'plan/bad-format': entry<{ detail: string; hint?: string }>({
    title: 'A value not in the expected form',
    severity: 'error',
    message: (a) => a.detail,
    hint: given,
    example: { detail: 'the language must be a two-letter ISO 639-1 code in lower case, e.g. "en"' },
  }),
  'plan/invalid-key': entry<{ key: string; reason?: string; hint?: string }>({
    title: 'A key the mapping does not accept',
    severity: 'error',
    message: (a) => `the key ${JSON.stringify(a.key)} is not accepted here${a.reason ? `: ${a.reason}` : ''}`,
    hint: given,
    example: { key: 'three', reason: 'a chapter is named by its number, 1-based (e.g. 3:)' },
  }),
  'plan/invalid': entry<{ detail: string; hint?: string }>({
    title: 'A value the plan cannot use',
    severity: 'error',
    message: (a) => a.detail,
    hint: given,
    example: { detail: 'the note points at more than one thing', hint: 'give exactly one of: chapter, character, word, segment' },
  }),

  // ——— ids and names ———
  'plan/duplicate-id': entry<{ label: string; id: string; line: number }>({
    title: 'An id used twice',
    severity: 'error',
    message: (a) => `the ${a.label} id "${a.id}" is used more than once`,
    hint: (a) => `it is first used on line ${a.line}; give each ${a.label} its own id`,
    example: { label: 'panel', id: 'who-appears', line: 41 },
  }),
  'cast/common-word-alias': entry<{ alias: string; id: string; name: string; text: string; count: number; others: number }>({
    title: 'An alias that is a common word',
    severity: 'warning',
    message: (a) => `the alias "${a.alias}" of "${a.id}" is a common word, so it counts every "${a.alias}" in the text as ${a.name}: ${tally(a)}`,
    hint: () => 'remove it, or make it a phrase only this character is called (e.g. "the old lamplighter")',
    example: { alias: 'the', id: 'tamsin', name: 'Tamsin Rook', text: 'lamps', count: 647, others: 30 },
  }),
  'cast/dominant-alias': entry<{ alias: string; id: string; name: string; text: string; count: number; others: number; multiple: number; file: string }>({
    title: 'An alias that outnumbers all the other names',
    severity: 'warning',
    message: (a) => `the alias "${a.alias}" of "${a.id}" matches more than ${a.multiple} times as often as the character's other names: ${tally(a)}`,
    hint: (a) => `look at a few of its places (vitrine measure --text ${a.file} --measure concordance --param node="${a.alias}"); if it also stands for other things, remove it or make it longer`,
    example: { alias: 'lamp', id: 'tamsin', name: 'Tamsin Rook', text: 'lamps', count: 212, others: 9, multiple: 10, file: 'content/texts/the-lamps-of-wendle-staithe.txt' },
  }),
  'cast/direction-control': entry<{ what: 'name' | 'alias'; code: string; control: string; index: number }>({
    title: 'An invisible direction control in a name',
    severity: 'error',
    message: (a) =>
      `the ${a.what} holds an invisible direction control, ${a.code} ${a.control} (character ${a.index}), which changes how the letters around it are shown and never matches the text`,
    hint: (a) => `delete it: retype the ${a.what}, or copy it again from the text`,
    example: { what: 'name', code: 'U+202E', control: 'RIGHT-TO-LEFT OVERRIDE', index: 5 },
  }),
  'plan/shared-alias': entry<{ name: string; first: string; second: string }>({
    title: 'Two characters share a name',
    severity: 'warning',
    message: (a) => `the name "${a.name}" is given to both "${a.first}" and "${a.second}"`,
    hint: () => 'where it appears in the text it will be counted as ambiguous, not given to either; remove it from one of them if it means one character',
    example: { name: 'rook', first: 'tamsin', second: 'jory' },
  }),

  // ——— the site's public address ———
  'plan/no-url': entry<Record<string, never>>({
    title: 'No public address for link previews',
    severity: 'warning',
    message: () =>
      'the plan gives no public address ("url") for the exhibit: link previews need absolute addresses, so pages carry their title and description for previews but no picture and no address, and chart downloads and embed snippets carry no link back',
    hint: () => 'add the address readers will open under "exhibit:", e.g. url: https://example.org/lamps/ (the social cards are drawn either way)',
    example: {},
  }),

  // ——— files the plan names ———
  'plan/path-outside': entry<{ what: string; written: string; dir: string; how: 'absolute' | 'outside' | 'link' }>({
    title: 'A path that leaves the exhibit folder',
    severity: 'error',
    message: (a) =>
      a.how === 'absolute'
        ? `the ${a.what} path "${a.written}" is absolute`
        : a.how === 'outside'
          ? `the ${a.what} path "${a.written}" leads outside the exhibit folder`
          : `the ${a.what} path "${a.written}" leads outside the exhibit folder through a symbolic link`,
    hint: (a) => (a.how === 'link' ? `${STAY_INSIDE(a.dir)} (copy it rather than link to it)` : STAY_INSIDE(a.dir)),
    example: { what: 'text', written: '../novel.txt', dir: 'content', how: 'outside' },
  }),
  'plan/not-a-file': entry<{ what: string; written: string; folder: 'exhibit' | 'other' }>({
    title: 'A path that names a folder',
    severity: 'error',
    message: (a) => (a.folder === 'exhibit' ? `the ${a.what} path "${a.written}" names the exhibit folder itself` : `the ${a.what} path "${a.written}" is a folder, not a file`),
    hint: () => 'name a file inside it',
    example: { what: 'caption', written: 'captions', folder: 'other' },
  }),
  'plan/not-mdx': entry<{ what: string; written: string }>({
    title: 'A caption that is not Markdown',
    severity: 'error',
    message: (a) => `the ${a.what} "${a.written}" is not an MDX file`,
    hint: () => 'name a file ending in .mdx (or .md for plain Markdown)',
    example: { what: 'caption', written: 'captions/who-appears.txt' },
  }),
  'plan/missing-file': entry<{ what: string; written: string; looked: string }>({
    title: 'A file that does not exist',
    severity: 'error',
    message: (a) => `the ${a.what} file "${a.written}" does not exist`,
    hint: (a) => `looked for ${a.looked}; create it or correct the path`,
    example: { what: 'caption', written: 'captions/who-apears.mdx', looked: 'content/captions/who-apears.mdx' },
  }),

  // ——— panels ———
  'plan/missing-text': entry<{ ids: string }>({
    title: 'A panel that does not say which text it reads',
    severity: 'error',
    message: () => 'the panel does not say which text it reads, and the plan has several',
    hint: (a) => `add "text:" with one of: ${a.ids}`,
    example: { ids: '"lamps", "ledger"' },
  }),
  'plan/unknown-text': entry<{ text: string; hint: string }>({
    title: 'A panel names a text the plan lacks',
    severity: 'error',
    message: (a) => `unknown text "${a.text}"`,
    hint: given,
    example: { text: 'lamp', hint: 'did you mean "lamps"?' },
  }),
  'plan/unknown-measure': entry<{ measure: string; hint: string }>({
    title: 'A measure Vitrine does not have',
    severity: 'error',
    message: (a) => `unknown measure "${a.measure}"`,
    hint: given,
    example: { measure: 'frequncy', hint: 'did you mean "frequency"?' },
  }),
  'plan/needs-cast': entry<{ measure: string }>({
    title: 'A measure that needs a cast',
    severity: 'error',
    message: (a) => `the measure "${a.measure}" needs a cast, and the plan has none`,
    hint: () => 'add a "cast:" list naming the characters (id and name of each)',
    example: { measure: 'presence' },
  }),
  'plan/unknown-param': entry<{ key: string; measure: string; hint: string }>({
    title: 'A parameter the measure does not have',
    severity: 'error',
    message: (a) => `unknown parameter "${a.key}" for measure "${a.measure}"`,
    hint: given,
    example: { key: 'limt', measure: 'frequency', hint: 'did you mean "limit"?' },
  }),
  'plan/unknown-chart': entry<{ chart: string; hint: string }>({
    title: 'A chart kind Vitrine does not have',
    severity: 'error',
    message: (a) => `unknown chart "${a.chart}"`,
    hint: given,
    example: { chart: 'pie', hint: '"frequency" can be drawn as: "bars", "lines", "multiples", "treemap"' },
  }),
  'plan/chart-not-supported': entry<{ measure: string; chart: string; charts: string }>({
    title: 'A measure that cannot be drawn as this chart',
    severity: 'error',
    message: (a) => `the measure "${a.measure}" cannot be drawn as "${a.chart}"`,
    hint: (a) => (a.charts ? `it can be drawn as: ${a.charts}` : 'it names no chart it can be drawn as'),
    example: { measure: 'structure', chart: 'network', charts: '"bars", "lines"' },
  }),
  'plan/unknown-option': entry<{ key: string; chart: string; hint: string }>({
    title: 'An option the chart does not have',
    severity: 'error',
    message: (a) => `unknown option "${a.key}" for chart "${a.chart}"`,
    hint: given,
    example: { key: 'orientaton', chart: 'bars', hint: 'did you mean "orientation"?' },
  }),
  'plan/unknown-cast': entry<{ id: string; hint: string }>({
    title: 'A character the cast lacks',
    severity: 'error',
    message: (a) => `unknown cast member "${a.id}"`,
    hint: given,
    example: { id: 'tamsn', hint: 'did you mean "tamsin"?' },
  }),
  'plan/unknown-lexicon': entry<{ name: string; ids: string[] }>({
    title: 'A word list the plan does not name',
    severity: 'error',
    message: (a) => `unknown word list "${a.name}"`,
    hint: (a) => (a.ids.length ? `the plan's word lists are: ${a.ids.join(', ')}` : 'add a "lexicons:" list naming the file (id and file)'),
    example: { name: 'mood', ids: ['moods'] },
  }),

  // ——— any file read as text: texts, word lists, cast files, the plan ———
  'file/not-utf8': entry<{ file: string; byte: string; line: number; column: number; offset: number }>({
    title: 'A file that is not UTF-8',
    severity: 'error',
    message: (a) =>
      `${a.file} is not valid UTF-8: the byte ${a.byte} at line ${a.line}, column ${a.column} (byte offset ${a.offset}) is not part of a UTF-8 character (the file may be in Latin-1 or Windows-1252)`,
    hint: () => `Re-save the file as UTF-8: ${RESAVE}`,
    example: { file: 'data/moods.tsv', byte: '0xE9', line: 12, column: 4, offset: 181 },
  }),
  'file/zero-bytes': entry<{ file: string; line: number; column: number; offset: number }>({
    title: 'A file with zero bytes that is not UTF-16',
    severity: 'error',
    message: (a) =>
      `${a.file} holds a zero byte at line ${a.line}, column ${a.column} (byte offset ${a.offset}), which plain text never does: it may be a word-processor document, a damaged file, or in an encoding other than UTF-8 and UTF-16`,
    hint: () => `export or save it as plain text: ${RESAVE}`,
    example: { file: 'texts/tale.txt', line: 1, column: 1, offset: 0 },
  }),
  'file/utf32': entry<{ file: string }>({
    title: 'A file saved as UTF-32',
    severity: 'error',
    message: (a) => `${a.file} is saved as UTF-32, which is not read here`,
    hint: () => RESAVE,
    example: { file: 'texts/tale.txt' },
  }),
  'file/bad-utf16': entry<{ file: string; encoding: 'utf-16le' | 'utf-16be'; byMark: boolean; odd: boolean; line: number; column: number; offset: number }>({
    title: 'A UTF-16 file that is cut short or damaged',
    severity: 'error',
    message: (a) =>
      `${a.file} looks like ${UTF16[a.encoding]} (${a.byMark ? 'its byte order mark says so' : 'by the pattern of its zero bytes'}) but ${
        a.odd
          ? 'has an odd number of bytes, so its last character is cut short'
          : `the two bytes at line ${a.line}, column ${a.column} (byte offset ${a.offset}) are half of a character with no other half`
      }`,
    hint: (a) => (a.odd ? `check that the file was copied whole, then ${RESAVE}` : `the file may be damaged or not UTF-16 after all; ${RESAVE}`),
    example: { file: 'texts/tale.txt', encoding: 'utf-16le', byMark: true, odd: true, line: 120, column: 7, offset: 40211 },
  }),
  'file/utf16-no-bom': entry<{ file: string; encoding: 'utf-16le' | 'utf-16be' }>({
    title: 'A UTF-16 file without a byte order mark',
    severity: 'warning',
    message: (a) => `${a.file} has no byte order mark, but the pattern of its zero bytes shows it is ${UTF16[a.encoding]}, so it was read as such`,
    hint: () => `check the chapters and words that "vitrine check" lists; to be sure it is read as intended, ${RESAVE}`,
    example: { file: 'texts/tale.txt', encoding: 'utf-16le' },
  }),

  // ——— texts ———
  'text/unreadable': entry<{ reason: string }>({
    title: 'A text file cannot be read',
    severity: 'error',
    message: (a) => `the text file cannot be read (${a.reason})`,
    hint: () => 'check the path in the plan and the file permissions',
    example: { reason: 'EACCES' },
  }),
  'text/empty': entry<{ id: string; markers: boolean }>({
    title: 'A text with no words',
    severity: 'error',
    message: (a) => `the text "${a.id}" has no words${a.markers ? ' between its start and end markers' : ''}, so there is nothing to measure`,
    hint: (a) =>
      a.markers
        ? 'check that the "start:" and "end:" markers in the plan match lines of the text, and that the text lies between them'
        : 'check that this is the right file and that it holds the text itself (not an empty file, or one with only headings or punctuation)',
    example: { id: 'lamps', markers: true },
  }),
  'text/no-headings': entry<{ id: string }>({
    title: 'A text in which no chapter headings were found',
    severity: 'warning',
    message: (a) => `no chapter headings were found in the text "${a.id}", so the whole text is read as one chapter, "Whole text"`,
    hint: () =>
      'if it has chapters, put each heading on a line of its own with a blank line before and after (e.g. "CHAPTER IV." or "Chapter 4: The Night of the High Water"), or give the text a "chapters:" pattern in the plan that its heading lines match; if it has none, nothing needs doing',
    example: { id: 'lamps' },
  }),
  'text/marker-not-found': entry<{ id: string; marker: string; end: 'start' | 'end'; after?: number }>({
    title: 'A trim marker that is not in the text',
    severity: 'warning',
    message: (a) =>
      a.end === 'start'
        ? `The start marker "${a.marker}" does not occur in the text "${a.id}", so nothing was trimmed from the front. Check the marker against the text (it must match part of a line exactly, case included).`
        : `The end marker "${a.marker}" does not occur in the text "${a.id}"${a.after !== undefined ? ` after the start marker (line ${a.after})` : ''}, so nothing was trimmed from the back. Check the marker against the text (it must match part of a line exactly, case included).`,
    hint: () => undefined,
    example: { id: 'lamps', marker: 'BEGIN TEXT', end: 'start' },
  }),
  'text/bad-chapter-pattern': entry<{ id: string; pattern: string }>({
    title: 'A chapter pattern that is not a regular expression',
    severity: 'warning',
    message: (a) =>
      `The chapter pattern "${a.pattern}" of the text "${a.id}" is not a valid regular expression, so chapters were found automatically instead. Fix the pattern (JavaScript regular-expression syntax) or remove it.`,
    hint: () => undefined,
    example: { id: 'lamps', pattern: '^CHAPTER (' },
  }),
  'text/chapter-pattern-unmatched': entry<{ id: string; pattern: string; parts: boolean }>({
    title: 'A chapter pattern that matches no line',
    severity: 'warning',
    message: (a) =>
      `No line of the text "${a.id}" matches the chapter pattern "${a.pattern}", so ${a.parts ? 'the part headings were taken as chapters' : 'the whole text is one chapter'}. Check the pattern against a heading line of the text (it is searched for in each line, ignoring case; anchor it with ^ and $ to match whole lines).`,
    hint: () => undefined,
    example: { id: 'lamps', pattern: '^Chapter \\d+$', parts: false },
  }),

  // ——— word lists ———
  'lexicon/unreadable': entry<{ reason: string }>({
    title: 'A word list cannot be read',
    severity: 'error',
    message: (a) => `the word list cannot be read (${a.reason})`,
    hint: () => 'check the path in the plan',
    example: { reason: 'ENOENT' },
  }),
  'lexicon/malformed': entry<{ detail: string; hint?: string }>({
    title: 'A line of a word list that cannot be read',
    severity: 'error',
    message: (a) => a.detail,
    hint: given,
    example: { detail: 'the row has 3 cells but 2 are expected (word, category)', hint: 'give every row the same tab-separated cells: word, category' },
  }),

  // ——— dialogue ———
  'dialogue/pin-no-match': entry<{ detail: string }>({
    title: 'A dialogue pin that matches no quotation',
    severity: 'error',
    message: (a) => a.detail,
    hint: () => undefined,
    example: {
      detail:
        'the pin for chapter 2 starting “Hold the lamp” matches no quotation (chapter 2 has 14 quotations, none starting with these words), so it was not applied. Copy the first words of the quotation exactly as the text has them, and check the chapter number.',
    },
  }),
  'dialogue/pin-several': entry<{ detail: string }>({
    title: 'A dialogue pin that matches several quotations',
    severity: 'warning',
    message: (a) => a.detail,
    hint: () => undefined,
    example: { detail: 'the pin for chapter 2 starting “Yes” matches 3 quotations; it was applied to the first (“Yes, and the tide with it.”). Add more of the quotation\'s words to make it unique.' },
  }),
  'dialogue/pin-unknown-speaker': entry<{ detail: string }>({
    title: 'A dialogue pin names a speaker the cast lacks',
    severity: 'error',
    message: (a) => a.detail,
    hint: () => undefined,
    example: {
      detail:
        'the pin for chapter 2 starting “Hold the lamp” names the speaker "abell", who is not in the cast; the quotation was left without a speaker. Use a cast id, or null for someone outside the cast.',
    },
  }),
  'dialogue/pin-unknown-addressee': entry<{ detail: string }>({
    title: 'A dialogue pin names an addressee the cast lacks',
    severity: 'error',
    message: (a) => a.detail,
    hint: () => undefined,
    example: {
      detail: 'the pin for chapter 2 starting “Hold the lamp” names the addressee "tamsn", who is not in the cast; the addressee was left empty. Use a cast id, or null.',
    },
  }),
  'dialogue/marks-without-speech': entry<{ chapter: number; paragraph: number; detail: string }>({
    title: 'Quotation marks, but no speech found',
    severity: 'warning',
    message: (a) => `chapter ${a.chapter}, paragraph ${a.paragraph}: ${a.detail}`,
    hint: () => undefined,
    example: {
      chapter: 4,
      paragraph: 1,
      detail:
        'this chapter has 38 quotation marks or dashes, but no speech was found in it when read as double marks “…”. If its speech is set another way, name the marks for chapter 4 in the plan (dialogue.marks).',
    },
  }),
  'dialogue/marks-chapter': entry<{ chapter: string; text: string; count: number }>({
    title: 'dialogue.marks names a chapter the text lacks',
    severity: 'error',
    message: (a) => `chapter ${a.chapter} is named in dialogue.marks, but ${a.text} has ${a.count} chapter${a.count === 1 ? '' : 's'}; the setting was not applied`,
    hint: () => 'number chapters from 1 as `vitrine check` lists them',
    example: { chapter: '9', text: 'texts/the-lamps-of-wendle-staithe.txt', count: 6 },
  }),
  'dialogue/unbalanced': entry<{ chapter: number; paragraph: number; detail: string }>({
    title: 'Quotation marks that do not pair up',
    severity: 'warning',
    message: (a) => `chapter ${a.chapter}, paragraph ${a.paragraph}: ${a.detail}`,
    hint: () => undefined,
    example: {
      chapter: 3,
      paragraph: 12,
      detail: 'a quotation (“Bring the lamp down to the…”) has no closing mark and the next paragraph does not go on with it. Add the missing closing mark.',
    },
  }),

  // ——— panels, measured and drawn ———
  'panel/measure-failed': entry<{ measure: string; reason: string }>({
    title: 'A measure that cannot run with these parameters',
    severity: 'error',
    message: (a) => `the measure "${a.measure}" cannot run with these parameters: ${a.reason}`,
    hint: () => 'change the parameters of this panel',
    example: { measure: 'presence', reason: 'characters names ids that are not in the cast: tamsn' },
  }),
  'note/unresolved': entry<{ detail: string; hint: string }>({
    title: 'A note that points at nothing on the chart',
    severity: 'error',
    message: (a) => a.detail,
    hint: given,
    example: { detail: 'the note points at chapter 9, but the text has 6 chapters', hint: 'use a chapter from 1 to 6' },
  }),
  'note/not-drawn': entry<Record<string, never>>({
    title: 'A note shown beside the chart',
    severity: 'warning',
    message: () => 'the note could not be placed on the chart, so it is shown only beside it',
    hint: () => 'point it at something the chart draws',
    example: {},
  }),

  // ——— the result cache ———
  'cache/unusable-folder': entry<{ blocked: boolean; reason: string }>({
    title: 'A cache folder that cannot be used',
    severity: 'warning',
    message: (a) =>
      `the cache folder cannot be used: ${a.blocked ? 'it, or a folder above it, is a file' : `it cannot be made (${a.reason})`}; every measure was computed afresh and nothing was kept`,
    hint: () => 'rename or remove the file in the way (the cache is a folder, normally .vitrine/cache), or run with --no-cache',
    example: { blocked: true, reason: 'EEXIST' },
  }),
  'cache/bad-entry': entry<{ count: number; reason: string }>({
    title: 'Cached results that could not be used',
    severity: 'warning',
    message: (a) =>
      `${a.count === 1 ? 'a cached result' : `${a.count} cached results`} could not be used (${a.reason}${a.count > 1 ? ', and others' : ''}), so ${a.count === 1 ? 'it was' : 'they were'} computed again and saved afresh`,
    hint: () => 'nothing needs doing; if this comes back on every run, delete the cache folder (it holds nothing that cannot be computed again)',
    example: { count: 1, reason: 'it is not complete JSON' },
  }),
  'cache/not-written': entry<{ reason: string }>({
    title: 'Results that could not be saved in the cache',
    severity: 'warning',
    message: (a) => `measure results could not be saved in the cache (${a.reason}); this run is not affected, but the next one will compute them again`,
    hint: () => 'check that the cache folder can be written and the disk is not full, or run with --no-cache',
    example: { reason: 'ENOSPC' },
  }),

  // ——— the build ———
  'build/out-refused': entry<{ detail: string; hint: string }>({
    title: 'An output folder a build may not replace',
    severity: 'error',
    message: (a) => a.detail,
    hint: given,
    example: {
      detail: 'the output folder holds files that no Vitrine build wrote (notes.txt, photos)',
      hint: 'a build replaces only an empty folder or one it built itself (marked by its .vitrine-build file): choose another folder with --out, or move those files away. A site built by a Vitrine older than this marker has to be deleted by hand, once',
    },
  }),

  // ——— the command line ———
  'cli/needs-cast': entry<{ measure: string }>({
    title: 'A measure run without its cast',
    severity: 'error',
    message: (a) => `the measure "${a.measure}" needs a cast`,
    hint: () => 'pass --cast CAST.yaml (a YAML list of { id, name, aliases, pronoun })',
    example: { measure: 'presence' },
  }),
  'cast/unreadable': entry<{ reason: string }>({
    title: 'A cast file cannot be read',
    severity: 'error',
    message: (a) => `the cast file cannot be read (${a.reason})`,
    hint: () => 'check the path given to --cast',
    example: { reason: 'ENOENT' },
  }),
  'cast/not-a-list': entry<Record<string, never>>({
    title: 'A cast file that is not a list',
    severity: 'error',
    message: () => 'the cast file does not hold a list',
    hint: () => 'a cast file is a YAML list of entries, each "- { id: …, name: …, aliases: [ … ], pronoun: … }"',
    example: {},
  }),
} as const;

export type ProblemCode = keyof typeof catalogue;

/** The arguments a code's message and hint are worded from. */
export type ProblemArgs<C extends ProblemCode> = (typeof catalogue)[C]['example'];
