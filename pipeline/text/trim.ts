/**
 * Front and back matter trimming by marker lines.
 */

import type { TextWarning } from './model.ts';
import { wording } from '../problems/problem.ts';

export interface TrimResult {
  /** Offset of the first kept character. */
  start: number;
  /** Offset just past the last kept character. */
  end: number;
  warnings: TextWarning[];
}

/**
 * Keep the text after the line containing `startMarker` (that line dropped)
 * and before the first later line containing `endMarker` (that line dropped
 * too). Markers match case-sensitively anywhere in a line. A marker that is
 * given but not found trims nothing on its side and yields a warning.
 */
export function trimByMarkers(
  text: string,
  startMarker: string | undefined,
  endMarker: string | undefined,
  position: (offset: number) => { line: number; column: number },
  /** The text's id, named in warnings. */
  id: string,
): TrimResult {
  const warnings: TextWarning[] = [];
  let start = 0;
  let end = text.length;
  if (startMarker !== undefined && startMarker !== '') {
    const at = text.indexOf(startMarker);
    if (at === -1) {
      warnings.push(wording('text/marker-not-found', { id, marker: startMarker, end: 'start' }));
    } else {
      const nl = text.indexOf('\n', at + startMarker.length);
      start = nl === -1 ? text.length : nl + 1;
    }
  }
  if (endMarker !== undefined && endMarker !== '') {
    const at = text.indexOf(endMarker, start);
    if (at === -1) {
      warnings.push(wording('text/marker-not-found', { id, marker: endMarker, end: 'end', ...(start > 0 ? { after: position(start).line } : {}) }));
    } else {
      const nl = text.lastIndexOf('\n', at - 1);
      end = nl === -1 || nl < start ? start : nl;
    }
  }
  return { start, end, warnings };
}
