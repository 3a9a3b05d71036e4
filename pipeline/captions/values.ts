/**
 * Figures in a caption taken from the panel's own data, so that prose and
 * chart cannot drift apart: `<Value of="turns" for="tamsin"/>` is the "turns"
 * of the record "tamsin" in the panel's data, looked up when the exhibit is
 * prepared.
 *
 * A panel's data is read as sets of records:
 * - the data table: each row a record, its fields the columns (by key or
 *   label), known by its first cell and, when that is a number, by its first
 *   cell of text too (the word of a ranked list);
 * - every list of objects in the measure's result (`speakers`, `chapters`…):
 *   each item a record, its fields its numbers and strings, known by its id,
 *   name, word, label, title, number or phrase;
 * - every object of the result with figures of its own (`totals`), a single
 *   record with no name, reached by its path: `of="totals.words"`.
 *
 * `for` names the record (case and spacing aside); `in` names the set when a
 * field is in several (`in="table"`, `in="speakers"`). A set in which `for`
 * matches several records is passed over when another set has exactly one;
 * when the answer is still not one figure, the lookup says why and what to
 * write, with the nearest names. Pure: plain data in, plain data out.
 */
import type { Table } from '../charts/types.ts';
import { nearest } from '../plan/suggest.ts';

export type Scalar = string | number;

export interface DataRecord {
  /** What the record is known by, as written in the data. */
  ids: string[];
  values: Record<string, Scalar>;
}

export interface DataSet {
  /** "table", or the path of the list or object in the result ("speakers", "totals"; "" for the result itself). */
  name: string;
  /** Field names as a curator may write them, each with the key it stands for. */
  fields: Map<string, string>;
  records: DataRecord[];
  /** A single object: its one record has no name. */
  single: boolean;
}

/** Fields that hold positions in the text, not figures to quote. */
const POSITION = /^(?:token|tokens|positions|offset|start|end|firstToken|line|column|at)$/i;
const IDENTITY = ['id', 'name', 'word', 'label', 'title', 'number', 'phrase', 'term', 'category', 'tick', 'key', 'node'];

const fold = (s: string) => s.normalize('NFC').toLowerCase().replace(/[’‘]/g, "'").replace(/\s+/g, ' ').trim();

/** The panel's data as sets of records: the table first, then the result's lists and objects in the order they come. */
export function dataSets(table: Table, result: unknown): DataSet[] {
  const sets: DataSet[] = [];
  const fields = new Map<string, string>();
  table.columns.forEach((c) => {
    if (POSITION.test(c.key) || /offset/i.test(c.label)) return;
    fields.set(fold(c.key), c.key);
    fields.set(fold(c.label), c.key);
  });
  const records = table.rows.map((row): DataRecord => {
    const values: Record<string, Scalar> = {};
    table.columns.forEach((c, i) => {
      const v = row[i];
      if (v !== null && v !== undefined && fields.has(fold(c.key))) values[c.key] = v;
    });
    const ids = [String(row[0] ?? '')];
    if (typeof row[0] === 'number') {
      const text = row.find((v) => typeof v === 'string');
      if (typeof text === 'string') ids.push(text);
    }
    return { ids, values };
  });
  sets.push({ name: 'table', fields, records, single: false });
  walk(result, '', sets, 0);
  return sets;
}

function isObject(v: unknown): v is Record<string, unknown> {
  return v !== null && typeof v === 'object' && !Array.isArray(v);
}

function scalarFields(o: Record<string, unknown>): Record<string, Scalar> {
  const out: Record<string, Scalar> = {};
  for (const [k, v] of Object.entries(o)) {
    if (POSITION.test(k)) continue;
    if (typeof v === 'number' && Number.isFinite(v)) out[k] = v;
    else if (typeof v === 'string') out[k] = v;
  }
  return out;
}

function walk(v: unknown, path: string, sets: DataSet[], depth: number): void {
  if (depth > 4) return;
  const join = (k: string) => (path ? `${path}.${k}` : k);
  if (Array.isArray(v)) {
    const items = v.filter(isObject);
    if (items.length === 0 || items.length !== v.length) return;
    const records = items.map((o) => {
      const values = scalarFields(o);
      const ids = IDENTITY.filter((k) => typeof o[k] === 'string' || typeof o[k] === 'number').map((k) => String(o[k]));
      return { ids, values };
    });
    const fields = new Map<string, string>();
    for (const r of records) for (const k of Object.keys(r.values)) fields.set(fold(k), k);
    sets.push({ name: path, fields, records, single: false });
    return;
  }
  if (!isObject(v)) return;
  const values = scalarFields(v);
  const numbers = Object.values(values).some((x) => typeof x === 'number');
  if (numbers) {
    const fields = new Map<string, string>();
    for (const k of Object.keys(values)) fields.set(fold(k), k);
    sets.push({ name: path, fields, records: [{ ids: [], values }], single: true });
  }
  for (const [k, child] of Object.entries(v)) if (Array.isArray(child) || isObject(child)) walk(child, join(k), sets, depth + 1);
}

