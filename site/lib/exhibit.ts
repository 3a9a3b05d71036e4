import exhibit from 'virtual:vitrine/exhibit';
import type { PreparedPanel } from '../../pipeline/stages/prepared.ts';

export { exhibit };

/** Every panel in exhibit order, with its neighbours for previous/next links. */
export function panelsInOrder(): PreparedPanel[] {
  return exhibit.rooms.flatMap((r) => r.panels);
}

export function neighbours(panel: PreparedPanel): { prev: PreparedPanel | null; next: PreparedPanel | null } {
  const all = panelsInOrder();
  const i = all.findIndex((p) => p.room === panel.room && p.id === panel.id);
  return { prev: all[i - 1] ?? null, next: all[i + 1] ?? null };
}
