/** Plain-JSON shapes shared by the network helpers and the network measure. */

/** A link between two characters, by cast id; `source` comes before `target` in cast order. */
export interface NetworkEdge {
  source: string;
  target: string;
  /** Co-occurrences (co-presence) or turns addressed between the two (conversation). */
  weight: number;
}

/** A character as the network receives it, before any metric is computed. */
export interface NetworkMember {
  id: string;
  name: string;
  /** Times the text names the character (cast mentions), whole text. */
  mentions: number;
}

/** A character in the analysed network. */
export interface NetworkNode extends NetworkMember {
  /** Number of other characters linked to this one. */
  degree: number;
  /** Sum of the weights of this character's links (strength). */
  weightedDegree: number;
  /** Normalised betweenness centrality, 0..1. */
  betweenness: number;
  /** Eigenvector centrality, the vector scaled to Euclidean length 1. */
  eigenvector: number;
  /** Louvain community, numbered from 1: largest community first. */
  community: number;
}

export interface NetworkSummary {
  nodes: number;
  edges: number;
  /** Sum of all edge weights. */
  totalWeight: number;
  /** Share of possible links present: E ÷ (N(N−1)/2); 0 when N < 2. */
  density: number;
  /** Connected components. */
  components: number;
  /** Louvain communities. */
  communities: number;
  /** Weighted modularity Q of the Louvain partition, at the chosen resolution (γ = 1: Newman’s Q); null when the network has no links. */
  modularity: number | null;
}
