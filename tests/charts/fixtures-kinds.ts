/**
 * Invented datasets for the concordance, text map, small multiples and
 * scatter charts, in the scenario of fixtures.ts: "The Saltmarsh Ledger", a
 * short novel set in the fenland village of Wending Reach. Every sentence
 * here was written for these tests.
 */

import type { KwicData, LinesData, MultiplesData, PinnedNote, ScatterData, TextmapData } from '../../pipeline/charts/types.ts';

/* ---------- concordance ---------- */

const ledgerLines: [string, string, string, string][] = [
  ['I ¶ 3', 'Ada kept the ferry accounts in a green', 'under the thwart, wrapped in oilcloth against the spray.', 'ledger'],
  ['I ¶ 9', 'Nobody in Wending Reach had ever asked to see the', 'before the night the water rose over the lower fields.', 'ledger'],
  ['II ¶ 2', 'Bram said the lock-keeper’s', 'was older than the lock itself, and twice as crooked.', 'ledger'],
  ['II ¶ 7', 'She turned the pages of the', 'slowly, as if the numbers might wake and bite her.', 'ledger'],
  ['II ¶ 15', 'Cleo copied the tolls from the', 'into her school slate and frowned at the totals.', 'ledger'],
  ['III ¶ 1', 'At the eel market every trader swore by his own', 'and trusted nobody else’s.', 'ledger'],
  ['III ¶ 4', 'Doran Pike slapped a fat', 'on the trestle and dared anyone to find a fault in it.', 'ledger'],
  ['III ¶ 8', 'The clerk had been sent to fetch the parish', 'from the chapel vestry, and came back empty-handed.', 'ledger'],
  ['III ¶ 12', 'Essa ran a finger down the', 'until it stopped at a name she had not expected.', 'ledger'],
  ['III ¶ 20', 'There was no mention in the', 'of the night crossing in March.', 'ledger'],
  ['IV ¶ 2', 'By lamplight the', 'looked like any other book of sums.', 'ledger'],
  ['IV ¶ 5', 'Ada opened the', 'at the page where the ink changed colour.', 'ledger'],
  ['IV ¶ 6', 'Someone had written in the', 'with a different hand, smaller and more careful.', 'Ledger'],
  ['IV ¶ 11', '“Put the', 'down,” said Bram, “and tell me who else has seen it.”', 'ledger'],
  ['IV ¶ 13', 'Cleo held the', 'to the window and saw the pinholes in the margin.', 'ledger'],
  ['IV ¶ 18', 'Every entry in the', 'for that week was made on a Tuesday, though the market was on Friday.', 'ledger'],
  ['IV ¶ 24', 'Doran wanted the', 'burned; Essa wanted it read aloud in the chapel.', 'ledger'],
  ['V ¶ 1', 'The lock gates failed the same night the', 'went missing from the ferry house.', 'ledger'],
  ['V ¶ 4', 'Bram waded out to the sluice with the', 'held above his head like a lantern.', 'ledger'],
  ['V ¶ 9', 'Water had got into the', 'and the last ten pages ran blue.', 'ledger'],
  ['V ¶ 10', 'What was left of the', 'was laid out to dry on the schoolroom stove.', 'ledger'],
  ['V ¶ 16', 'Essa read the', 'aloud, a page at a time, while the village listened.', 'ledger'],
  ['V ¶ 22', 'Nobody asked for the', 'to be put away again.', 'ledger'],
  ['VI ¶ 3', 'In spring the', 'went to the county town in a tin box.', 'ledger'],
  ['VI ¶ 6', 'Ada bought a new', 'and began again on the first page.', 'ledger'],
  ['VI ¶ 8', 'The old', 'was never sent back.', 'ledger'],
  ['VI ¶ 11', 'Cleo taught the children to keep a', 'of their own, one line for every tide.', 'ledger'],
  ['VI ¶ 14', 'And on the last evening Ada closed the', 'and went down to the water.', 'ledger'],
];

export const ledgerKwic: KwicData = {
  kind: 'kwic',
  title: 'Every “ledger” in The Saltmarsh Ledger',
  keyword: 'ledger',
  lines: ledgerLines.map(([where, left, right, keyword]) => ({ where, left, keyword, right })),
};

export const kwicNotes: PinnedNote[] = [
  { label: '1', text: 'The first sign that the ledger was altered', at: { x: 12 } },
  { label: '2', text: 'The flood reaches the ferry house', at: { x: 19 } },
];

/* ---------- text map ---------- */

/** A passage with AFINN-like scores (−5..5) on some words; invented prose. */
const passage: (string | [string, number])[][] = [
  [
    'The morning after the flood, Wending Reach was ', ['quiet', 1], ' in a way it had never been. ',
    'Ada walked the bank and counted what the water had ', ['stolen', -2], ': three boats, the eel-traps, ',
    'the old footbridge, and every ', ['hope', 2], ' Doran had of a ', ['good', 3], ' season. ',
    'Mud lay over the lower fields like a ', ['grief', -2], ' nobody would name.',
  ],
  [
    'At the lock, Bram sat on the beam with his head in his hands. He was not ', ['hurt', -2], ', he said, only ',
    ['tired', -2], ', and ', ['ashamed', -2], ' of the gates. Cleo brought him tea and a ', ['warm', 1], ' loaf, ',
    'and for a while they said nothing at all.',
  ],
  [
    'Then Essa came running from the schoolroom, ', ['laughing', 1], ' and crying at once. The ledger had ',
    ['survived', 2], '. It was ', ['ruined', -2], ' at the edges and blue with ink, but the pages that mattered ',
    'could still be read, and she was ', ['glad', 3], ', so ', ['glad', 3], ', that she could not stand still. ',
    'The village gathered to hear it, ', ['afraid', -2], ' of what it would say and ', ['eager', 2], ' all the same. ',
    'Nobody was ', ['killed', -3], ' in the flood; the ', ['worst', -3], ' of it was the waiting.',
  ],
];

