/**
 * The plan's YAML source: parsing with positions kept, and finding the line
 * and column of any path inside it. Lines and columns are 1-based, as editors
 * show them.
 */
import { isAlias, isMap, isScalar, isSeq, LineCounter, parseDocument, visit } from 'yaml';
import type { Document, Node as YamlNode, YAMLError } from 'yaml';
import type { Problem } from '../problems/problem.ts';
import { problem } from '../problems/problem.ts';
import { wordYamlError } from './yaml-messages.ts';

/** A step into the plan: a mapping key or a 0-based list index. */
export type PathSegment = string | number;

export interface Position {
  line: number;
  column: number;
}

export interface PlanSource {
  /** The parsed plan as plain data, or undefined when the YAML could not be read into data. */
  data: unknown;
  /** Syntax problems (and unreadable aliases); empty when the YAML is well-formed. */
  problems: Problem[];
  /** Where a path's value starts; for a missing key, where the nearest enclosing value starts. */
  at(path: readonly PathSegment[]): Position;
  /** Where the key `key` of the mapping at `path` is written (falls back to `at(path)`). */
  keyAt(path: readonly PathSegment[], key: string): Position;
  /** Where `needle` is first written inside the value at `path` (falls back to `at(path)`, e.g. when it is written as an escape). */
  find(path: readonly PathSegment[], needle: string): Position;
}

const SIMPLE_KEY = /^[A-Za-z_][A-Za-z0-9_-]*$/;

/** `rooms[1].panels[2].measure`: indices 0-based; keys that are not plain words are quoted. */
export function formatPath(path: readonly PathSegment[]): string {
  let out = '';
  for (const seg of path) {
    if (typeof seg === 'number') out += `[${seg}]`;
    else if (SIMPLE_KEY.test(seg)) out += out === '' ? seg : `.${seg}`;
    else out += `[${JSON.stringify(seg)}]`;
  }
  return out;
}

function keyText(key: unknown): string | undefined {
  if (isScalar(key)) return String(key.value);
  return undefined;
}

interface Found {
  node: YamlNode | null;
  key: YamlNode | null;
}

/** One step down the YAML tree, following aliases. The last of duplicated keys wins, as in the data. */
function step(doc: Document, from: YamlNode | null, seg: PathSegment): Found | undefined {
  let node: unknown = from;
  if (isAlias(node)) node = node.resolve(doc);
  if (isMap(node)) {
    let hit: Found | undefined;
    for (const pair of node.items) {
      if (keyText(pair.key) === String(seg)) {
        hit = { node: (pair.value ?? null) as YamlNode | null, key: (pair.key ?? null) as YamlNode | null };
      }
    }
    return hit;
  }
  if (isSeq(node) && typeof seg === 'number') {
    const item = node.items[seg];
    return item === undefined ? undefined : { node: item as YamlNode, key: null };
  }
  return undefined;
}

function isEmptyValue(node: YamlNode | null): boolean {
  if (node === null || !node.range) return true;
  return node.range[0] === node.range[1];
}

/** Where a found value is shown: at the value, or at its key when the value is left empty. */
function startOf(found: Found): number | undefined {
  if (!isEmptyValue(found.node)) return found.node!.range![0];
  if (found.key?.range) return found.key.range[0];
  return found.node?.range?.[0];
}

/** The path of the mapping key written at `offset`, searching the whole tree. */
function keyAtOffset(doc: Document, offset: number): { path: PathSegment[] } | undefined {
  const search = (node: unknown, path: PathSegment[]): { path: PathSegment[] } | undefined => {
    if (isMap(node)) {
      for (const pair of node.items) {
        const key = keyText(pair.key);
        if (key === undefined) continue;
        const keyNode = pair.key as YamlNode;
        if (keyNode.range?.[0] === offset) return { path: [...path, key] };
        const found = search(pair.value, [...path, key]);
        if (found) return found;
      }
    } else if (isSeq(node)) {
      for (let i = 0; i < node.items.length; i++) {
        const found = search(node.items[i], [...path, i]);
        if (found) return found;
      }
    }
    return undefined;
  };
  return search(doc.contents, []);
}

