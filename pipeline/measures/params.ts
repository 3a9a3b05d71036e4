/**
 * Parameters several measures share. Narrative time: the measures that run
 * along the text count either by chapter or by equal segments of word
 * positions, with the same two parameters and the same bounds; each measure
 * says in its own words what it counts along them.
 */
import { z } from 'zod';

/** How many segments by default, and the bounds (at least two; a thousand is finer than any chart shows). */
export const SEGMENTS = { default: 20, min: 2, max: 1000 } as const;

/** `by` and `segments`, to spread into a measure's parameter object. */
export function narrativeTime(o: { default: 'chapter' | 'segment'; by: string; segments?: string; segmentsDefault?: number }) {
  const count = o.segmentsDefault ?? SEGMENTS.default;
  const order = o.default === 'chapter' ? (['chapter', 'segment'] as const) : (['segment', 'chapter'] as const);
  return {
    by: z.enum(order).default(o.default).describe(`${o.by} Default: "${o.default}".`),
    segments: z
      .number()
      .int()
      .min(SEGMENTS.min)
      .max(SEGMENTS.max)
      .default(count)
      .describe(`${o.segments ?? 'How many equal segments, when `by` is "segment".'} Default: ${count}.`),
  };
}

/** The segments a result runs along (the measure's `segments`): its count when it counts by segment. */
export function segmentsOf(params: { by: 'chapter' | 'segment'; segments: number }): number | undefined {
  return params.by === 'segment' ? params.segments : undefined;
}
