import { describe, it, expect } from 'vitest';
import { network, createNetworkMeasure, matrixOrder } from '../../pipeline/measures/network.ts';
import { conversationPairs, type QuoteTurn } from '../../pipeline/network/conversation.ts';
import { context, edgeSet, member } from './helpers.ts';

// An invented text. Word positions (0-based) of the names, counted by hand:
// ch. I   ¶1  Orla(0) Venn met Piet(3) Marsh at the ferry steps. Orla(9) laughed.
//         ¶2  Hedda(11) Croy waited alone on the quay. Piet(18) was late again.
// ch. II  ¶3  Orla(22) and Hedda(24) mended nets all morning while Piet(30) slept.
// ch. III ¶4  Wenna(32) Dale sang by the lock.
const TEXT = [
  'CHAPTER I.',
  '',
  'Orla Venn met Piet Marsh at the ferry steps. Orla laughed.',
  '',
  'Hedda Croy waited alone on the quay. Piet was late again.',
  '',
  'CHAPTER II.',
  '',
  'Orla and Hedda mended nets all morning while Piet slept.',
  '',
  'CHAPTER III.',
  '',
  'Wenna Dale sang by the lock.',
  '',
].join('\n');

const CAST = [
  member('orla', 'Orla Venn'),
  member('piet', 'Piet Marsh'),
  member('hedda', 'Hedda Croy'),
  member('wenna', 'Wenna Dale'),
  member('tobin', 'Tobin Ash'),
];

const ctx = context(TEXT, CAST);
const run = (params: Record<string, unknown>, measure = network) => measure.compute(ctx, measure.params.parse(params));

