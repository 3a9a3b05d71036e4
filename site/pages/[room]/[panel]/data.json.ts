import type { APIRoute, GetStaticPaths } from 'astro';
import { exhibit } from '../../../lib/exhibit.ts';
import type { PreparedPanel } from '../../../../pipeline/stages/prepared.ts';

export const getStaticPaths = (() =>
  exhibit.rooms.flatMap((room) =>
    room.panels.map((panel) => ({ params: { room: room.id, panel: panel.id }, props: { panel } })),
  )) satisfies GetStaticPaths;

export const GET: APIRoute<{ panel: PreparedPanel }> = ({ props }) => {
  const { panel } = props;
  const body = {
    exhibit: exhibit.exhibit.title,
    panel: panel.id,
    title: panel.title,
    text: panel.text,
    measure: panel.measure,
    params: panel.params,
    citation: panel.citation,
    result: panel.data,
  };
  return new Response(JSON.stringify(body, null, 2) + '\n', { headers: { 'Content-Type': 'application/json' } });
};
