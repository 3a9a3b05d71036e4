/**
 * Invented datasets for the matrix, network, tree and treemap charts, in the
 * scenario of fixtures.ts: "The Saltmarsh Ledger", set in the fenland
 * village of Wending Reach. Besides Ada Vell, Bram Osk, Cleo Harrow, Doran
 * Pike and Essa Quill, the village holds the net-mender Fenna Rook, the
 * miller Gil Tarrow, the reeve Hollis Marr, the ferry boy Ivo Sedge and the
 * carter Jory Lumm.
 */

import type { MatrixData, NetworkData, TreeData, TreeNode, TreemapData } from '../../pipeline/charts/types.ts';

export const people = [
  { id: 'ada', name: 'Ada Vell' },
  { id: 'bram', name: 'Bram Osk' },
  { id: 'cleo', name: 'Cleo Harrow' },
  { id: 'doran', name: 'Doran Pike' },
  { id: 'essa', name: 'Essa Quill' },
  { id: 'fenna', name: 'Fenna Rook' },
  { id: 'gil', name: 'Gil Tarrow' },
  { id: 'hollis', name: 'Hollis Marr' },
  { id: 'ivo', name: 'Ivo Sedge' },
  { id: 'jory', name: 'Jory Lumm' },
];

/** Paragraphs in which two characters are both named (symmetric, zero diagonal). */
const shared: [string, string, number][] = [
  ['ada', 'bram', 42],
  ['ada', 'ivo', 31],
  ['ada', 'fenna', 18],
  ['bram', 'ivo', 12],
  ['bram', 'fenna', 9],
  ['ivo', 'fenna', 7],
  ['cleo', 'essa', 26],
  ['cleo', 'hollis', 14],
  ['essa', 'hollis', 21],
  ['doran', 'gil', 17],
  ['doran', 'jory', 15],
  ['gil', 'jory', 11],
  ['ada', 'cleo', 8],
  ['essa', 'doran', 6],
  ['hollis', 'gil', 4],
  ['bram', 'hollis', 3],
  ['ada', 'doran', 2],
];

const index = new Map(people.map((p, i) => [p.id, i]));
const sharedValues = people.map(() => people.map(() => 0));
for (const [a, b, w] of shared) {
  sharedValues[index.get(a)!][index.get(b)!] = w;
  sharedValues[index.get(b)!][index.get(a)!] = w;
}

export const sharedMatrix: MatrixData = {
  kind: 'matrix',
  title: 'Characters named in the same paragraph',
  rowLabel: 'Character',
  columnLabel: 'Character',
  rows: people,
  columns: people,
  values: sharedValues,
  valueLabel: 'Paragraphs shared',
  format: 'count',
};

/** Uses of seven words in the six chapters. */
export const wordsByChapter: MatrixData = {
  kind: 'matrix',
  title: 'Seven words across the chapters',
  rowLabel: 'Word',
  columnLabel: 'Chapter',
  rows: ['ferry', 'ledger', 'tide', 'eel', 'lock', 'school', 'flood'].map((w) => ({ id: w, name: w })),
  columns: [
    { id: 'ch1', name: 'I. The Ferry' },
    { id: 'ch2', name: 'II. High Water' },
    { id: 'ch3', name: 'III. The Eel Market' },
    { id: 'ch4', name: 'IV. A Ledger Opened' },
    { id: 'ch5', name: 'V. Lock Gates' },
    { id: 'ch6', name: 'VI. Slack Tide' },
  ],
  values: [
    [24, 9, 3, 5, 7, 12],
    [0, 1, 2, 19, 11, 4],
    [6, 14, 2, 3, 8, 17],
    [1, 2, 21, 6, 0, 1],
    [3, 5, 1, 4, 26, 6],
    [8, 2, 0, 1, 1, 3],
    [0, 11, 1, 2, 16, 5],
  ],
  valueLabel: 'Uses',
  format: 'count',
};

export const villageNetwork: NetworkData = {
  kind: 'network',
  title: 'Who appears with whom in The Saltmarsh Ledger',
  nodes: people.map((p) => {
    const community = ['ada', 'bram', 'ivo', 'fenna'].includes(p.id) ? 0 : ['cleo', 'essa', 'hollis'].includes(p.id) ? 1 : 2;
    const size = shared.filter(([a, b]) => a === p.id || b === p.id).reduce((s, [, , w]) => s + w, 0);
    return { ...p, size, community };
  }),
  edges: shared.map(([source, target, weight]) => ({ source, target, weight })),
  sizeLabel: 'Weighted degree',
  weightLabel: 'Paragraphs shared',
};

/** Builds a tree node from a compact form: [word, count, children]. */
type Compact = [string, number, Compact[]?];
function node([word, count, children = []]: Compact): TreeNode {
  return { word, count, children: children.map(node) };
}

/** What follows "the lock" in the novel: 30 words below the root phrase. */
export const lockTree: TreeData = {
  kind: 'tree',
  title: 'What follows “the lock”',
  direction: 'right',
  root: node([
    'the lock',
    48,
    [
      [
        'gates',
        17,
        [
          ['held', 5, [['fast', 3], ['until', 2, [['dawn', 2]]]]],
          ['gave', 4, [['way', 4, [['at', 2], ['in', 2]]]]],
          ['were', 3, [['shut', 2], ['open', 1]]],
        ],
      ],
      [
        'keeper',
        13,
        [
          ['said', 6, [['nothing', 3], ['that', 2]]],
          ['was', 4, [['asleep', 2], ['gone', 2]]],
        ],
      ],
      ['was', 8, [['empty', 3], ['full', 3, [['of', 3, [['eels', 2], ['reeds', 1]]]]]]],
      ['stood', 6, [['open', 4], ['dark', 2]]],
      ['house', 4, [['door', 3]]],
    ],
  ]),
};

/** Words spoken by each character, grouped by where in the village they live. */
export const spokenTreemap: TreemapData = {
  kind: 'treemap',
  title: 'Who speaks most, by part of the village',
  valueLabel: 'Words spoken',
  items: [
    { id: 'ada', label: 'Ada Vell', value: 2310, group: 'Ferry side' },
    { id: 'bram', label: 'Bram Osk', value: 1480, group: 'Ferry side' },
    { id: 'ivo', label: 'Ivo Sedge', value: 640, group: 'Ferry side' },
    { id: 'fenna', label: 'Fenna Rook', value: 415, group: 'Ferry side' },
    { id: 'cleo', label: 'Cleo Harrow', value: 1975, group: 'Village green' },
    { id: 'essa', label: 'Essa Quill', value: 1102, group: 'Village green' },
    { id: 'hollis', label: 'Hollis Marr', value: 730, group: 'Village green' },
    { id: 'doran', label: 'Doran Pike', value: 1240, group: 'Eel market' },
    { id: 'gil', label: 'Gil Tarrow', value: 380, group: 'Eel market' },
    { id: 'jory', label: 'Jory Lumm', value: 95, group: 'Eel market' },
  ],
};
