/**
 * Small invented datasets for chart tests. The scenario is our own: "The
 * Saltmarsh Ledger", a short novel set in the fenland village of Wending
 * Reach, with its ferrywoman Ada Vell, the lock-keeper Bram Osk, the
 * schoolteacher Cleo Harrow, the eel-trader Doran Pike and the clerk Essa Quill.
 */

import type { BarsData, LinesData, PinnedNote, StripData } from '../../pipeline/charts/types.ts';

export const mentionsBars: BarsData = {
  kind: 'bars',
  title: 'Who is mentioned in The Saltmarsh Ledger',
  categoryLabel: 'Character',
  valueLabel: 'Mentions',
  categories: ['Ada Vell', 'Bram Osk', 'Cleo Harrow', 'Doran Pike', 'Essa Quill'],
  series: [{ id: 'mentions', name: 'Mentions', values: [142, 12, 87, 95, 123] }],
  format: 'count',
};

export const chapterWordsBars: BarsData = {
  kind: 'bars',
  title: 'Words per chapter',
  categoryLabel: 'Chapter',
  valueLabel: 'Words',
  categories: ['I. The Ferry', 'II. High Water', 'III. The Eel Market', 'IV. A Ledger Opened', 'V. Lock Gates'],
  series: [{ id: 'words', name: 'Words', values: [640, 1480, 1975, 2310, 1102] }],
  format: 'count',
};

export const mentionsByPartBars: BarsData = {
  kind: 'bars',
  title: 'Mentions by part of the novel',
  categoryLabel: 'Character',
  valueLabel: 'Mentions',
  categories: ['Ada Vell', 'Bram Osk', 'Cleo Harrow', 'Doran Pike'],
  series: [
    { id: 'part-1', name: 'Part One', values: [60, 5, 40, 22] },
    { id: 'part-2', name: 'Part Two', values: [82, 7, 47, 73] },
  ],
  format: 'count',
};

export const arcLines: LinesData = {
  kind: 'lines',
  title: 'Mentions across the chapters',
  xLabel: 'Chapter',
  yLabel: 'Mentions',
  points: ['Chapter 1: The Ferry', 'Chapter 2: High Water', 'Chapter 3: The Eel Market', 'Chapter 4: A Ledger Opened', 'Chapter 5: Lock Gates', 'Chapter 6: Slack Tide'],
  ticks: ['I', 'II', 'III', 'IV', 'V', 'VI'],
  series: [
    { id: 'ada', name: 'Ada Vell', values: [30, 22, 18, 26, 34, 12] },
    { id: 'bram', name: 'Bram Osk', values: [2, 1, 0, 3, 4, 2] },
    { id: 'cleo', name: 'Cleo Harrow', values: [10, 25, 14, 12, 16, 10] },
  ],
  format: 'count',
};

export const presenceStrip: StripData = {
  kind: 'strip',
  title: 'Where each character appears',
  rows: [
    { id: 'ada', name: 'Ada Vell', positions: [0.01, 0.04, 0.05, 0.12, 0.2, 0.33, 0.34, 0.5, 0.61, 0.77, 0.9, 0.98] },
    { id: 'bram', name: 'Bram Osk', positions: [0.61, 0.7, 0.95] },
    { id: 'cleo', name: 'Cleo Harrow', positions: [0.15, 0.16, 0.4, 0.42, 0.44, 0.8] },
  ],
  boundaries: [
    { at: 0, label: 'I', title: 'Chapter 1: The Ferry' },
    { at: 0.18, label: 'II', title: 'Chapter 2: High Water' },
    { at: 0.41, label: 'III', title: 'Chapter 3: The Eel Market' },
    { at: 0.66, label: 'IV', title: 'Chapter 4: A Ledger Opened' },
    { at: 0.85, label: 'V', title: 'Chapter 5: Lock Gates' },
  ],
  totalTokens: 9507,
};

export const notes: PinnedNote[] = [
  { label: '1', text: 'Ada takes the night ferry alone', at: { category: 'Ada Vell', x: 4, series: 'ada' } },
  { label: '2', text: 'The lock gates fail & the lower fields flood', at: { x: 2 } },
];

export const stripNotes: PinnedNote[] = [
  { label: '1', text: 'Bram first speaks at the lock', at: { category: 'bram', x: 0.61 } },
  { label: '2', text: 'The flood begins', at: { x: 0.66 } },
  { label: '3', text: 'Cleo leaves the village', at: { category: 'cleo' } },
];
