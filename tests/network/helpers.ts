import { buildTextModel } from '../../pipeline/text/build.ts';
import { findMentions } from '../../pipeline/text/mentions.ts';
import type { CastMember } from '../../pipeline/text/model.ts';
import type { MeasureContext } from '../../pipeline/measures/types.ts';
import type { NetworkEdge } from '../../pipeline/network/types.ts';

/** A measure context for an invented text and cast. */
export function context(text: string, cast: CastMember[]): MeasureContext {
  const model = buildTextModel(text, { id: 'network-fixture' });
  return { model, cast, mentions: findMentions(model, cast), language: 'en' };
}

/** A cast member with no aliases. */
export function member(id: string, name: string): CastMember {
  return { id, name, aliases: [] };
}

/** Edges as "a–b:w" strings, order-free, for readable comparisons. */
export function edgeSet(edges: readonly NetworkEdge[]): string[] {
  return edges.map((e) => `${[e.source, e.target].sort().join('–')}:${e.weight}`).sort();
}

/**
 * Modularity of a partition by Newman's formula, written out by hand:
 * Q = Σ_c [ L_c / m − (d_c / 2m)² ], L_c = link weight inside c, d_c = sum of
 * the weighted degrees of c's nodes, m = total link weight.
 * Source: Newman, M. E. J. (2006), "Modularity and community structure in networks", PNAS 103(23):8577–8582:
 * Q = (1/2m) Σ_ij [A_ij − k_i k_j / 2m] δ(c_i, c_j); summing the pairs community by community gives the form above.
 */
export function newmanModularity(edges: readonly NetworkEdge[], community: (id: string) => number): number {
  const m = edges.reduce((s, e) => s + e.weight, 0);
  const inside = new Map<number, number>();
  const degree = new Map<number, number>();
  for (const e of edges) {
    const a = community(e.source);
    const b = community(e.target);
    if (a === b) inside.set(a, (inside.get(a) ?? 0) + e.weight);
    degree.set(a, (degree.get(a) ?? 0) + e.weight);
    degree.set(b, (degree.get(b) ?? 0) + e.weight);
  }
  let q = 0;
  for (const [c, d] of degree) q += (inside.get(c) ?? 0) / m - (d / (2 * m)) ** 2;
  return q;
}

/** Every pair of the given ids linked with weight 1 (a clique). */
export function clique(ids: string[]): NetworkEdge[] {
  const out: NetworkEdge[] = [];
  for (let i = 0; i < ids.length; i++) for (let j = i + 1; j < ids.length; j++) out.push({ source: ids[i]!, target: ids[j]!, weight: 1 });
  return out;
}
