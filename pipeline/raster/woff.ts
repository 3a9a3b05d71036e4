/**
 * WOFF 1.0 to the plain OpenType/TrueType file (sfnt) it wraps, following
 * the W3C Recommendation "WOFF File Format 1.0" (2012), sections 3–5: a
 * 44-byte header, a table directory of 20-byte entries, and each table
 * stored zlib-compressed unless compressing did not make it smaller.
 *
 * The project's fonts ship as WOFF and WOFF2 only (the @fontsource packages).
 * The rasteriser (librsvg in sharp, through fontconfig and FreeType) does not
 * open WOFF, so fonts are unwrapped to sfnt files before they are registered.
 * Each table's checksum is recomputed and compared with the one WOFF carries,
 * so a damaged font is refused here instead of drawing wrong glyphs later.
 */
import { inflateSync } from 'node:zlib';

const WOFF_SIGNATURE = 0x774f4646; // 'wOFF'
const HEADER = 44;
const DIR_ENTRY = 20;
const SFNT_HEADER = 12;
const SFNT_RECORD = 16;

/** The OpenType checksum: the sum of the data as big-endian uint32 words, zero-padded, modulo 2³². */
export function tableChecksum(data: Uint8Array): number {
  const padded = data.length % 4 === 0 ? data : Buffer.concat([data, Buffer.alloc(4 - (data.length % 4))]);
  const view = new DataView(padded.buffer, padded.byteOffset, padded.byteLength);
  let sum = 0;
  for (let i = 0; i < padded.byteLength; i += 4) sum = (sum + view.getUint32(i)) >>> 0;
  return sum;
}

/** Unwraps a WOFF 1.0 font; throws a message naming `name` when the data is not one or is damaged. */
export function woffToSfnt(woff: Uint8Array, name = 'the font'): Buffer {
  const src = Buffer.from(woff.buffer, woff.byteOffset, woff.byteLength);
  if (src.length < HEADER || src.readUInt32BE(0) !== WOFF_SIGNATURE) throw new Error(`${name} is not a WOFF 1.0 font`);
  const flavor = src.readUInt32BE(4);
  const numTables = src.readUInt16BE(12);
  if (HEADER + numTables * DIR_ENTRY > src.length) throw new Error(`${name}: the table directory runs past the end of the file`);

  const tables: { tag: number; checksum: number; data: Buffer }[] = [];
  for (let i = 0; i < numTables; i++) {
    const at = HEADER + i * DIR_ENTRY;
    const tag = src.readUInt32BE(at);
    const offset = src.readUInt32BE(at + 4);
    const compLength = src.readUInt32BE(at + 8);
    const origLength = src.readUInt32BE(at + 12);
    const checksum = src.readUInt32BE(at + 16);
    if (offset + compLength > src.length) throw new Error(`${name}: table ${tagName(tag)} runs past the end of the file`);
    const stored = src.subarray(offset, offset + compLength);
    // §5: a table is stored uncompressed exactly when compressing would not shrink it.
    const data = compLength < origLength ? inflateSync(stored) : Buffer.from(stored);
    if (data.length !== origLength) throw new Error(`${name}: table ${tagName(tag)} unpacks to ${data.length} bytes, not ${origLength}`);
    // The head table's checksum is taken with its checksumAdjustment field (bytes 8–11) as zero.
    const sum = tag === HEAD ? tableChecksum(Buffer.concat([data.subarray(0, 8), Buffer.alloc(4), data.subarray(12)])) : tableChecksum(data);
    if (sum !== checksum) throw new Error(`${name}: table ${tagName(tag)} is damaged (checksum ${hex(sum)}, expected ${hex(checksum)})`);
    tables.push({ tag, checksum, data });
  }
  // The sfnt table records are sorted by tag (OpenType spec, "Table Directory").
  tables.sort((a, b) => a.tag - b.tag);

  // searchRange etc. as the OpenType spec defines them from the largest power of two ≤ numTables.
  const entrySelector = Math.floor(Math.log2(Math.max(1, numTables)));
  const searchRange = 2 ** entrySelector * 16;
  let offset = SFNT_HEADER + numTables * SFNT_RECORD;
  const size = tables.reduce((s, t) => s + pad4(t.data.length), offset);
  const out = Buffer.alloc(size);
  out.writeUInt32BE(flavor, 0);
  out.writeUInt16BE(numTables, 4);
  out.writeUInt16BE(searchRange, 6);
  out.writeUInt16BE(entrySelector, 8);
  out.writeUInt16BE(numTables * 16 - searchRange, 10);
  tables.forEach((t, i) => {
    const at = SFNT_HEADER + i * SFNT_RECORD;
    out.writeUInt32BE(t.tag, at);
    out.writeUInt32BE(t.checksum, at + 4);
    out.writeUInt32BE(offset, at + 8);
    out.writeUInt32BE(t.data.length, at + 12);
    t.data.copy(out, offset);
    offset += pad4(t.data.length);
  });
  return out;
}

const HEAD = 0x68656164; // 'head'

function pad4(n: number): number {
  return (n + 3) & ~3;
}

function tagName(tag: number): string {
  return JSON.stringify(String.fromCharCode((tag >>> 24) & 255, (tag >>> 16) & 255, (tag >>> 8) & 255, tag & 255));
}

function hex(n: number): string {
  return `0x${n.toString(16).padStart(8, '0')}`;
}
