/**
 * The plan's YAML source: parsing with positions kept, and finding the line
 * and column of any path inside it. Lines and columns are 1-based, as editors
 * show them.
 */
import { isAlias, isMap, isScalar, isSeq, LineCounter, parseDocument, visit } from 'yaml';
import type { Document, Node as YamlNode } from 'yaml';
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
  for (const error of doc.errors) {
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
      problems.push(problem('plan/yaml-syntax', worded, { line: p.line, column: p.column }));
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

  return { data, problems, at, keyAt };
}
