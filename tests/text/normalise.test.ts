import { describe, it, expect } from 'vitest';
import { createHash } from 'node:crypto';
import { fixture, model } from './helpers.ts';
import type { TextModel } from '../../pipeline/text/model.ts';

// Line ends: LF, CRLF and lone CR all end a line. Source: Unicode Standard, §5.8 "Newline Guidelines".
// U+FEFF at the start of a UTF-8 file is a byte order mark, not text. Source: Unicode Standard, §23.8 "Specials".

/** Everything but the offset-mapping functions and the hash. */
function shape(m: TextModel): unknown {
  const { sourceOffset: _s, position: _p, hash: _h, ...rest } = m;
  return rest;
}

describe('BOM and line ends', () => {
  const lf = fixture('chapter-keyword-roman.txt');
  const variants = {
    lf,
    bom: `\uFEFF${lf}`,
    crlf: lf.replace(/\n/g, '\r\n'),
    cr: lf.replace(/\n/g, '\r'),
    'bom+crlf': `\uFEFF${lf.replace(/\n/g, '\r\n')}`,
  };

  it('give identical models', () => {
    const base = shape(model(lf));
    for (const src of Object.values(variants)) expect(shape(model(src))).toEqual(base);
  });

  it.each(Object.entries(variants))('%s: sourceOffset and position point at the same words in the source', (_name, src) => {
    const m = model(src);
    const srcLines = src.replace(/^\uFEFF/, '').split(/\r\n|\r|\n/);
    for (let i = 0; i < m.tokens.count; i += 7) {
      const word = m.text.slice(m.tokens.start[i], m.tokens.end[i]);
      const at = m.sourceOffset(m.tokens.start[i]);
      expect(src.slice(at, at + word.length)).toBe(word);
      const { line, column } = m.position(m.tokens.start[i]);
      expect(srcLines[line - 1].slice(column - 1, column - 1 + word.length)).toBe(word);
    }
    // A line break maps to the first code unit of the break in the source.
    const nl = m.text.indexOf('\n');
    expect('\r\n'.includes(src[m.sourceOffset(nl)])).toBe(true);
    expect(m.sourceOffset(m.text.length)).toBe(src.length);
  });

  it('paragraph lines are source lines', () => {
    const m = model(variants['bom+crlf']);
    const srcLines = variants.lf.split('\n');
    for (let p = 0; p < m.paragraphs.count; p++) {
      const first = m.text.slice(m.paragraphs.start[p]).split('\n')[0];
      expect(srcLines[m.paragraphs.line[p] - 1].trim()).toBe(first.trim());
    }
  });

  it('hashes the source as read: sha256 of its UTF-8 bytes', () => {
    // Source: FIPS 180-2, Appendix B.1 (SHA-256 of "abc").
    expect(model('abc').hash).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    const src = variants['bom+crlf'];
    expect(model(src).hash).toBe(createHash('sha256').update(Buffer.from(src, 'utf8')).digest('hex'));
    expect(model(src).hash).not.toBe(model(lf).hash);
  });
});

describe('trim markers', () => {
  const src = fixture('trim-markers.txt');

  it('keep only the text between the marker lines', () => {
    const m = model(src, { start: '=== begin ===', end: '=== end ===' });
    expect(m.warnings).toEqual([]);
    expect(m.text.trim()).toBe(
      'The footbridge at Lannock has been rebuilt four times, and each time a\nlittle higher.\n\nThe river has never yet failed to reach it.',
    );
    expect(m.paragraphs.count).toBe(2);
    // Offsets still map into the untrimmed source.
    const at = m.sourceOffset(m.tokens.start[0]);
    expect(src.slice(at, at + 'The footbridge'.length)).toBe('The footbridge');
    expect(m.position(m.tokens.start[0])).toEqual({ line: 6, column: 1 });
    expect(m.chapters[0].line).toBe(6);
  });

  it('a missing marker warns and trims nothing on its side', () => {
    const m = model(src, { start: '=== begin ===', end: '=== stop ===' });
    expect(m.warnings.map((w) => w.code)).toEqual(['text/marker-not-found']);
    expect(m.warnings[0].message).toContain('=== stop ===');
    expect(m.text).toMatch(/Thursdays at the schoolroom\.\n$/);
    expect(m.text).not.toContain('Reading Circle');
    const n = model(src, { start: '*** nowhere ***' });
    expect(n.warnings.map((w) => w.code)).toEqual(['text/marker-not-found']);
    expect(n.text).toBe(src);
  });

  it('the end marker is looked for after the start marker', () => {
    const m = model('END\nintro\nSTART\nbody words\nEND\ntail\n', { start: 'START', end: 'END' });
    expect(m.text).toBe('body words');
  });
});

describe('paragraphs', () => {
  it('hard-wrapped lines join into one paragraph; blank lines with spaces separate', () => {
    const m = model('One line\n  wrapped here\nand here.\n \t \nNext   one.\n\n\n\nLast.');
    const spans = Array.from({ length: m.paragraphs.count }, (_, i) => m.text.slice(m.paragraphs.start[i], m.paragraphs.end[i]));
    expect(spans).toEqual(['One line\n  wrapped here\nand here.', 'Next   one.', 'Last.']);
    expect(Array.from(m.paragraphs.line)).toEqual([1, 5, 9]);
    // A sentence runs across the wrapped lines.
    expect(m.sentences.count).toBe(3);
  });

  it('sentences never cross paragraph boundaries', () => {
    const m = model('It was late\n\nand nobody came.');
    expect(m.sentences.count).toBe(2);
    expect(Array.from(m.sentences.paragraph)).toEqual([0, 1]);
  });

  it('columns are sized exactly', () => {
    const m = model(fixture('parts.txt'));
    expect(m.tokens.start.length).toBe(m.tokens.count);
    expect(m.tokens.flags.length).toBe(m.tokens.count);
    expect(m.tokens.start.buffer.byteLength).toBe(4 * m.tokens.count);
    expect(m.sentences.end.length).toBe(m.sentences.count);
    expect(m.paragraphs.chapter.length).toBe(m.paragraphs.count);
  });

  it('an empty text warns', () => {
    const m = model('\n\n');
    expect(m.tokens.count).toBe(0);
    expect(m.warnings.map((w) => w.code)).toEqual(['text/empty']);
  });
});
