/** What the pages say about their social cards, and the panel downloads' embed snippet. */
import { exhibit } from './exhibit.ts';
import { cardPath } from '../../pipeline/share/addresses.ts';
import { embedSnippet, panelCredit } from '../../pipeline/share/standalone.ts';
import type { PreparedPanel, PreparedRoom } from '../../pipeline/stages/prepared.ts';

/** Cut at a word boundary to at most `max` characters, with an ellipsis when cut. */
export function clip(s: string, max: number): string {
  if (s.length <= max) return s;
  const cut = s.slice(0, max - 1);
  return `${cut.slice(0, Math.max(cut.lastIndexOf(' '), max / 2)).trimEnd()}…`;
}

export function panelCard(panel: PreparedPanel): { path: string; alt: string } {
  const e = exhibit.exhibit;
  return { path: cardPath(panel.room, panel.id), alt: clip(`Card for “${panel.title}”, from ${e.title} by ${e.organiser}, with its chart. ${panel.summary}`, 420) };
}

export function roomCard(room: PreparedRoom, index: number): { path: string; alt: string } {
  const e = exhibit.exhibit;
  const first = room.panels[0];
  const chart = first ? `, beside the chart of “${first.title}”` : '';
  return { path: cardPath(room.id), alt: clip(`Card for room ${index + 1} of ${e.title}, “${room.title}”: the titles of its panels${chart}.`, 420) };
}

export function roomDescription(room: PreparedRoom, index: number): string {
  const e = exhibit.exhibit;
  const n = room.panels.length;
  return clip(`Room ${index + 1} of ${e.title}, by ${e.organiser}: ${n} panel${n === 1 ? '' : 's'}${n ? ` — ${room.panels.map((p) => p.title).join('; ')}` : ''}.`, 300);
}

export function panelEmbed(panel: PreparedPanel): string {
  return embedSnippet({ svg: panel.svg, title: panel.title, credit: panelCredit(exhibit, panel.room, panel.id), language: exhibit.exhibit.language });
}
