/** The character network as a graphology graph: undirected, simple, weighted. */

import { UndirectedGraph } from 'graphology';
import type { NetworkEdge, NetworkMember } from './types.ts';

export type CharacterGraph = UndirectedGraph<NetworkMember, { weight: number }>;

/**
 * A graph with the members as nodes (in the order given) and the edges as
 * weighted links (in the order given). Throws on an edge whose ends are not
 * members, on a self-loop and on a repeated pair.
 */
export function buildGraph(members: readonly NetworkMember[], edges: readonly NetworkEdge[]): CharacterGraph {
  const graph: CharacterGraph = new UndirectedGraph({ allowSelfLoops: false, multi: false });
  for (const m of members) graph.addNode(m.id, { ...m });
  for (const e of edges) {
    if (!graph.hasNode(e.source) || !graph.hasNode(e.target)) {
      throw new RangeError(`a link names "${e.source}" and "${e.target}", but only the network's characters can be linked`);
    }
    graph.addEdge(e.source, e.target, { weight: e.weight });
  }
  return graph;
}