function buildTextmap(): TextmapData {
  const spans: TextmapData['spans'] = [];
  const breaks: number[] = [];
  passage.forEach((para, p) => {
    if (p > 0) breaks.push(spans.length);
    for (const part of para) spans.push(typeof part === 'string' ? { text: part, value: null } : { text: part[0], value: part[1] });
  });
  return { kind: 'textmap', title: 'Feeling in the morning after the flood', valueLabel: 'Valence (AFINN-165)', domain: [-5, 5], spans, breaks };
}

export const floodTextmap: TextmapData = buildTextmap();

/* ---------- small multiples ---------- */

const chapters = ['I', 'II', 'III', 'IV', 'V', 'VI'];
const chapterTitles = ['The Ferry', 'High Water', 'The Eel Market', 'A Ledger Opened', 'Lock Gates', 'Slack Tide'];
const cast = [
  { id: 'ada', name: 'Ada Vell' },
  { id: 'bram', name: 'Bram Osk' },
  { id: 'cleo', name: 'Cleo Harrow' },
  { id: 'doran', name: 'Doran Pike' },
  { id: 'essa', name: 'Essa Quill' },
];
/** Mentions per chapter (rows) and character (columns). */
const mentions = [
  [30, 2, 10, 4, 1],
  [22, 1, 25, 9, 3],
  [18, 0, 14, 31, 12],
  [26, 3, 12, 15, 28],
  [34, 4, 16, 6, 19],
  [12, 2, 10, 2, 8],
];

export const chaptersMultiples: MultiplesData = {
  kind: 'multiples',
  title: 'Who is mentioned in each chapter',
  panels: chapters.map((c, i) => ({
    id: `chapter-${i + 1}`,
    title: `${c}. ${chapterTitles[i]}`,
    data: {
      kind: 'bars',
      title: `Mentions in chapter ${c}`,
      categoryLabel: 'Character',
      valueLabel: 'Mentions',
      categories: cast.map((p) => p.name),
      series: [{ id: 'mentions', name: 'Mentions', values: mentions[i] }],
      format: 'count',
    },
  })),
};

/** Each character's mentions across ten equal segments, one panel per character. */
const arcs: Record<string, number[]> = {
  ada: [9, 7, 6, 5, 4, 6, 8, 9, 11, 6],
  bram: [0, 1, 1, 0, 2, 1, 3, 6, 4, 1],
  cleo: [2, 5, 8, 6, 4, 5, 3, 4, 5, 3],
  doran: [1, 0, 3, 9, 12, 7, 4, 2, 1, 1],
  essa: [0, 0, 1, 2, 4, 8, 10, 7, 6, 4],
};

export const characterMultiples: MultiplesData = {
  kind: 'multiples',
  title: 'Each character across the novel',
  panels: cast.map((p) => {
    const data: LinesData = {
      kind: 'lines',
      title: p.name,
      xLabel: 'Segment',
      yLabel: 'Mentions per segment',
      points: arcs[p.id].map((_, i) => `Segment ${i + 1} (words ${i * 950 + 1}–${(i + 1) * 950})`),
      ticks: arcs[p.id].map((_, i) => String(i + 1)),
      series: [{ id: 'mentions', name: 'Mentions', values: arcs[p.id] }],
      format: 'count',
    };
    return { id: p.id, title: p.name, data };
  }),
};

/* ---------- scatter ---------- */

export const voicesScatter: ScatterData = {
  kind: 'scatter',
  title: 'How much each character is named and how much they speak',
  xLabel: 'Mentions',
  yLabel: 'Share of dialogue',
  points: [
    { id: 'ada', label: 'Ada Vell', x: 142, y: 0.31, group: 'Ferry house' },
    { id: 'bram', label: 'Bram Osk', x: 12, y: 0.04, group: 'Lock' },
    { id: 'cleo', label: 'Cleo Harrow', x: 87, y: 0.22, group: 'School' },
    { id: 'doran', label: 'Doran Pike', x: 95, y: 0.12, group: 'Market' },
    { id: 'essa', label: 'Essa Quill', x: 123, y: 0.18, group: 'School' },
    { id: 'hob', label: 'Hob Sallow', x: 21, y: 0.05, group: 'Market' },
    { id: 'mab', label: 'Mab Sallow', x: 24, y: 0.06, group: 'Market' },
    { id: 'tilly', label: 'Tilly Marsh', x: 9, y: 0.01, group: 'Ferry house' },
    { id: 'parson', label: 'The parson', x: 33, y: 0.07, group: 'Chapel' },
    { id: 'quayle', label: 'Mrs Quayle', x: 18, y: 0.02, group: 'Chapel' },
    { id: 'wick', label: 'Old Wick', x: 41, y: 0.09, group: 'Lock' },
    { id: 'fen', label: 'Fen Dory', x: 27, y: 0.08, group: 'Ferry house' },
  ],
};

export const scatterNotes: PinnedNote[] = [
  { label: '1', text: 'Bram keeps the lock but hardly speaks', at: { category: 'bram' } },
  { label: '2', text: 'Essa reads the ledger aloud in chapter five', at: { category: 'Essa Quill' } },
];
