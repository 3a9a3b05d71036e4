import type { APIRoute, GetStaticPaths } from 'astro';
import { exhibit } from '../../../lib/exhibit.ts';
import { panelCredit, standaloneSvg } from '../../../../pipeline/share/standalone.ts';
import type { PreparedPanel } from '../../../../pipeline/stages/prepared.ts';

// The panel's chart as a file of its own: named typefaces, its size, and the credit line inside.
export const getStaticPaths = (() =>
  exhibit.rooms.flatMap((room) =>
    room.panels.map((panel) => ({ params: { room: room.id, panel: panel.id }, props: { panel } })),
  )) satisfies GetStaticPaths;

export const GET: APIRoute<{ panel: PreparedPanel }> = ({ props }) =>
  new Response(standaloneSvg(props.panel.svg, panelCredit(exhibit, props.panel.room, props.panel.id), exhibit.exhibit.language), {
    headers: { 'Content-Type': 'image/svg+xml; charset=utf-8' },
  });
