import type { z } from 'zod';

/** The documented options of a strict zod object: key and description (which states the default). */
export function paramDocs(schema: z.ZodType): { key: string; description: string }[] {
  const shape = (schema as unknown as { shape?: Record<string, z.ZodType> }).shape;
  if (!shape) return [];
  return Object.entries(shape).map(([key, s]) => ({ key, description: s.description ?? '' }));
}
