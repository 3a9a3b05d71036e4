import { describe, it, expect } from 'vitest';
import { AFINN_CREDIT, afinnLexicon } from '../../pipeline/lexicons/afinn.ts';

describe('AFINN-165 as loaded', () => {
  const lex = afinnLexicon();

  it('holds the published valences', () => {
    expect(lex.words.get('abandon')).toBe(-2); // Source: AFINN-165, Nielsen 2011 ("abandon" −2)
    expect(lex.words.get('good')).toBe(3); // Source: AFINN-165, Nielsen 2011 ("good" 3)
    expect(lex.words.get('outstanding')).toBe(5); // Source: AFINN-165, Nielsen 2011 ("outstanding" 5)
    expect(lex.words.get('hate')).toBe(-3); // Source: AFINN-165, Nielsen 2011 ("hate" −3)
    expect(lex.words.get('calm')).toBe(2); // Source: AFINN-165, Nielsen 2011 ("calm" 2)
    expect(lex.words.get('well-being')).toBe(2); // Source: AFINN-165, Nielsen 2011 (hyphenated entry "well-being" 2)
  });

  it('keeps the multi-word entries as phrases', () => {
    const phrase = (w: string): number | undefined => lex.phrases.find((p) => p.words.join(' ') === w)?.value;
    expect(phrase('does not work')).toBe(-3); // Source: AFINN-165, Nielsen 2011 ("does not work" −3)
    expect(phrase('not good')).toBe(-2); // Source: AFINN-165, Nielsen 2011 ("not good" −2)
    expect(phrase("can't stand")).toBe(-3); // Source: AFINN-165, Nielsen 2011 ("can't stand" −3)
    expect(lex.words.has('does not work')).toBe(false);
  });

  it('has 3,382 entries rated from −5 to +5', () => {
    // Source: AFINN-165, Nielsen 2011 — 3,382 entries, integer valence −5…+5.
    expect(lex.words.size + lex.phrases.length).toBe(3382);
    const values = [...lex.words.values(), ...lex.phrases.map((p) => p.value)];
    expect(Math.min(...values)).toBe(-5);
    expect(Math.max(...values)).toBe(5);
  });

  it('credits the list and its licence', () => {
    // Source: AFINN is distributed under the Open Database License (ODbL) v1.0, which asks for attribution.
    expect(AFINN_CREDIT).toMatch(/AFINN-165/);
    expect(AFINN_CREDIT).toMatch(/Nielsen/);
    expect(AFINN_CREDIT).toMatch(/Open Database License \(ODbL\) v1\.0/);
  });
});
