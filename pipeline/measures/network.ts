import { z } from 'zod';
import type { Measure, MeasureContext } from './types.ts';
import type { BarsData, MatrixData, NetworkData } from '../charts/types.ts';
import type { NetworkEdge, NetworkMember, NetworkNode, NetworkSummary } from '../network/types.ts';
import { copresencePairs, mentionCounts } from '../network/copresence.ts';
import { conversationPairs } from '../network/conversation.ts';
import { analyseNetwork } from '../network/analyse.ts';
import { connectedComponents } from '../network/components.ts';
import { buildGraph } from '../network/graph.ts';
import { readQuotes, type QuoteReader } from '../network/quotes.ts';

const centrality = ['weightedDegree', 'betweenness', 'eigenvector'] as const;

export const networkParams = z
  .object({
    source: z
      .enum(['copresence', 'conversation'])
      .default('copresence')
      .describe(
        'What links two characters: "copresence" — the text names both within one window; "conversation" — one speaks to the other (turns of speech with a known speaker and addressee). Default: "copresence".',
      ),
    window: z
      .enum(['paragraph', 'sentence', 'tokens'])
      .default('paragraph')
      .describe(
        'For co-presence, the window both names must fall in: one paragraph, one sentence, or at most `span` words apart within one chapter. Default: "paragraph".',
      ),
    span: z
      .number()
      .int()
      .min(1)
      .max(1000)
      .default(50)
      .describe('Largest distance in words between two mentions that still links them, when `window` is "tokens". Default: 50.'),
    minWeight: z
      .number()
      .int()
      .min(1)
      .default(1)
      .describe('Drop links that occur fewer times than this, to keep only lasting ties. Default: 1 (keep every link).'),
    components: z
      .enum(['all', 'largest'])
      .default('all')
      .describe(
        'Keep every connected group of characters, or only the largest (most characters; ties: most link weight, then earliest in the cast). Default: "all".',
      ),
    isolates: z
      .boolean()
      .default(false)
      .describe('Keep characters who are named but linked to nobody, as lone nodes. Default: false (they are listed as left out).'),
    characters: z
      .array(z.string())
      .optional()
      .describe('Only these cast ids. Default: the whole cast.'),
    distance: z
      .enum(['hops', 'inverse-weight'])
      .default('hops')
      .describe(
        'Path length for betweenness: "hops" counts every link as one step; "inverse-weight" makes a link of weight w 1/w long, so strong ties are short. Default: "hops".',
      ),
    resolution: z
      .number()
      .positive()
      .max(10)
      .default(1)
      .describe('Louvain resolution γ: above 1 finds more, smaller communities; below 1 fewer, larger ones. Default: 1.'),
    seed: z
      .number()
      .int()
      .min(0)
      .max(4294967295)
      .default(1)
      .describe('Seed of the random visiting order of the Louvain method, so the communities are the same on every build. Default: 1.'),
    size: z
      .enum(centrality)
      .default('weightedDegree')
      .describe('What node size shows in the network chart: "weightedDegree", "betweenness" or "eigenvector". Default: "weightedDegree".'),
    bars: z
      .enum(['degree', ...centrality])
      .default('weightedDegree')
      .describe('Which centrality the bar chart ranks characters by: "degree", "weightedDegree", "betweenness" or "eigenvector". Default: "weightedDegree".'),
  })
  .strict();

export type NetworkParams = z.infer<typeof networkParams>;

export interface NetworkResult {
  source: 'copresence' | 'conversation';
  /** The co-presence window, or null for conversation. */
  window: 'paragraph' | 'sentence' | 'tokens' | null;
  /** The token span, or null unless the window is "tokens". */
  span: number | null;
  /** Louvain seed used. */
  seed: number;
  /** What an edge weight counts, in words. */
  weightLabel: string;
  /** Characters in the network, most strongly linked first (weighted degree, then degree, then cast order). */
  nodes: NetworkNode[];
  /** Links, heaviest first (ties by cast order of source, then target). */
  edges: NetworkEdge[];
  summary: NetworkSummary;
  /** Cast members left out of the network, and why. */
  leftOut: { id: string; name: string; mentions: number; reason: 'never named' | 'no link' | 'outside the largest component' }[];
}

