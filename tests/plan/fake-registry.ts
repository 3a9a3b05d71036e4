/**
 * A small registry standing in for the real measures and charts: three
 * measures and three charts, with params/options schemas of each kind the
 * loader must handle (strict objects, a plain object that would drop unknown
 * keys, defaults).
 */
import { z } from 'zod';
import type { Registry } from '../../pipeline/plan/registry.ts';

export const fakeRegistry: Registry = {
  measures: {
    structure: {
      params: z.strictObject({
        unit: z.enum(['words', 'sentences']).default('words').describe('What a chapter is measured in. Default "words".'),
      }),
      needsCast: false,
      charts: ['bars', 'lines'],
    },
    frequency: {
      // A plain (non-strict) object: the loader must still refuse unknown keys.
      params: z.object({
        terms: z.array(z.string()).default([]).describe('Words to count. Default [].'),
        top: z.number().int().positive().default(10).describe('How many of the most frequent words to show. Default 10.'),
      }),
      needsCast: false,
      charts: ['bars', 'lines', 'strip'],
    },
    presence: {
      params: z.strictObject({
        segments: z.number().int().positive().default(20).describe('Equal segments the text is cut into. Default 20.'),
      }),
      needsCast: true,
      charts: ['lines', 'strip'],
    },
  },
  charts: {
    bars: {
      options: z.strictObject({
        orientation: z.enum(['horizontal', 'vertical']).default('horizontal').describe('Direction of the bars. Default "horizontal".'),
        sorted: z.boolean().default(false).describe('Sort bars by value. Default false.'),
      }),
    },
    lines: {
      options: z.strictObject({
        markers: z.boolean().default(true).describe('Draw a dot at each point. Default true.'),
      }),
    },
    strip: {
      options: z.strictObject({
        height: z.number().positive().default(12).describe('Height of each row in pixels. Default 12.'),
      }),
    },
  },
};
