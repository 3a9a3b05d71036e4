import type { Registry } from '../plan/registry.ts';
import { measures } from '../measures/registry.ts';
import { charts } from '../charts/index.ts';

/** The plan's view of what measures and charts exist, built from the real ones. */
export function planRegistry(): Registry {
  return {
    measures: Object.fromEntries(
      Object.values(measures).map((m) => [m.name, { params: m.params, needsCast: m.needsCast, charts: Object.keys(m.views) }]),
    ),
    charts: Object.fromEntries(Object.values(charts).map((c) => [c.name, { options: c.options }])),
  };
}
