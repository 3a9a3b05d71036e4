/**
 * Reading a curator's word → category list (e.g. words associated with
 * emotions) from a TSV or CSV file. Three layouts are accepted:
 *
 * 1. pairs: `word<TAB>category`, one pair per row (a word may appear on
 *    several rows);
 * 2. flagged pairs: `word<TAB>category<TAB>0|1`, a row per word and category,
 *    1 meaning the word belongs to the category (the common word–emotion
 *    association layout);
 * 3. a matrix: a header row `word,<category 1>,<category 2>,…` and one row per
 *    word with a 0 or 1 under each category.
 *
 * Commas separate cells when the first row has no tab; CSV cells may be quoted
 * ("…", with "" for a quote). Blank lines and lines starting with # are
 * skipped. A header row for layouts 1 and 2 (`word,category` or
 * `word,category,<anything>`) is skipped. Words are lower-cased and typographic
 * apostrophes made ASCII, as in the text model's vocabulary.
 */

import type { WordCategories } from '../measures/types.ts';

export interface LexiconProblem {
  /** 1-based line in the file. */
  line: number;
  /** 1-based column (character) where the offending cell starts; 1 for a whole-line or whole-file problem. */
  column: number;
  /** What is wrong, in one sentence (the position is in `line` and `column`). */
  message: string;
  /** What to do about it. */
  hint?: string;
}

export interface ParsedLexicon {
  /** The word list, or null when any problem was found. */
  lexicon: WordCategories | null;
  problems: LexiconProblem[];
}

interface Cell {
  text: string;
  /** 1-based column of the cell's first character. */
  column: number;
}

interface Row {
  line: number;
  cells: Cell[];
  /** Set when the row could not be split (an unclosed quote). */
  error?: { column: number; message: string };
}

/** Split one line into cells at `sep`, with CSV quoting when `sep` is a comma. */
function splitLine(line: string, sep: string): { cells: Cell[]; error?: { column: number; message: string } } {
  const cells: Cell[] = [];
  let i = 0;
  while (true) {
    const column = i + 1;
    if (sep === ',' && line[i] === '"') {
      let text = '';
      let j = i + 1;
      let closed = false;
      while (j < line.length) {
        if (line[j] === '"') {
          if (line[j + 1] === '"') {
            text += '"';
            j += 2;
            continue;
          }
          closed = true;
          j++;
          break;
        }
        text += line[j];
        j++;
      }
      if (!closed) return { cells, error: { column, message: 'a quoted cell is not closed' } };
      const rest = line.indexOf(sep, j);
      const tail = line.slice(j, rest < 0 ? line.length : rest).trim();
      if (tail) return { cells, error: { column: j + 1, message: `text "${tail}" follows a quoted cell` } };
      cells.push({ text: text.trim(), column });
      if (rest < 0) break;
      i = rest + 1;
      continue;
    }
    const next = line.indexOf(sep, i);
    const raw = line.slice(i, next < 0 ? line.length : next);
    const lead = raw.length - raw.trimStart().length;
    cells.push({ text: raw.trim(), column: column + lead });
    if (next < 0) break;
    i = next + 1;
  }
  return { cells };
}

function normaliseWord(w: string): string {
  return w.normalize('NFC').toLowerCase().replace(/[\u2018\u2019]/g, "'").replace(/[\u2010\u2011]/g, '-');
}

const WORD_HEADER = /^(word|term|lemma)$/i;
const CATEGORY_HEADER = /^(category|categories|emotion|class|label)$/i;

/**
 * Parse a word → category list. `file` names the file in messages; `id` is
 * the list's id in the plan. Every problem is reported (not only the first),
 * each naming the line and column and what to do; `lexicon` is null when
 * there is any.
 */
