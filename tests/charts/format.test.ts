import { describe, expect, it } from 'vitest';
import { decimalsFor, formatNumber, formatPercent, formatValue, joinWords, sentence, upperFirst } from '../../pipeline/charts/format.ts';

describe('formatNumber', () => {
  it('groups thousands with commas and keeps integers whole', () => {
    // common practice, no source: English-language grouping in threes with a comma.
    expect(formatNumber(2310, 0)).toBe('2,310');
    expect(formatNumber(640, 0)).toBe('640');
    expect(formatNumber(1000, 0)).toBe('1,000');
    expect(formatNumber(1234567.891, 2)).toBe('1,234,567.89');
  });
  it('drops trailing zeros unless asked to keep them', () => {
    expect(formatNumber(0.5, 2)).toBe('0.5');
    expect(formatNumber(0.5, 2, true)).toBe('0.50');
    expect(formatNumber(0, 2, true)).toBe('0.00');
  });
  it('writes negatives with a true minus sign', () => {
    // Source: Unicode U+2212 MINUS SIGN; typographic practice for figures (e.g. Bringhurst, Elements of Typographic Style), from memory.
    expect(formatNumber(-0.31, 2)).toBe('\u22120.31');
    expect(formatNumber(-0.001, 2)).toBe('0');
  });
});

describe('formatPercent', () => {
  it('rounds to whole percent from 10% up and keeps a decimal below', () => {
    expect(formatPercent(142 / 459)).toBe('31%');
    expect(formatPercent(0.045)).toBe('4.5%');
    expect(formatPercent(0.1)).toBe('10%');
    expect(formatPercent(0)).toBe('0%');
  });
});

describe('formatValue and decimalsFor', () => {
  it('formats by the dataset format', () => {
    expect(formatValue(2310, 'count')).toBe('2,310');
    expect(formatValue(0.25, 'share')).toBe('25%');
    expect(formatValue(0.4213, 'decimal')).toBe('0.42');
  });
  it('keeps decimals equal across a chart', () => {
    expect(decimalsFor([0.2, 0.42, -0.31])).toBe(2);
    expect(decimalsFor([0.5, 1, 1.5])).toBe(1);
    expect(decimalsFor([1, 2, 30])).toBe(0);
    expect(formatValue(0.2, 'decimal', decimalsFor([0.2, 0.42]))).toBe('0.20');
  });
});

describe('words', () => {
  it('joins lists the English way', () => {
    expect(joinWords(['Ada'])).toBe('Ada');
    expect(joinWords(['Ada', 'Bram'])).toBe('Ada and Bram');
    expect(joinWords(['Ada', 'Bram', 'Cleo'])).toBe('Ada, Bram and Cleo');
  });
  it('capitalises and ends sentences', () => {
    expect(upperFirst('the dataset has no rows.')).toBe('The dataset has no rows.');
    expect(sentence('It rains')).toBe('It rains.');
    expect(sentence('Does it?')).toBe('Does it?');
  });
});
