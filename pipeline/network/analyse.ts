/**
 * Centralities, communities and summary figures of a character network,
 * computed with graphology-metrics and graphology-communities-louvain.
 */

import betweennessCentrality from 'graphology-metrics/centrality/betweenness.js';
import eigenvectorCentrality from 'graphology-metrics/centrality/eigenvector.js';
import { weightedDegree } from 'graphology-metrics/node/weighted-degree.js';
import { density as graphDensity } from 'graphology-metrics/graph/density.js';
import modularity from 'graphology-metrics/graph/modularity.js';
import louvain from 'graphology-communities-louvain';
import type { NetworkEdge, NetworkMember, NetworkNode, NetworkSummary } from './types.ts';
import { buildGraph, type CharacterGraph } from './graph.ts';
import { connectedComponents } from './components.ts';
import { seededRandom } from './rng.ts';

export interface AnalyseOptions {
  /** Seed of the random order in which the Louvain method visits nodes. */
  seed: number;
  /** Louvain resolution γ: above 1 favours more, smaller communities. */
  resolution: number;
  /** How long a link is for betweenness: every link one step ("hops"), or 1 ÷ weight ("inverse-weight"). */
  distance: 'hops' | 'inverse-weight';
}

export interface AnalysedNetwork {
  /** Nodes in the order of the members given. */
  nodes: NetworkNode[];
  edges: NetworkEdge[];
  summary: NetworkSummary;
}

/** Power iterations allowed before eigenvector centrality gives up (the library default is 100). */
const EIGENVECTOR_ITERATIONS = 1000;

/** Every metric of the network of `members` linked by `edges`. Pure; the same input gives the same numbers. */
export function analyseNetwork(
  members: readonly NetworkMember[],
  edges: readonly NetworkEdge[],
  options: AnalyseOptions,
): AnalysedNetwork {
  const graph = buildGraph(members, edges);
  const n = graph.order;
  const betweenness =
    n > 0
      ? betweennessCentrality(graph, {
          normalized: true,
          getEdgeWeight: options.distance === 'hops' ? null : (_edge, attr) => 1 / attr.weight,
        })
      : {};
  const eigenvector = n > 0 ? eigenvectorOf(graph) : {};
  const { communities, modularity: q } = communitiesOf(graph, options);
  const nodes = members.map((m) => ({
    ...m,
    degree: graph.degree(m.id),
    weightedDegree: weightedDegree(graph, m.id, 'weight'),
    betweenness: betweenness[m.id] ?? 0,
    eigenvector: eigenvector[m.id] ?? 0,
    community: communities.get(m.id) ?? 0,
  }));
  return {
    nodes,
    edges: edges.map((e) => ({ ...e })),
    summary: {
      nodes: n,
      edges: graph.size,
      totalWeight: edges.reduce((s, e) => s + e.weight, 0),
      density: n < 2 ? 0 : graphDensity(graph),
      components: connectedComponents(graph).length,
      communities: new Set(communities.values()).size,
      modularity: q,
    },
  };
}

function eigenvectorOf(graph: CharacterGraph): Record<string, number> {
  try {
    return eigenvectorCentrality(graph, { getEdgeWeight: 'weight', maxIterations: EIGENVECTOR_ITERATIONS });
  } catch {
    throw new Error(
      `eigenvector centrality did not settle after ${EIGENVECTOR_ITERATIONS} iterations on a network of ${graph.order} characters; ` +
        'raise minWeight or keep only the largest component, and draw another centrality if it persists',
    );
  }
}

/**
 * Louvain communities, renumbered from 1 by size (largest first), ties by
 * the member order of their first node; and the weighted modularity of that
 * partition (null when there are no links). A network without links puts
 * every character in a community of its own.
 */
export function communitiesOf(
  graph: CharacterGraph,
  options: Pick<AnalyseOptions, 'seed' | 'resolution'>,
): { communities: Map<string, number>; modularity: number | null } {
  const nodes = graph.nodes();
  if (graph.size === 0) return { communities: new Map(nodes.map((id, i) => [id, i + 1])), modularity: null };
  const raw = louvain(graph, { getEdgeWeight: 'weight', resolution: options.resolution, rng: seededRandom(options.seed) });
  const groups = new Map<number, string[]>();
  for (const id of nodes) {
    const c = raw[id]!;
    const g = groups.get(c);
    if (g) g.push(id);
    else groups.set(c, [id]);
  }
  const position = new Map(nodes.map((id, i) => [id, i]));
  const ranked = [...groups.values()].sort((a, b) => b.length - a.length || position.get(a[0]!)! - position.get(b[0]!)!);
  const communities = new Map<string, number>();
  ranked.forEach((members, k) => members.forEach((id) => communities.set(id, k + 1)));
  const q = modularity(graph, {
    getNodeCommunity: (id) => communities.get(id)!,
    getEdgeWeight: 'weight',
    resolution: options.resolution,
  });
  return { communities, modularity: q };
}
