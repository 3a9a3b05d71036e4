/**
 * Line-ending normalisation with a way back: the BOM is dropped and CRLF/CR
 * become LF, while enough is kept to map any offset in the normalised text to
 * the offset in the source string and to a 1-based line and column.
 */

export interface Normalised {
  /** The normalised text: no BOM, LF line ends only. */
  text: string;
  /** Offset in the source of any offset in `text`. A line break maps to its first code unit (the CR of a CRLF). */
  sourceOffset(offset: number): number;
  /** 1-based line and column (UTF-16 code units; the BOM is not counted) of an offset in `text`. */
  position(offset: number): { line: number; column: number };
}

/** Number of entries of the sorted array `a` (first `n`) that are < x. */
function countBelow(a: Uint32Array, n: number, x: number): number {
  let lo = 0;
  let hi = n;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (a[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

function lineStartsOf(text: string): Uint32Array {
  let count = 1;
  for (let i = text.indexOf('\n'); i !== -1; i = text.indexOf('\n', i + 1)) count++;
  const starts = new Uint32Array(count);
  let k = 1;
  for (let i = text.indexOf('\n'); i !== -1; i = text.indexOf('\n', i + 1)) starts[k++] = i + 1;
  return starts;
}

export function normalise(source: string): Normalised {
  const bom = source.charCodeAt(0) === 0xfeff ? 1 : 0;
  const body = bom ? source.slice(1) : source;
  let text = body;
  // Positions in `text` of the LFs that stood for a CRLF (one code unit removed before each).
  let removed = new Uint32Array(0);
  let removedCount = 0;
  if (body.includes('\r')) {
    const pieces: string[] = [];
    let crlf: number[] = [];
    let from = 0;
    let outLen = 0;
    for (let i = body.indexOf('\r'); i !== -1; i = body.indexOf('\r', i + 1)) {
      pieces.push(body.slice(from, i));
      outLen += i - from;
      pieces.push('\n');
      if (body.charCodeAt(i + 1) === 10) {
        crlf.push(outLen);
        i++;
      }
      outLen += 1;
      from = i + 1;
    }
    pieces.push(body.slice(from));
    text = pieces.join('');
    removed = Uint32Array.from(crlf);
    removedCount = removed.length;
    crlf = [];
  }
  const lineStarts = lineStartsOf(text);
  return {
    text,
    sourceOffset(offset: number): number {
      return offset + bom + countBelow(removed, removedCount, offset);
    },
    position(offset: number): { line: number; column: number } {
      const line = countBelow(lineStarts, lineStarts.length, offset + 1); // number of starts <= offset
      return { line, column: offset - lineStarts[line - 1] + 1 };
    },
  };
}