export function parseCategoryLexicon(text: string, file: string, id: string): ParsedLexicon {
  const problems: LexiconProblem[] = [];
  const fail = (line: number, column: number, message: string, hint?: string): void => {
    problems.push({ line, column, message, ...(hint ? { hint } : {}) });
  };
  const source = text.replace(/^\uFEFF/, '');
  const lines = source.split(/\r\n|\r|\n/);
  const first = lines.find((l) => l.trim() && !l.trimStart().startsWith('#'));
  if (first === undefined) {
    problems.push({
      line: 1,
      column: 1,
      message: `the word list "${id}" (${file}) holds no rows`,
      hint: 'put one word and its category on each line, separated by a tab (word<TAB>category) or a comma, or give a header row "word,<category>,…" with 0/1 columns',
    });
    return { lexicon: null, problems };
  }
  const sep = first.includes('\t') ? '\t' : ',';
  const sepName = sep === '\t' ? 'tab' : 'comma';
  const rows: Row[] = [];
  lines.forEach((l, k) => {
    if (!l.trim() || l.trimStart().startsWith('#')) return;
    rows.push({ line: k + 1, ...splitLine(l, sep) });
  });

  // Decide the layout from the first row.
  const head = rows[0]!;
  let layout: 'pairs' | 'flagged' | 'matrix';
  let categoriesFromHeader: Cell[] = [];
  let body = rows;
  const width = head.cells.length;
  const headerLike = !head.error && WORD_HEADER.test(head.cells[0]?.text ?? '');
  if (headerLike && width >= 2 && CATEGORY_HEADER.test(head.cells[1]!.text) && width <= 3) {
    layout = width === 2 ? 'pairs' : 'flagged';
    body = rows.slice(1);
  } else if (headerLike) {
    layout = 'matrix';
    categoriesFromHeader = head.cells.slice(1);
    body = rows.slice(1);
    if (categoriesFromHeader.length === 0) {
      fail(head.line, 1, `the header row names no categories, only "${head.cells[0]!.text}"`, `add one column per category after "${head.cells[0]!.text}", e.g. "word${sep === '\t' ? '\\t' : ','}calm${sep === '\t' ? '\\t' : ','}dread", with a 0 or 1 under each`);
    }
    categoriesFromHeader.forEach((c, k) => {
      if (!c.text) fail(head.line, c.column, `the header's column ${k + 2} has no category name`, 'name every category column in the header row, or remove the empty column');
    });
    const seen = new Map<string, number>();
    categoriesFromHeader.forEach((c) => {
      if (!c.text) return;
      if (seen.has(c.text)) fail(head.line, c.column, `the category "${c.text}" is named twice in the header row`, 'give each category column a different name');
      seen.set(c.text, c.column);
    });
  } else if (width === 2) {
    layout = 'pairs';
  } else if (width === 3) {
    layout = 'flagged';
  } else {
    fail(
      head.line,
      1,
      `the first row has ${width} cell${width === 1 ? '' : 's'} (${sepName}-separated), so the layout of the list cannot be told`,
      width === 1
        ? `separate the word and its category with a ${sepName}: "word${sep === '\t' ? '<TAB>' : ','}category"`
        : 'use rows "word, category" or "word, category, 0/1", or start the file with a header row "word,<category 1>,<category 2>,…" for a 0/1 matrix',
    );
    return { lexicon: null, problems };
  }

  const expected = layout === 'pairs' ? 2 : layout === 'flagged' ? 3 : 1 + categoriesFromHeader.length;
  const shape =
    layout === 'pairs'
      ? 'word, category'
      : layout === 'flagged'
        ? 'word, category, 0 or 1'
        : `word, then a 0 or 1 for each of the ${categoriesFromHeader.length} categories of the header`;
  const categories: string[] = [];
  const categoryIndex = new Map<string, number>();
  const addCategory = (c: string): number => {
    let k = categoryIndex.get(c);
    if (k === undefined) {
      k = categories.length;
      categories.push(c);
      categoryIndex.set(c, k);
    }
    return k;
  };
  if (layout === 'matrix') for (const c of categoriesFromHeader) if (c.text) addCategory(c.text);
  const entries = new Map<string, Set<number>>();
  const add = (word: string, k: number): void => {
    let set = entries.get(word);
    if (!set) entries.set(word, (set = new Set()));
    set.add(k);
  };

  for (const row of body) {
    if (row.error) {
      fail(row.line, row.error.column, `${row.error.message}`, 'close the quote ("…"), write a quote inside a quoted cell as "", or remove the stray text');
      continue;
    }
    const cells = row.cells;
    if (cells.length !== expected) {
      const extra = cells[expected];
      fail(
        row.line,
        extra ? extra.column : (cells[cells.length - 1]?.column ?? 1),
        `the row has ${cells.length} cell${cells.length === 1 ? '' : 's'} but ${expected} are expected (${shape})`,
        `give every row the same ${sepName}-separated cells: ${shape}`,
      );
      continue;
    }
    const wordCell = cells[0]!;
    const word = normaliseWord(wordCell.text);
    if (!word) {
      fail(row.line, wordCell.column, 'the word cell is empty', 'put the word first on the row, or delete the row');
      continue;
    }
    if (/\s/.test(word)) {
      fail(row.line, wordCell.column, `"${wordCell.text}" is more than one word; phrases are not matched`, 'list single words only (hyphenated words such as "well-being" count as one word)');
      continue;
    }
    if (layout === 'matrix') {
      cells.slice(1).forEach((cell, k) => {
        const name = categoriesFromHeader[k]!.text;
        if (cell.text === '1') {
          if (name) add(word, categoryIndex.get(name)!);
        } else if (cell.text !== '0') {
          fail(row.line, cell.column, `the cell under "${name}" is "${cell.text}", not 0 or 1`, 'write 1 when the word belongs to the category and 0 when it does not');
        }
      });
      if (!entries.has(word)) entries.set(word, new Set());
      continue;
    }
    const catCell = cells[1]!;
    if (!catCell.text) {
      fail(row.line, catCell.column, `no category is given for "${wordCell.text}"`, 'put the category name after the word, or delete the row');
      continue;
    }
    if (layout === 'flagged') {
      const flag = cells[2]!;
      if (flag.text !== '0' && flag.text !== '1') {
        fail(row.line, flag.column, `the third cell is "${flag.text}", not 0 or 1`, 'write 1 when the word belongs to the category and 0 when it does not (or use two-cell rows "word, category")');
        continue;
      }
      const k = addCategory(catCell.text);
      if (flag.text === '1') add(word, k);
      else if (!entries.has(word)) entries.set(word, new Set());
      continue;
    }
    add(word, addCategory(catCell.text));
  }

  if (problems.length === 0) {
    if (categories.length === 0) {
      fail(rows[0]!.line, 1, `no category is named, so the word list "${id}" cannot be used`, 'give each word a category (word, category), or add category columns to the header row');
    } else if (![...entries.values()].some((s) => s.size > 0)) {
      fail(rows[0]!.line, 1, `no word is marked as belonging to any category (every flag is 0)`, 'mark with 1 the categories each word belongs to');
    }
  }
  if (problems.length) return { lexicon: null, problems };
  const out: Record<string, string[]> = Object.create(null) as Record<string, string[]>;
  for (const [word, set] of entries) if (set.size) out[word] = [...set].sort((a, b) => a - b).map((k) => categories[k]!);
  return { lexicon: { id, categories, entries: out }, problems };
}
