import type { MeasureContext } from '../measures/types.ts';
import { analyseDialogue } from './attribute.ts';

/**
 * Per token: the cast index of the speaker of the quotation it stands in, or
 * -1 (narrative, written words, a speaker unknown or outside the cast).
 * Quotations and speakers as found by the dialogue analysis.
 */
export function speakerOfTokens({ model, cast, mentions, dialogue }: MeasureContext): Int32Array {
  const { tokens } = model;
  const out = new Int32Array(tokens.count).fill(-1);
  if (!cast.length) return out;
  const index = new Map(cast.map((c, i) => [c.id, i]));
  for (const q of analyseDialogue({ model, cast, mentions, dialogue }).quotes) {
    if (q.kind !== 'speech' || q.speaker === null) continue;
    const m = index.get(q.speaker)!;
    let lo = 0;
    let hi = tokens.count;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (tokens.start[mid]! < q.start) lo = mid + 1;
      else hi = mid;
    }
    for (let i = lo; i < tokens.count && tokens.start[i]! < q.end; i++) out[i] = m;
  }
  return out;
}