/** The network measure, reading quotations for the conversation source through `quotes`. */
export function createNetworkMeasure(quotes: QuoteReader): Measure<NetworkParams, NetworkResult> {
  return {
    name: 'network',
    version: 3,
    params: networkParams,
    needsCast: true,
    reads: { cast: true, dialogue: true },
    compute: (ctx, params) => computeNetwork(ctx, params, quotes),
    method: {
      what: 'A network of the characters: two are linked each time the text names both close together (or, for conversation, each time one speaks to the other). Centralities show who holds the network together; communities group characters who mostly appear with one another.',
      formula: [
        'Link weight w_ij: with a paragraph or sentence window, the number of paragraphs (sentences) naming both i and j; with a token window, the number of pairs of mentions, one of each, at most s words apart in one chapter; for conversation, the turns of speech i addresses to j plus those j addresses to i, with speakers and addressees read as in the speech and conversation measures (turns with either unknown are left out). Links lighter than minWeight are dropped.',
        'Degree k_i = number of characters linked to i; weighted degree s_i = Σ_j w_ij.',
        'Betweenness C_B(v) = Σ_{s≠v≠t} σ_st(v) ÷ σ_st, summed over ordered pairs (s, t) and divided by (N−1)(N−2) so that it runs from 0 to 1; σ_st is the number of shortest paths from s to t, σ_st(v) those through v. Paths count links ("hops") or, with distance "inverse-weight", a link is 1 ÷ w_ij long.',
        'Eigenvector centrality x_i = (1/λ) Σ_j w_ij x_j: the leading eigenvector of the weight matrix, scaled so that Σ x_i² = 1, found by power iteration on W + I (at most 1,000 rounds, tolerance 10⁻⁶ per node).',
        'Communities: the Louvain method, which moves nodes between communities and then merges communities while the modularity Q = (1/2m) Σ_ij [w_ij − γ s_i s_j ÷ 2m] δ(c_i, c_j) grows (m = total link weight, γ = resolution). Nodes are visited in a random order drawn from the Mulberry32 generator seeded with `seed` (default 1), so a build repeats exactly. Communities are numbered from 1, largest first.',
        'Density = E ÷ (N(N−1)/2): links present over links possible.',
      ].join(' '),
      source:
        'Character networks: Moretti 2011, "Network Theory, Plot Analysis" (characters linked by interaction); Elson, Dames & McKeown 2010, "Extracting Social Networks from Literary Fiction" (links from conversations). Betweenness: Freeman 1977, computed by Brandes 2001; eigenvector centrality: Bonacich 1972; modularity: Newman 2006; Louvain method: Blondel, Guillaume, Lambiotte & Lefebvre 2008. Computed with graphology-metrics and graphology-communities-louvain.',
      caveats: [
        'Co-mention is not interaction: two characters named in one paragraph may be apart, remembered, or merely talked about.',
        'The window changes the picture: paragraph links follow the author’s paragraphing, token windows link more pairs in dense passages; compare windows before reading much into one link.',
        'Only names are counted, not pronouns, and ambiguous names are left out, as in the presence measure: link weights are a floor.',
        'Betweenness is unstable on small networks: with a handful of characters, one link more or less can move a character from zero to the top.',
        'On a network in several pieces, eigenvector centrality gathers on the piece with the strongest core; characters elsewhere score near zero.',
        'Louvain is a heuristic: another seed or resolution may give another, nearly as good partition. A modularity below about 0.3 suggests little community structure (a rule of thumb, Newman & Girvan 2004).',
      ],
    },
    table(result) {
      return {
        columns: [
          { key: 'id', label: 'Id', numeric: false },
          { key: 'name', label: 'Character', numeric: false },
          { key: 'mentions', label: 'Mentions', numeric: true },
          { key: 'degree', label: 'Degree', numeric: true },
          { key: 'weightedDegree', label: 'Weighted degree', numeric: true },
          { key: 'betweenness', label: 'Betweenness', numeric: true },
          { key: 'eigenvector', label: 'Eigenvector', numeric: true },
          { key: 'community', label: 'Community', numeric: true },
        ],
        rows: result.nodes.map((n) => [
          n.id,
          n.name,
          n.mentions,
          n.degree,
          n.weightedDegree,
          round(n.betweenness),
          round(n.eigenvector),
          n.community,
        ]),
      };
    },
    views: {
      network(result, params): NetworkData {
        return {
          kind: 'network',
          title: `Character network — ${sourceTitle(result)}`,
          nodes: result.nodes.map((n) => ({ id: n.id, name: n.name, size: n[params.size], community: n.community })),
          edges: result.edges.map((e) => ({ ...e })),
          sizeLabel: CENTRALITY_LABELS[params.size],
          weightLabel: result.weightLabel,
        };
      },
      bars(result, params): BarsData {
        const key = params.bars;
        const ranked = [...result.nodes].sort((a, b) => b[key] - a[key]);
        return {
          kind: 'bars',
          title: `${CENTRALITY_LABELS[key]} of each character — ${sourceTitle(result)}`,
          categoryLabel: 'Character',
          valueLabel: CENTRALITY_LABELS[key],
          categories: ranked.map((n) => n.name),
          series: [{ id: key, name: CENTRALITY_LABELS[key], values: ranked.map((n) => n[key]) }],
          format: key === 'degree' || key === 'weightedDegree' ? 'count' : 'decimal',
        };
      },
      matrix(result): MatrixData {
        const order = matrixOrder(result.nodes);
        const at = new Map(order.map((n, i) => [n.id, i]));
        const values = order.map(() => new Array<number>(order.length).fill(0));
        for (const e of result.edges) {
          const i = at.get(e.source)!;
          const j = at.get(e.target)!;
          values[i]![j] = e.weight;
          values[j]![i] = e.weight;
        }
        const labels = order.map((n) => ({ id: n.id, name: n.name }));
        return {
          kind: 'matrix',
          title: `Links between characters, grouped by community — ${sourceTitle(result)}`,
          rowLabel: 'Character',
          columnLabel: 'Character',
          rows: labels,
          columns: labels.map((l) => ({ ...l })),
          values,
          valueLabel: result.weightLabel,
          format: 'count',
        };
      },
    },
  };
}

