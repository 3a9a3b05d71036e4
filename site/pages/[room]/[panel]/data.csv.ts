import type { APIRoute, GetStaticPaths } from 'astro';
import { exhibit } from '../../../lib/exhibit.ts';
import { tableToCsv } from '../../../../pipeline/stages/csv.ts';
import type { PreparedPanel } from '../../../../pipeline/stages/prepared.ts';

export const getStaticPaths = (() =>
  exhibit.rooms.flatMap((room) =>
    room.panels.map((panel) => ({ params: { room: room.id, panel: panel.id }, props: { panel } })),
  )) satisfies GetStaticPaths;

export const GET: APIRoute<{ panel: PreparedPanel }> = ({ props }) =>
  new Response(tableToCsv(props.panel.table), { headers: { 'Content-Type': 'text/csv; charset=utf-8' } });
