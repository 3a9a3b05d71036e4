import { describe, expect, it } from 'vitest';
import { wellFormednessProblems } from './xml.ts';

// The checker must itself be able to fail, or the escaping tests prove nothing.
// Source: XML 1.0 (5th ed.), W3C 2008, §2.1, §3.1, §4.1.
describe('wellFormednessProblems', () => {
  it('accepts a well-formed document', () => {
    expect(wellFormednessProblems('<svg a="1"><g><text>a &amp; b &#38; &#x26;</text></g><rect/></svg>')).toEqual([]);
  });
  it('rejects crossed, unclosed and stray tags', () => {
    expect(wellFormednessProblems('<a><b></a></b>')).not.toEqual([]);
    expect(wellFormednessProblems('<a><b></b>')).not.toEqual([]);
    expect(wellFormednessProblems('<a></a><b/>')).not.toEqual([]);
    expect(wellFormednessProblems('<a>1 < 2</a>')).not.toEqual([]);
  });
  it('rejects bad attributes', () => {
    expect(wellFormednessProblems('<a x="<"/>')).not.toEqual([]);
    expect(wellFormednessProblems('<a x=1/>')).not.toEqual([]);
    expect(wellFormednessProblems('<a x="1" x="2"/>')).not.toEqual([]);
    expect(wellFormednessProblems('<a x="1"y="2"/>')).not.toEqual([]);
  });
  it('rejects unknown or bare entity references', () => {
    expect(wellFormednessProblems('<a>&nbsp;</a>')).not.toEqual([]);
    expect(wellFormednessProblems('<a>Tom & Jerry</a>')).not.toEqual([]);
    expect(wellFormednessProblems('<a t="&"/>')).not.toEqual([]);
  });
});
