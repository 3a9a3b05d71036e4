import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { expectSvgSnapshot, inCi, normaliseSvg } from './snapshot.ts';

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

describe('expectSvgSnapshot', () => {
  const svg = '<svg><rect x="1"/></svg>';
  let dir = '';
  const fresh = () => (dir = mkdtempSync(join(tmpdir(), 'vt-snap-')));
  afterEach(() => {
    vi.unstubAllEnvs();
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  it('reads CI as CI services set it (common practice, no source)', () => {
    expect(inCi({})).toBe(false);
    expect(inCi({ CI: '' })).toBe(false);
    expect(inCi({ CI: 'false' })).toBe(false);
    expect(inCi({ CI: '0' })).toBe(false);
    expect(inCi({ CI: 'true' })).toBe(true);
    expect(inCi({ CI: '1' })).toBe(true);
  });

  it('writes a missing snapshot outside CI', () => {
    vi.stubEnv('CI', '');
    fresh();
    expectSvgSnapshot('new', svg, dir);
    expect(readFileSync(join(dir, 'new.svg'), 'utf8')).toBe(normaliseSvg(svg));
  });

  it('fails on a missing snapshot in CI, and writes nothing', () => {
    vi.stubEnv('CI', 'true');
    fresh();
    expect(() => expectSvgSnapshot('gone', svg, dir)).toThrow(/missing/);
    expect(existsSync(join(dir, 'gone.svg'))).toBe(false);
  });

  it('fails on a changed drawing anywhere, leaving the new one beside the old', () => {
    vi.stubEnv('CI', 'true');
    fresh();
    writeFileSync(join(dir, 'old.svg'), normaliseSvg('<svg><rect x="2"/></svg>'));
    expect(() => expectSvgSnapshot('old', svg, dir)).toThrow(/differs/);
    expect(readFileSync(join(dir, 'old-changed.svg'), 'utf8')).toBe(normaliseSvg(svg));
    expectSvgSnapshot('old', '<svg><rect x="2"/></svg>', dir);
    expect(existsSync(join(dir, 'old-changed.svg'))).toBe(false);
  });
});
