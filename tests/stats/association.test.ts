import { describe, it, expect } from 'vitest';
import { diceCoefficient } from 'dice-coefficient';
import { logDice } from '../../pipeline/stats/logdice.ts';
import { pmi } from '../../pipeline/stats/pmi.ts';
import { tScore } from '../../pipeline/stats/tscore.ts';

describe('logDice', () => {
  it('regression values for four triples (f(xy), f(x), f(y))', () => {
    // Regression values, recomputed from Rychlý 2008's definition 14 + log₂(2 f(xy) / (f(x) + f(y))); not printed figures.
    expect(logDice(8, 389, 230)).toBeCloseTo(8.726204, 6);
    expect(logDice(3, 3000, 3000)).toBeCloseTo(4.034216, 6);
    expect(logDice(300, 3000, 3000)).toBeCloseTo(10.67807, 5);
  });

  it('tops out at 14 when x and y always occur together', () => {
    // Source: Rychlý 2008 (RASLAN), where the theoretical maximum of 14 is stated for this case.
    expect(logDice(300, 300, 300)).toBe(14);
    expect(logDice(1, 1, 1)).toBe(14);
  });

  it('is 14 plus log₂ of the Sørensen–Dice coefficient of the npm package dice-coefficient', () => {
    // Source: dice-coefficient 2 (npm), run here as the reference: given two lists of items it returns
    // 2·|shared| / (|X| + |Y|). X holds f(x) items, Y holds f(y) items, f(xy) of them shared.
    const cases: [number, number, number][] = [
      [8, 389, 230],
      [3, 300, 300],
      [20, 20, 500],
      [1, 1, 1],
    ];
    for (const [fxy, fx, fy] of cases) {
      const x = Array.from({ length: fx }, (_, i) => `s${i}`);
      const y = Array.from({ length: fy }, (_, i) => (i < fxy ? `s${i}` : `y${i}`));
      expect(logDice(fxy, fx, fy)).toBeCloseTo(14 + Math.log2(diceCoefficient(x, y)), 12);
    }
  });

  it('has no value without a co-occurrence', () => {
    expect(logDice(0, 10, 10)).toBeNull();
  });
});

describe('PMI and t-score', () => {
  // Source: Manning & Schütze 1999, Foundations of Statistical Natural Language Processing, ch. 5, on a corpus of
  // N = 14,307,668 bigrams of New York Times newswire: the worked t test of "new companies" (§5.3.1) and Table 5.16
  // (pointwise mutual information of ten bigrams seen 20 times each). Figures as printed there, to the decimals
  // printed; transcribed for this test without the book at hand (recheck against a copy).
  const N = 14_307_668;
  /** [w1, w2, C(w1), C(w2), I(w1, w2)] from Table 5.16; C(w1 w2) = 20. */
  const TABLE: [string, string, number, number, number][] = [
    ['Ayatollah', 'Ruhollah', 42, 20, 18.38],
    ['Bette', 'Midler', 41, 27, 17.98],
    ['Agatha', 'Christie', 30, 117, 16.31],
    ['videocassette', 'recorder', 77, 59, 15.94],
    ['unsalted', 'butter', 24, 320, 15.19],
    ['first', 'made', 14907, 9017, 1.09],
    ['over', 'many', 13484, 10570, 1.01],
    ['into', 'them', 14734, 13478, 0.53],
    ['like', 'people', 14093, 14776, 0.46],
    ['time', 'last', 15019, 15629, 0.29],
  ];

  it('gives the t of "new companies": 8 together, new 15,828, companies 4,675 → 0.999932', () => {
    expect(tScore(8, 15_828, 4_675, N)).toBeCloseTo(0.999932, 6);
  });

  it.each(TABLE)('%s %s: PMI as printed in Table 5.16', (_w1, _w2, c1, c2, i) => {
    expect(pmi(20, c1, c2, N)).toBeCloseTo(i, 2);
  });

  it('is 0 at chance level (PMI) and 0 when O equals E (t-score)', () => {
    // O = E = f(x) f(y) / N (common practice, no source).
    expect(pmi(10, 100, 1000, 10_000)).toBeCloseTo(0, 12);
    expect(tScore(10, 100, 1000, 10_000)).toBeCloseTo(0, 12);
  });

  it('has no value without a co-occurrence', () => {
    expect(pmi(0, 10, 10, 100)).toBeNull();
    expect(tScore(0, 10, 10, 100)).toBeNull();
  });
});