/** A [ list ] or { mapping } left open. */
function isUnclosedFlow(error: YAMLError): boolean {
  return (error.code === 'MISSING_CHAR' && /Flow (map|sequence)/i.test(error.message)) || (error.code === 'BAD_INDENT' && /flow/i.test(error.message));
}

/** Errors after which the parser reads the rest of the file wrongly, whatever follows. */
function swallowsTheRest(error: YAMLError): boolean {
  return isUnclosedFlow(error) || (error.code === 'MISSING_CHAR' && /quote/i.test(error.message));
}

/**
 * The offset of the last [ or { before `offset` that is still open there, or
 * undefined. Reads the YAML roughly, as far as brackets go: quoted scalars
 * (a quotation mark that starts a value) and comments are skipped, and the
 * scan starts at the top-level section holding `offset`.
 */
export function unclosedBracket(text: string, offset: number): number | undefined {
  let from = 0;
  for (const m of text.slice(0, offset).matchAll(/^[^\s#]/gm)) from = m.index;
  const open: number[] = [];
  let i = from;
  while (i < offset) {
    const c = text[i]!;
    if (c === '#' && (i === 0 || /\s/.test(text[i - 1]!))) {
      const end = text.indexOf('\n', i);
      i = end < 0 ? offset : end;
      continue;
    }
    if (c === '"' || c === "'") {
      // Only a mark that begins a value starts a quoted scalar ("Ferryman's" is plain text).
      const before = text.slice(text.lastIndexOf('\n', i - 1) + 1, i).trimEnd();
      if (before === '' || /[:\-[{,]$/.test(before)) {
        let j = i + 1;
        while (j < offset) {
          if (c === '"' && text[j] === '\\') j += 2;
          else if (text[j] === c && c === "'" && text[j + 1] === "'") j += 2;
          else if (text[j] === c) break;
          else j++;
        }
        i = j + 1;
        continue;
      }
    }
    if (c === '[' || c === '{') open.push(i);
    else if ((c === ']' || c === '}') && open.length > 0) open.pop();
    i++;
  }
  return open.at(-1);
}

/**
 * One fault, one message: the parser reports many errors after the first one
 * (a tab used for indentation gives a dozen, as every line below it seems out
 * of place), and all but the first are echoes. The file is read in regions,
 * each a top-level section (from a line starting in column 1 to the next);
 * only the first syntax error of a region is kept. An unclosed bracket or
 * quotation mark makes the rest of the file one region. Duplicate keys open
 * no region (the parser reads on correctly after them), so all of them are
 * kept, except inside the region of a syntax error, where they are echoes too.
 */
export function firstOfEachRegion(errors: readonly YAMLError[], text: string): YAMLError[] {
  const topLevel: number[] = [];
  for (const m of text.matchAll(/^[^\s#]/gm)) topLevel.push(m.index);
  const regionEnd = (offset: number): number => topLevel.find((start) => start > offset) ?? Infinity;
  const out: YAMLError[] = [];
  let end = -1;
  let opened = -1; // index in `out` of the error that opened the current region
  for (const error of [...errors].sort((a, b) => a.pos[0] - b.pos[0])) {
    if (error.pos[0] < end) {
      // A tab in the indentation is the cause of whatever the parser said just before it on that account.
      if (error.code === 'TAB_AS_INDENT' && out[opened]!.code !== 'TAB_AS_INDENT') out[opened] = error;
      continue;
    }
    if (error.code === 'DUPLICATE_KEY') {
      out.push(error);
      continue;
    }
    opened = out.push(error) - 1;
    // The region runs from the start of the error's line to the next top-level line.
    end = swallowsTheRest(error) ? Infinity : regionEnd(error.pos[0]);
  }
  return out;
}

export function readPlanSource(text: string): PlanSource {
  const lineCounter = new LineCounter();
  const doc = parseDocument(text, { lineCounter, uniqueKeys: true, prettyErrors: false });

  const pos = (offset: number | undefined): Position => {
    if (offset === undefined) return { line: 1, column: 1 };
    const lp = lineCounter.linePos(offset);
    return { line: lp.line, column: lp.col };
  };

  const walk = (path: readonly PathSegment[]): { found: Found; complete: boolean } => {
    let found: Found = { node: doc.contents as YamlNode | null, key: null };
    for (const seg of path) {
      const next = step(doc, found.node, seg);
      if (next === undefined) return { found, complete: false };
      found = next;
    }
    return { found, complete: true };
  };

  const at = (path: readonly PathSegment[]): Position => {
    return pos(startOf(walk(path).found));
  };

  const keyAt = (path: readonly PathSegment[], key: string): Position => {
    const { found, complete } = walk([...path, key]);
    if (complete && found.key?.range) return pos(found.key.range[0]);
    return at(path);
  };

  const problems: Problem[] = [];
  for (const error of firstOfEachRegion(doc.errors, text)) {
    const p = pos(error.pos[0]);
    const worded = wordYamlError(error);
    if (worded === 'duplicate-key') {
      const key = keyAtOffset(doc, error.pos[0]);
      problems.push(
        key
          ? problem('plan/duplicate-key', { key: String(key.path[key.path.length - 1]) }, { line: p.line, column: p.column, path: formatPath(key.path) })
          : problem('plan/duplicate-key', {}, { line: p.line, column: p.column }),
      );
    } else {
      const opener = isUnclosedFlow(error) ? unclosedBracket(text, error.pos[0]) : undefined;
      if (opener === undefined) problems.push(problem('plan/yaml-syntax', worded, { line: p.line, column: p.column }));
      else {
        // The parser notices where the brackets should have closed; the fault is where they opened.
        const at = pos(opener);
        const brace = text[opener] === '{';
        problems.push(
          problem(
            'plan/yaml-syntax',
            {
              detail: `${brace ? 'the { mapping }' : 'the [ list ]'} that opens here is not closed`,
              hint: `add the closing ${brace ? '}' : ']'}; if the value goes on over several lines, indent them further than its key`,
            },
            { line: at.line, column: at.column },
          ),
        );
      }
    }
  }

  visit(doc, {
    Alias(_, alias) {
      if (alias.resolve(doc) === undefined) {
        const p = pos(alias.range?.[0]);
        problems.push(
          problem(
            'plan/yaml-syntax',
            { detail: `the alias *${alias.source} refers to no anchor before it`, hint: `define "&${alias.source}" on an earlier value, or write the value out` },
            { line: p.line, column: p.column },
          ),
        );
      }
    },
  });

  // Duplicate keys leave a usable tree (the last one wins), so checking goes on; other syntax errors stop it.
  let data: unknown;
  if (problems.every((p) => p.code === 'plan/duplicate-key')) {
    try {
      data = doc.toJS({ maxAliasCount: 100 });
    } catch (e) {
      problems.push(
        problem(
          'plan/yaml-syntax',
          { whole: true, detail: `the YAML could not be read (${e instanceof Error ? e.message : String(e)})`, hint: 'simplify the anchors and aliases (&name, *name) in the plan' },
          { line: 1, column: 1 },
        ),
      );
    }
  }

  const find = (path: readonly PathSegment[], needle: string): Position => {
    const { found, complete } = walk(path);
    const range = complete ? found.node?.range : undefined;
    if (range) {
      const k = text.slice(range[0], range[1]).indexOf(needle);
      if (k >= 0) return pos(range[0] + k);
    }
    return at(path);
  };

  return { data, problems, at, keyAt, find };
}