export const network: Measure<NetworkParams, NetworkResult> = createNetworkMeasure(readQuotes);

const CENTRALITY_LABELS: Record<'degree' | (typeof centrality)[number], string> = {
  degree: 'Degree',
  weightedDegree: 'Weighted degree',
  betweenness: 'Betweenness (normalised)',
  eigenvector: 'Eigenvector centrality',
};

function round(x: number): number {
  return Math.round(x * 10000) / 10000;
}

function sourceTitle(result: NetworkResult): string {
  if (result.source === 'conversation') return 'who speaks to whom';
  if (result.window === 'tokens') return `named within ${result.span} words`;
  return `named in the same ${result.window}`;
}

function weightLabelOf(params: NetworkParams): string {
  if (params.source === 'conversation') return 'Turns addressed between them';
  if (params.window === 'paragraph') return 'Paragraphs naming both';
  if (params.window === 'sentence') return 'Sentences naming both';
  return `Mention pairs within ${params.span} words`;
}

/** Nodes by community, then degree (most links first), then weighted degree, then the result's order. */
export function matrixOrder(nodes: readonly NetworkNode[]): NetworkNode[] {
  const pos = new Map(nodes.map((n, i) => [n.id, i]));
  return [...nodes].sort(
    (a, b) => a.community - b.community || b.degree - a.degree || b.weightedDegree - a.weightedDegree || pos.get(a.id)! - pos.get(b.id)!,
  );
}

