// WOFF 1.0 unwrapping, checked against fontkit (a general-purpose font engine from npm) reading
// the same font from the WOFF file itself: both must give the same font, glyph for glyph.
// Table directory fields: OpenType specification, "Table Directory" (searchRange, entrySelector, rangeShift).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import * as fontkit from 'fontkit';
import { tableChecksum, woffToSfnt } from '../../pipeline/raster/woff.ts';
import { fontFiles } from '../../pipeline/raster/fonts.ts';

const files = fontFiles();
const sample = 'Hamburgefonstiv 1,765 — “Tamsin’s lamp”';

function open(data: Buffer): fontkit.Font {
  const f = fontkit.create(data);
  if ('fonts' in f) throw new Error('a collection, not a font');
  return f as fontkit.Font;
}

describe('woffToSfnt', () => {
  it.each(files.filter((f) => f.subset === 'latin').map((f) => [f.path.split('/').pop()!, f.path]))(
    '%s unwraps to the font fontkit reads from the WOFF',
    (_name, path) => {
      const woff = readFileSync(path);
      const sfnt = woffToSfnt(woff, path);
      const a = open(woff);
      const b = open(sfnt);
      expect(b.familyName).toBe(a.familyName);
      expect(b.subfamilyName).toBe(a.subfamilyName);
      expect(b.numGlyphs).toBe(a.numGlyphs);
      expect(b.unitsPerEm).toBe(a.unitsPerEm);
      const la = a.layout(sample);
      const lb = b.layout(sample);
      expect(lb.glyphs.map((g) => g.id)).toEqual(la.glyphs.map((g) => g.id));
      expect(lb.advanceWidth).toBe(la.advanceWidth);
      expect(lb.glyphs[0]!.path.toSVG()).toBe(la.glyphs[0]!.path.toSVG());
    },
  );

  it('writes the table directory as the OpenType spec defines it', () => {
    const sfnt = woffToSfnt(readFileSync(files[0]!.path));
    const n = sfnt.readUInt16BE(4);
    const entrySelector = Math.floor(Math.log2(n));
    expect(sfnt.readUInt16BE(6)).toBe(2 ** entrySelector * 16);
    expect(sfnt.readUInt16BE(8)).toBe(entrySelector);
    expect(sfnt.readUInt16BE(10)).toBe(n * 16 - 2 ** entrySelector * 16);
    const tags = Array.from({ length: n }, (_, i) => sfnt.readUInt32BE(12 + i * 16));
    expect(tags).toEqual([...tags].sort((x, y) => x - y));
    // Every table starts on a 4-byte boundary.
    for (let i = 0; i < n; i++) expect(sfnt.readUInt32BE(12 + i * 16 + 8) % 4).toBe(0);
  });

  it('refuses a file that is not WOFF, and a damaged table, naming the file', () => {
    expect(() => woffToSfnt(Buffer.from('not a font at all, just some text here', 'utf8'), 'notes.woff')).toThrow(/notes\.woff is not a WOFF 1\.0 font/);
    const woff = Buffer.from(readFileSync(files[0]!.path));
    // Flip a byte inside the first table's stored data (its offset is in the first directory entry).
    const offset = woff.readUInt32BE(44 + 4);
    const stored = woff.readUInt32BE(44 + 8);
    const original = woff.readUInt32BE(44 + 12);
    if (stored === original) woff[offset + 5] ^= 0xff;
    else woff.writeUInt32BE(woff.readUInt32BE(44 + 16) ^ 1, 44 + 16);
    expect(() => woffToSfnt(woff, 'face.woff')).toThrow(/face\.woff: table "[A-Za-z0-9/ ]{4}" is damaged/);
  });

  it('sums big-endian 32-bit words, zero-padded, modulo 2^32 (OpenType spec, "Calculating Checksums")', () => {
    expect(tableChecksum(Buffer.from([0, 0, 0, 1, 0, 0, 0, 2]))).toBe(3);
    expect(tableChecksum(Buffer.from([1]))).toBe(0x01000000);
    expect(tableChecksum(Buffer.from([0xff, 0xff, 0xff, 0xff, 0, 0, 0, 2]))).toBe(1);
  });
});
