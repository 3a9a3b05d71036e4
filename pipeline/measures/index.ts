export type { Measure, MeasureContext, MethodCard } from './types.ts';
export { structure } from './structure.ts';
export { frequency } from './frequency.ts';
export { presence } from './presence.ts';
export { measures } from './registry.ts';