export function computeNetwork(ctx: MeasureContext, params: NetworkParams, quotes: QuoteReader = readQuotes): NetworkResult {
  const { model, cast, mentions } = ctx;
  const chosen = params.characters ?? cast.map((c) => c.id);
  const unknown = chosen.filter((id) => !cast.some((c) => c.id === id));
  if (unknown.length) {
    throw new RangeError(`characters names ids that are not in the cast: ${unknown.join(', ')}; use the ids of the text's cast list`);
  }
  const counted = cast.map((c) => chosen.includes(c.id));
  const named = mentionCounts(mentions, cast.length);
  const pairs =
    params.source === 'copresence'
      ? copresencePairs(model, mentions, cast.length, counted, { window: params.window, span: params.span })
      : conversationPairs(quotesOf(ctx, quotes), cast.map((c) => c.id), counted);
  const kept = pairs.filter((p) => p.weight >= params.minWeight);
  const linked = new Set(kept.flatMap((p) => [p.a, p.b]));
  const leftOut: NetworkResult['leftOut'] = [];
  let members: number[] = [];
  for (let i = 0; i < cast.length; i++) {
    if (!counted[i]) continue;
    const c = cast[i]!;
    if (linked.has(i) || (params.isolates && named[i]! > 0)) members.push(i);
    else leftOut.push({ id: c.id, name: c.name, mentions: named[i]!, reason: named[i] ? 'no link' : 'never named' });
  }
  const toMember = (i: number): NetworkMember => ({ id: cast[i]!.id, name: cast[i]!.name, mentions: named[i]! });
  let edges: NetworkEdge[] = kept.map((p) => ({ source: cast[p.a]!.id, target: cast[p.b]!.id, weight: p.weight }));
  if (params.components === 'largest' && members.length > 0) {
    const largest = largestComponent(members.map(toMember), edges);
    for (const i of members) {
      if (!largest.has(cast[i]!.id)) leftOut.push({ ...toMember(i), reason: 'outside the largest component' });
    }
    members = members.filter((i) => largest.has(cast[i]!.id));
    edges = edges.filter((e) => largest.has(e.source));
  }
  const analysed = analyseNetwork(members.map(toMember), edges, {
    seed: params.seed,
    resolution: params.resolution,
    distance: params.distance,
  });
  const castOrder = new Map(cast.map((c, i) => [c.id, i]));
  const nodes = [...analysed.nodes].sort(
    (a, b) => b.weightedDegree - a.weightedDegree || b.degree - a.degree || castOrder.get(a.id)! - castOrder.get(b.id)!,
  );
  const sortedEdges = [...analysed.edges].sort(
    (a, b) =>
      b.weight - a.weight || castOrder.get(a.source)! - castOrder.get(b.source)! || castOrder.get(a.target)! - castOrder.get(b.target)!,
  );
  leftOut.sort((a, b) => castOrder.get(a.id)! - castOrder.get(b.id)!);
  return {
    source: params.source,
    window: params.source === 'copresence' ? params.window : null,
    span: params.source === 'copresence' && params.window === 'tokens' ? params.span : null,
    seed: params.seed,
    weightLabel: weightLabelOf(params),
    nodes,
    edges: sortedEdges,
    summary: analysed.summary,
    leftOut,
  };
}

function quotesOf(ctx: MeasureContext, quotes: QuoteReader) {
  const list = quotes(ctx);
  if (list === null) {
    throw new Error(
      `the conversation network of text "${ctx.model.id}" needs the speakers and addressees of its quotations, and this build has no dialogue reader; use source: copresence for now`,
    );
  }
  return list;
}

/** Ids of the largest connected component: most characters, then most link weight, then earliest in the given order. */
function largestComponent(members: NetworkMember[], edges: NetworkEdge[]): Set<string> {
  const components = connectedComponents(buildGraph(members, edges)).map((ids) => {
    const set = new Set(ids);
    return { set, weight: edges.filter((e) => set.has(e.source)).reduce((s, e) => s + e.weight, 0) };
  });
  let best = components[0]!;
  for (const c of components.slice(1)) {
    if (c.set.size > best.set.size || (c.set.size === best.set.size && c.weight > best.weight)) best = c;
  }
  return best.set;
}
