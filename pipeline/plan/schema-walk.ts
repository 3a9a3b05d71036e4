/**
 * Reading a zod schema the way a curator reads the plan: which keys a mapping
 * allows and what a field is for. Used to word problems (did-you-mean among
 * allowed keys, a field's description as a hint). Reads zod 4's `_zod.def`.
 */
import type { z } from 'zod';
import type { PathSegment } from './source.ts';

interface Def {
  type: string;
  innerType?: z.ZodType;
  in?: z.ZodType;
  shape?: Record<string, z.ZodType>;
  element?: z.ZodType;
  valueType?: z.ZodType;
  options?: z.ZodType[];
  left?: z.ZodType;
  right?: z.ZodType;
  items?: z.ZodType[];
  getter?: () => z.ZodType;
}

function defOf(schema: z.ZodType): Def {
  return (schema as unknown as { _zod: { def: Def } })._zod.def;
}

const WRAPPERS = new Set(['optional', 'nullable', 'default', 'prefault', 'catch', 'readonly', 'nonoptional']);

/** The schemas met while unwrapping optional/default/pipe/lazy layers, outermost first. */
function layers(schema: z.ZodType): z.ZodType[] {
  const out: z.ZodType[] = [schema];
  let current = schema;
  for (let guard = 0; guard < 32; guard++) {
    const def = defOf(current);
    let next: z.ZodType | undefined;
    if (WRAPPERS.has(def.type)) next = def.innerType;
    else if (def.type === 'pipe') next = def.in;
    else if (def.type === 'lazy') next = def.getter?.();
    if (next === undefined) break;
    out.push(next);
    current = next;
  }
  return out;
}

function core(schema: z.ZodType): z.ZodType {
  const all = layers(schema);
  return all[all.length - 1];
}

/** Object shapes a schema may take (several for a union or intersection). */
function shapes(schema: z.ZodType): Record<string, z.ZodType>[] {
  const def = defOf(core(schema));
  if (def.type === 'object' && def.shape) return [def.shape];
  if (def.type === 'union' && def.options) return def.options.flatMap(shapes);
  if (def.type === 'intersection' && def.left && def.right) return [...shapes(def.left), ...shapes(def.right)];
  return [];
}

/** The schema of one step down, or undefined when the schema says nothing about it. */
function child(schema: z.ZodType, seg: PathSegment): z.ZodType | undefined {
  const def = defOf(core(schema));
  if (typeof seg === 'number') {
    if (def.type === 'array') return def.element;
    if (def.type === 'tuple') return def.items?.[seg];
    return undefined;
  }
  if (def.type === 'record') return def.valueType;
  for (const shape of shapes(schema)) {
    if (Object.hasOwn(shape, seg)) return shape[seg];
  }
  return undefined;
}

/** The schema at a path inside `schema`, or undefined. */
export function schemaAt(schema: z.ZodType, path: readonly PathSegment[]): z.ZodType | undefined {
  let current: z.ZodType | undefined = schema;
  for (const seg of path) {
    if (current === undefined) return undefined;
    current = child(current, seg);
  }
  return current;
}

/** The kind of value a schema takes at heart ("string", "number", "enum", "array", …), past optional and default layers. */
export function coreKind(schema: z.ZodType | undefined): string | undefined {
  return schema === undefined ? undefined : defOf(core(schema)).type;
}

/** The keys a mapping schema allows, or undefined when it is not a fixed set (records, non-objects). */
export function allowedKeys(schema: z.ZodType | undefined): string[] | undefined {
  if (schema === undefined) return undefined;
  const all = shapes(schema);
  if (all.length === 0) return undefined;
  return [...new Set(all.flatMap((s) => Object.keys(s)))];
}

/**
 * Whether the schema's core is a plain object, which silently drops unknown
 * keys (so they must be checked by hand). Strict objects report them
 * themselves; loose objects (a catch-all) accept them on purpose.
 */
export function dropsUnknownKeys(schema: z.ZodType): boolean {
  const def = defOf(core(schema)) as Def & { catchall?: z.ZodType };
  return def.type === 'object' && def.catchall === undefined;
}

/** The first description met on the way down to the core schema. */
export function descriptionOf(schema: z.ZodType | undefined): string | undefined {
  if (schema === undefined) return undefined;
  for (const layer of layers(schema)) {
    if (layer.description) return layer.description;
  }
  return undefined;
}
