import { describe, expect, it } from 'vitest';
import { normaliseSvg } from './snapshot.ts';

describe('normaliseSvg', () => {
  it('renumbers ids everywhere they are referred to', () => {
    const svg = '<svg aria-labelledby="vt-x-1f-title vt-x-1f-desc"><title id="vt-x-1f-title">A</title><desc id="vt-x-1f-desc">B</desc></svg>';
    expect(normaliseSvg(svg)).toBe('<svg aria-labelledby="id-1 id-2">\n<title id="id-1">A</title>\n<desc id="id-2">B</desc>\n</svg>\n');
  });
  it('cleans numbers to three decimals', () => {
    expect(normaliseSvg('<path d="M0.1000001,2.0004L-0.00001,3.5"/>')).toBe('<path d="M0.1,2L0,3.5"/>\n');
  });
  it('makes two renders that differ only in ids and float noise equal', () => {
    const a = '<svg aria-labelledby="a-title"><title id="a-title">T</title><rect x="1.00000001"/></svg>';
    const b = '<svg aria-labelledby="zz-title"><title id="zz-title">T</title><rect x="0.99999999"/></svg>';
    expect(normaliseSvg(a)).toBe(normaliseSvg(b));
  });
});