/** What a `<Value>` asks for. */
export interface ValueQuery {
  of: string;
  for?: string;
  in?: string;
}

export type ValueLookup =
  | { found: true; value: Scalar; set: string; field: string; record: string | null }
  | { found: false; why: 'set' | 'field' | 'record' | 'needs-record' | 'ambiguous'; name: string; suggestion?: string; choices: string[] };

/** Looks a value up in the panel's data sets; see the file comment for the rules. */
export function lookUpValue(sets: readonly DataSet[], q: ValueQuery): ValueLookup {
  let field = q.of;
  let inSet = q.in;
  // "totals.words": the field "words" of the object "totals".
  if (inSet === undefined && q.of.includes('.') && !sets.some((s) => s.fields.has(fold(q.of)))) {
    const dot = q.of.lastIndexOf('.');
    inSet = q.of.slice(0, dot);
    field = q.of.slice(dot + 1);
  }
  let pool = [...sets];
  if (inSet !== undefined) {
    pool = sets.filter((s) => fold(s.name) === fold(inSet!));
    if (pool.length === 0) {
      const names = sets.map((s) => s.name).filter(Boolean);
      return { found: false, why: 'set', name: inSet, suggestion: nearest(inSet, names), choices: names };
    }
  }
  const having = pool.filter((s) => s.fields.has(fold(field)));
  if (having.length === 0) {
    const all = [...new Set(pool.flatMap((s) => [...s.fields.values()]))];
    return { found: false, why: 'field', name: field, suggestion: nearest(field, all), choices: all };
  }
  type Hit = { set: DataSet; record: DataRecord; key: string };
  const clean: Hit[] = [];
  const crowded: Hit[] = [];
  for (const set of having) {
    const key = set.fields.get(fold(field))!;
    if (q.for === undefined) {
      if (set.single) clean.push({ set, record: set.records[0]!, key });
      continue;
    }
    const wanted = fold(q.for);
    const matches = set.records.filter((r) => r.values[key] !== undefined && r.ids.some((id) => fold(id) === wanted || fold(id.split(':')[0]!) === wanted));
    if (matches.length === 1) clean.push({ set, record: matches[0]!, key });
    else if (matches.length > 1) crowded.push(...matches.map((record) => ({ set, record, key })));
  }
  const hits = clean.length ? clean : crowded;
  if (hits.length === 0) {
    if (q.for === undefined) {
      return { found: false, why: 'needs-record', name: field, choices: having.flatMap((s) => s.records.map((r) => r.ids[0]).filter((x): x is string => !!x)).slice(0, 12) };
    }
    const ids = [...new Set(having.flatMap((s) => s.records.filter((r) => r.values[s.fields.get(fold(field))!] !== undefined).flatMap((r) => r.ids)))];
    return { found: false, why: 'record', name: q.for, suggestion: nearest(q.for, ids), choices: ids.slice(0, 12) };
  }
  const values = new Set(hits.map((h) => String(h.record.values[h.key])));
  if (values.size > 1) {
    const choices = [...new Set(hits.map((h) => (clean.length ? `in="${h.set.name}"` : `${h.set.name}: ${h.record.ids.join(' / ')}`)))];
    return { found: false, why: 'ambiguous', name: q.for ?? field, choices };
  }
  const h = hits[0]!;
  return { found: true, value: h.record.values[h.key]!, set: h.set.name, field: h.key, record: h.record.ids[0] ?? null };
}

/** How a figure is shown: grouped thousands in the exhibit's language, `digits` decimals, or as a percentage of 1. */
export function formatValue(value: Scalar, opts: { digits?: number; percent?: boolean; locale?: string } = {}): string {
  if (typeof value === 'string') return value;
  const locale = opts.locale ?? 'en-GB';
  const n = opts.percent ? value * 100 : value;
  const digits = opts.digits ?? (Number.isInteger(n) ? 0 : undefined);
  const s = n.toLocaleString(locale, digits === undefined ? { maximumFractionDigits: 4 } : { minimumFractionDigits: digits, maximumFractionDigits: digits });
  // A minus sign, as printed, rather than a hyphen.
  return (opts.percent ? `${s}%` : s).replace(/^-/, '−');
}
