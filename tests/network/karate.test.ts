import { describe, it, expect } from 'vitest';
import { UndirectedGraph } from 'graphology';
import karateClub from 'graphology-generators/social/karate-club.js';
import { analyseNetwork } from '../../pipeline/network/analyse.ts';
import { network } from '../../pipeline/measures/network.ts';
import type { NetworkEdge, NetworkMember } from '../../pipeline/network/types.ts';
import { context, member, newmanModularity } from './helpers.ts';

// Zachary's karate club: 34 members, 78 friendships.
// Source: Zachary, W. W. (1977), "An Information Flow Model for Conflict and Fission in Small Groups",
// Journal of Anthropological Research 33:452–473; adjacency as shipped in graphology-generators (social/karate-club).
const club = karateClub(UndirectedGraph);
const clubMembers: NetworkMember[] = club.nodes().map((id) => ({ id, name: `Member ${Number(id) + 1}`, mentions: 1 }));
const clubEdges: NetworkEdge[] = club.mapEdges((_e, _a, source, target) => ({ source, target, weight: 1 }));

// Normalised betweenness, "node k" 1-based (node 1 = "0").
// Source: Zachary 1977 data, values as computed by NetworkX (betweenness_centrality, normalized=True) and graphology-metrics.
const BETWEENNESS: [string, number][] = [
  ['0', 0.4376352813852814], // node 1
  ['33', 0.30407497594997596], // node 34
  ['32', 0.145247], // node 33
  ['2', 0.143657], // node 3
];

/** Betweenness straight from its definition, with shortest paths counted by breadth-first search. */
function betweennessByDefinition(ids: string[], edges: NetworkEdge[]): Map<string, number> {
  // Source: Freeman, L. C. (1977), "A set of measures of centrality based on betweenness", Sociometry 40:35–41:
  // C_B(v) = Σ_{s≠v≠t} σ_st(v)/σ_st, where σ_st(v) = σ_sv·σ_vt when d(s,v)+d(v,t) = d(s,t);
  // over unordered pairs, normalised by (N−1)(N−2)/2 (common practice, no source).
  const index = new Map(ids.map((id, i) => [id, i]));
  const n = ids.length;
  const adj: number[][] = ids.map(() => []);
  for (const e of edges) {
    adj[index.get(e.source)!]!.push(index.get(e.target)!);
    adj[index.get(e.target)!]!.push(index.get(e.source)!);
  }
  const dist: number[][] = [];
  const sigma: number[][] = [];
  for (let s = 0; s < n; s++) {
    const d = new Array<number>(n).fill(-1);
    const g = new Array<number>(n).fill(0);
    d[s] = 0;
    g[s] = 1;
    const queue = [s];
    for (let k = 0; k < queue.length; k++) {
      const u = queue[k]!;
      for (const w of adj[u]!) {
        if (d[w] === -1) {
          d[w] = d[u]! + 1;
          queue.push(w);
        }
        if (d[w] === d[u]! + 1) g[w]! += g[u]!;
      }
    }
    dist.push(d);
    sigma.push(g);
  }
  const out = new Map<string, number>();
  for (let v = 0; v < n; v++) {
    let sum = 0;
    for (let s = 0; s < n; s++) {
      for (let t = s + 1; t < n; t++) {
        if (s === v || t === v || dist[s]![t]! < 0) continue;
        if (dist[s]![v]! + dist[v]![t]! === dist[s]![t]!) sum += (sigma[s]![v]! * sigma[v]![t]!) / sigma[s]![t]!;
      }
    }
    out.set(ids[v]!, sum / (((n - 1) * (n - 2)) / 2));
  }
  return out;
}

/** Leading eigenvector of the adjacency matrix by plain power iteration on A + I, to 1e-14. */
function eigenvectorByPowerIteration(ids: string[], edges: NetworkEdge[]): Map<string, number> {
  // Eigenvector centrality x = (1/λ) A x, scaled to unit Euclidean length.
  // Source: Bonacich, P. (1972), "Factoring and weighting approaches to status scores and clique identification",
  // Journal of Mathematical Sociology 2:113–120; A + I shares A's eigenvectors (common practice, no source).
  const index = new Map(ids.map((id, i) => [id, i]));
  let x = ids.map(() => 1);
  for (let round = 0; round < 100_000; round++) {
    const y = [...x];
    for (const e of edges) {
      const a = index.get(e.source)!;
      const b = index.get(e.target)!;
      y[a]! += e.weight * x[b]!;
      y[b]! += e.weight * x[a]!;
    }
    const norm = Math.hypot(...y);
    const next = y.map((v) => v / norm);
    const change = next.reduce((s, v, i) => s + Math.abs(v - x[i]!), 0);
    x = next;
    if (change < 1e-14) break;
  }
  return new Map(ids.map((id, i) => [id, x[i]!]));
}