describe('co-presence counts, checked by hand', () => {
  it('paragraph window: one per paragraph naming both, however often', () => {
    // ¶1 Orla+Piet; ¶2 Hedda+Piet; ¶3 Orla+Hedda+Piet → Orla–Piet 2, Hedda–Piet 2, Orla–Hedda 1.
    const r = run({});
    expect(edgeSet(r.edges)).toEqual(['hedda–orla:1', 'hedda–piet:2', 'orla–piet:2']);
    expect(r.weightLabel).toBe('Paragraphs naming both');
    const piet = r.nodes.find((n) => n.id === 'piet')!;
    expect(piet).toMatchObject({ mentions: 3, degree: 2, weightedDegree: 4 });
    // Piet has the largest weighted degree (4, against 3 and 3), so comes first.
    expect(r.nodes.map((n) => n.id)).toEqual(['piet', 'orla', 'hedda']);
  });

  it('sentence window: only sentences naming both', () => {
    // S1 Orla+Piet; "Orla laughed." alone; ¶2 has one name per sentence; ¶3 is one sentence with all three.
    const r = run({ window: 'sentence' });
    expect(edgeSet(r.edges)).toEqual(['hedda–orla:1', 'hedda–piet:1', 'orla–piet:2']);
    expect(r.weightLabel).toBe('Sentences naming both');
  });

  it('token window: pairs of mentions at most `span` words apart, never across a chapter break', () => {
    // span 5: Orla(0)–Piet(3) 3; Orla(9)–Hedda(11) 2; Orla(22)–Hedda(24) 2. Piet(18)–Orla(22) is 4 apart but crosses into ch. II.
    const five = run({ window: 'tokens', span: 5 });
    expect(edgeSet(five.edges)).toEqual(['hedda–orla:2', 'orla–piet:1']);
    expect(five.span).toBe(5);
    // span 7 adds Piet(3)–Orla(9) 6, Hedda(11)–Piet(18) 7, Hedda(24)–Piet(30) 6; Orla(22)–Piet(30) is 8.
    const seven = run({ window: 'tokens', span: 7 });
    expect(edgeSet(seven.edges)).toEqual(['hedda–orla:2', 'hedda–piet:2', 'orla–piet:2']);
    expect(seven.weightLabel).toBe('Mention pairs within 7 words');
  });

  it('uses a 50-word span by default', () => {
    // All eight mentions of ch. I–II lie within 50 words; the chapter break still separates ¶1–2 from ¶3.
    // Ch. I: Orla×2, Piet×2, Hedda×1 → Orla–Piet 4 (pairs of an Orla and a Piet), Orla–Hedda 2, Hedda–Piet 2;
    // ch. II: one of each pair. Totals 5, 3, 3.
    const r = run({ window: 'tokens' });
    expect(r.span).toBe(50);
    expect(edgeSet(r.edges)).toEqual(['hedda–orla:3', 'hedda–piet:3', 'orla–piet:5']);
  });

  it('drops links under minWeight and lists who was left out and why', () => {
    const r = run({ minWeight: 2 });
    expect(edgeSet(r.edges)).toEqual(['hedda–piet:2', 'orla–piet:2']);
    expect(r.leftOut).toEqual([
      { id: 'wenna', name: 'Wenna Dale', mentions: 1, reason: 'no link' },
      { id: 'tobin', name: 'Tobin Ash', mentions: 0, reason: 'never named' },
    ]);
  });

  it('keeps named but unlinked characters as lone nodes when asked', () => {
    const r = run({ isolates: true });
    const wenna = r.nodes.find((n) => n.id === 'wenna')!;
    expect(wenna).toMatchObject({ degree: 0, weightedDegree: 0, betweenness: 0 });
    expect(r.summary.components).toBe(2);
    // A lone node is a community of its own.
    expect(r.nodes.filter((n) => n.community === wenna.community)).toHaveLength(1);
    expect(r.leftOut.map((c) => c.id)).toEqual(['tobin']);
  });

  it('restricts the network to the characters named', () => {
    const r = run({ characters: ['orla', 'hedda'] });
    expect(edgeSet(r.edges)).toEqual(['hedda–orla:1']);
    expect(() => run({ characters: ['orla', 'nobody'] })).toThrow(/nobody/);
  });

  it('computes the summary figures of a triangle', () => {
    const r = run({});
    // Three nodes, three links: density 3 / (3·2/2) = 1; one component; total weight 5.
    expect(r.summary).toMatchObject({ nodes: 3, edges: 3, totalWeight: 5, density: 1, components: 1 });
    // In a triangle no one lies between two others.
    expect(r.nodes.every((n) => n.betweenness === 0)).toBe(true);
  });
});

describe('conversation source', () => {
  const QUOTES: QuoteTurn[] = [
    { speaker: 'orla', addressee: 'piet' },
    { speaker: 'orla', addressee: 'piet' },
    { speaker: 'piet', addressee: 'orla' },
    { speaker: 'hedda', addressee: 'wenna' },
    { speaker: null, addressee: 'piet' },
    { speaker: 'piet', addressee: undefined },
    { speaker: 'orla', addressee: 'orla' },
    { speaker: 'piet', addressee: 'a stranger' },
  ];
  const talking = createNetworkMeasure(() => QUOTES);

  it('counts turns in both directions, skipping unknown, self-addressed and out-of-cast turns', () => {
    // Orla→Piet 2 + Piet→Orla 1 = 3; Hedda→Wenna 1.
    const r = run({ source: 'conversation' }, talking);
    expect(edgeSet(r.edges)).toEqual(['hedda–wenna:1', 'orla–piet:3']);
    expect(r.window).toBeNull();
    expect(r.weightLabel).toBe('Turns addressed between them');
    expect(conversationPairs(QUOTES, ['orla', 'piet', 'hedda', 'wenna'], [true, true, false, true])).toEqual([{ a: 0, b: 1, weight: 3 }]);
  });

  it('keeps only the largest component when asked: the heavier of two equal-sized ones', () => {
    const r = run({ source: 'conversation', components: 'largest' }, talking);
    expect(r.nodes.map((n) => n.id).sort()).toEqual(['orla', 'piet']);
    expect(r.leftOut.filter((c) => c.reason === 'outside the largest component').map((c) => c.id)).toEqual(['hedda', 'wenna']);
  });

  it('reads the turns of the dialogue reader by default', () => {
    // Each speech has a tag naming speaker and listener, so the turns are, by hand:
    // Orla→Piet ("said Orla", vocative "Piet"), Piet→Orla ("Piet said to Orla"), Hedda→Piet ("said Hedda to Piet").
    const talk = [
      'Orla Venn and Piet Marsh stood on the ferry steps.',
      '“Pass me the rope, Piet,” said Orla.',
      '“Take it yourself,” Piet said to Orla.',
      'Hedda Croy came down the quay with a lantern.',
      '“You two again,” said Hedda to Piet.',
      '',
    ].join('\n\n');
    const talkCast = [
      { ...member('orla', 'Orla Venn'), pronoun: 'she' as const },
      { ...member('piet', 'Piet Marsh'), pronoun: 'he' as const },
      { ...member('hedda', 'Hedda Croy'), pronoun: 'she' as const },
    ];
    const r = network.compute(context(talk, talkCast), network.params.parse({ source: 'conversation' }));
    expect(edgeSet(r.edges)).toEqual(['hedda–piet:1', 'orla–piet:2']);
  });

  it('says what to do when the build cannot read dialogue', () => {
    const silent = createNetworkMeasure(() => null);
    expect(() => run({ source: 'conversation' }, silent)).toThrow(/no dialogue reader.*source: copresence/);
  });
});

describe('views', () => {
  const params = network.params.parse({ size: 'betweenness', bars: 'degree' });
  const r = network.compute(ctx, network.params.parse({ window: 'tokens', span: 7, isolates: true }));

  it('network: node size is the chosen centrality, communities as found', () => {
    const view = network.views.network!(r, params);
    if (view.kind !== 'network') throw new Error('wrong view kind');
    expect(view.nodes.map((n) => n.size)).toEqual(r.nodes.map((n) => n.betweenness));
    expect(view.nodes.map((n) => n.community)).toEqual(r.nodes.map((n) => n.community));
    expect(view.edges).toEqual(r.edges);
    expect(view.sizeLabel).toMatch(/Betweenness/);
  });

  it('bars: one bar per character, highest first', () => {
    const view = network.views.bars!(r, params);
    if (view.kind !== 'bars') throw new Error('wrong view kind');
    const values = view.series[0]!.values;
    expect(values).toEqual([...values].sort((a, b) => b - a));
    expect(view.categories).toHaveLength(r.nodes.length);
    expect(view.format).toBe('count');
  });

  it('matrix: symmetric link weights, ordered by community then degree', () => {
    const view = network.views.matrix!(r, params);
    if (view.kind !== 'matrix') throw new Error('wrong view kind');
    const n = view.rows.length;
    const order = matrixOrder(r.nodes);
    expect(view.rows.map((row) => row.id)).toEqual(order.map((o) => o.id));
    for (let i = 1; i < n; i++) {
      const [a, b] = [order[i - 1]!, order[i]!];
      expect(a.community < b.community || (a.community === b.community && a.degree >= b.degree)).toBe(true);
    }
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) expect(view.values[i]![j]).toBe(view.values[j]![i]);
    const total = view.values.flat().reduce((s, v) => s + v, 0);
    expect(total).toBe(2 * r.summary.totalWeight);
  });

  it('table: one row per character with every metric', () => {
    const table = network.table(r, params);
    expect(table.rows).toHaveLength(r.nodes.length);
    expect(table.columns.map((c) => c.key)).toEqual(['id', 'name', 'mentions', 'degree', 'weightedDegree', 'betweenness', 'eigenvector', 'community']);
  });

  it('documents every option with its default', () => {
    const shape = (network.params as unknown as { shape: Record<string, { description?: string }> }).shape;
    for (const [key, s] of Object.entries(shape)) expect(s.description, key).toMatch(/Default:/);
  });
});