describe('network metrics on the karate club', () => {
  const result = analyseNetwork(clubMembers, clubEdges, { seed: 1, resolution: 1, distance: 'hops' });
  const byId = new Map(result.nodes.map((n) => [n.id, n]));

  it('matches the published normalised betweenness of members 1, 34, 33 and 3', () => {
    expect(result.nodes).toHaveLength(34);
    for (const [id, value] of BETWEENNESS) expect(byId.get(id)!.betweenness).toBeCloseTo(value, 6);
  });

  it('uses the same normalisation as the definition, for every member', () => {
    // Normalised by (N−1)(N−2)/2 unordered pairs, as NetworkX does for undirected graphs (from memory).
    const expected = betweennessByDefinition(club.nodes(), clubEdges);
    for (const n of result.nodes) expect(n.betweenness).toBeCloseTo(expected.get(n.id)!, 10);
  });

  it('gives a distance-independent betweenness when every link weighs 1', () => {
    const inverse = analyseNetwork(clubMembers, clubEdges, { seed: 1, resolution: 1, distance: 'inverse-weight' });
    for (const n of inverse.nodes) expect(n.betweenness).toBeCloseTo(byId.get(n.id)!.betweenness, 10);
  });

  it('matches eigenvector centrality computed independently, and the values NetworkX reports', () => {
    const expected = eigenvectorByPowerIteration(club.nodes(), clubEdges);
    for (const n of result.nodes) expect(n.eigenvector).toBeCloseTo(expected.get(n.id)!, 4);
    // NetworkX eigenvector_centrality on the club, from memory: node 1 ≈ 0.35548, node 34 ≈ 0.37337.
    expect(byId.get('0')!.eigenvector).toBeCloseTo(0.35548, 4);
    expect(byId.get('33')!.eigenvector).toBeCloseTo(0.37337, 4);
    expect(result.nodes.reduce((s, n) => s + n.eigenvector ** 2, 0)).toBeCloseTo(1, 9);
  });

  it('counts degree, weighted degree, density and components', () => {
    // Zachary 1977: member 34 has 17 friends, member 1 has 16, member 12 has 1.
    expect(byId.get('33')!.degree).toBe(17);
    expect(byId.get('0')!.degree).toBe(16);
    expect(byId.get('11')!.degree).toBe(1);
    for (const n of result.nodes) expect(n.weightedDegree).toBe(n.degree);
    // Density = E / (N(N−1)/2) = 78 / 561 (common practice, no source).
    expect(result.summary.density).toBeCloseTo(78 / 561, 12);
    expect(result.summary).toMatchObject({ nodes: 34, edges: 78, totalWeight: 78, components: 1 });
  });

  it('finds communities whose modularity is the one Newman’s formula gives for them', () => {
    const q = newmanModularity(clubEdges, (id) => byId.get(id)!.community);
    expect(result.summary.modularity).toBeCloseTo(q, 12);
    // The club's maximum modularity is 0.4198, proven optimal by integer programming
    // (Brandes et al. 2008, "On modularity clustering", IEEE TKDE 20(2); from memory); Louvain gets close to it.
    expect(result.summary.modularity!).toBeGreaterThan(0.38);
    expect(result.summary.modularity!).toBeLessThan(0.4199);
  });
});

describe('the network measure on a text whose paragraphs are the karate club’s friendships', () => {
  // Invented single-word names; each friendship becomes one paragraph naming the two members.
  const first = ['Bal', 'Cor', 'Dun', 'Fen', 'Gil', 'Hol', 'Jas', 'Kel', 'Lor', 'Mab', 'Nor', 'Pel', 'Quin', 'Ros', 'Sel', 'Tam', 'Ulf'];
  const names = first.flatMap((f) => [`${f}wick`, `${f}amar`]);
  const cast = club.nodes().map((id) => member(`m${id}`, names[Number(id)]!));
  const text = clubEdges.map((e) => `${names[Number(e.source)]} met ${names[Number(e.target)]} at the boathouse.`).join('\n\n') + '\n';
  const result = network.compute(context(text, cast), network.params.parse({}));
  const byId = new Map(result.nodes.map((n) => [n.id, n]));

  it('rebuilds the club: 34 characters, 78 links of weight 1', () => {
    expect(result.summary).toMatchObject({ nodes: 34, edges: 78, totalWeight: 78, components: 1 });
    expect(result.edges.every((e) => e.weight === 1)).toBe(true);
  });

  it('gives the published normalised betweenness', () => {
    for (const [id, value] of BETWEENNESS) expect(byId.get(`m${id}`)!.betweenness).toBeCloseTo(value, 6);
  });
});
