/**
 * A deterministic force-directed layout (d3-force) inside a box.
 *
 * Nodes start on d3-force's phyllotaxis spiral in the order given and every
 * random nudge comes from a linear congruential generator with a fixed
 * seed (the constants of Numerical Recipes, which d3-force itself uses), so
 * the same input always gives the same positions. The simulation runs a
 * fixed number of ticks: links pull (heavier links shorter), nodes repel
 * and never overlap, weak pulls towards the centre flatten the layout to
 * the box's proportions, and every tick keeps the nodes inside the box.
 * The settled layout is then enlarged (never shrunk) to fill the box.
 */

import { forceCollide, forceLink, forceManyBody, forceSimulation, forceX, forceY } from 'd3-force';
import type { SimulationLinkDatum, SimulationNodeDatum } from 'd3-force';

export interface LayoutNode {
  id: string;
  /** Distance from the centre to the node's farthest edge. */
  r: number;
}

export interface LayoutLink {
  source: string;
  target: string;
  weight: number;
}

export interface Placed {
  id: string;
  x: number;
  y: number;
}

export interface LayoutBox {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** A seeded uniform generator on [0, 1): s ← (1664525 s + 1013904223) mod 2³². */
export function lcg(seed = 0x2f6b): () => number {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(1664525, s) + 1013904223) >>> 0;
    return s / 4294967296;
  };
}

interface SimNode extends SimulationNodeDatum {
  id: string;
  r: number;
}

/** Most a settled layout is enlarged to fill its box (a small network stays compact). */
const MAX_SCALE = 2.5;

/**
 * Scales the layout about its centre, the same in both directions, so that
 * the nodes (with their radii) fill the box as far as MAX_SCALE allows, and
 * centres it. Scaling up only spreads nodes apart, so none come to overlap.
 */
function fit(sim: SimNode[], box: LayoutBox): void {
  const x0 = Math.min(...sim.map((n) => n.x! - n.r));
  const x1 = Math.max(...sim.map((n) => n.x! + n.r));
  const y0 = Math.min(...sim.map((n) => n.y! - n.r));
  const y1 = Math.max(...sim.map((n) => n.y! + n.r));
  const maxR = Math.max(...sim.map((n) => n.r));
  const spanX = x1 - x0 - 2 * maxR;
  const spanY = y1 - y0 - 2 * maxR;
  const sx = spanX > 0 ? (box.width - 2 * maxR) / spanX : MAX_SCALE;
  const sy = spanY > 0 ? (box.height - 2 * maxR) / spanY : MAX_SCALE;
  const scale = Math.max(1, Math.min(MAX_SCALE, sx, sy));
  const mx = (x0 + x1) / 2;
  const my = (y0 + y1) / 2;
  const cx = box.x + box.width / 2;
  const cy = box.y + box.height / 2;
  for (const n of sim) {
    n.x = Math.min(box.x + box.width - n.r, Math.max(box.x + n.r, cx + (n.x! - mx) * scale));
    n.y = Math.min(box.y + box.height - n.r, Math.max(box.y + n.r, cy + (n.y! - my) * scale));
  }
}

/**
 * Positions for `nodes` inside `box` after `ticks` ticks. `spacing` is the
 * length of the lightest link; the heaviest is drawn at 55% of it.
 */
export function forceLayout(nodes: readonly LayoutNode[], links: readonly LayoutLink[], box: LayoutBox, ticks: number, spacing: number): Placed[] {
  const sim: SimNode[] = nodes.map((n) => ({ id: n.id, r: n.r }));
  const maxW = Math.max(1e-9, ...links.map((l) => l.weight));
  const simLinks: (SimulationLinkDatum<SimNode> & { weight: number })[] = links.map((l) => ({ source: l.source, target: l.target, weight: l.weight }));
  const cx = box.x + box.width / 2;
  const cy = box.y + box.height / 2;
  const aspect = box.width / Math.max(1, box.height);
  const area = (box.width * box.height) / Math.max(1, nodes.length);
  const simulation = forceSimulation<SimNode>(sim)
    .stop()
    .randomSource(lcg())
    .force(
      'link',
      forceLink<SimNode, SimulationLinkDatum<SimNode> & { weight: number }>(simLinks)
        .id((d) => d.id)
        .distance((l) => spacing * (1 - 0.45 * (l.weight / maxW))),
    )
    .force('charge', forceManyBody<SimNode>().strength(-Math.sqrt(area) * 1.6))
    .force('collide', forceCollide<SimNode>((d) => d.r + 10).iterations(2))
    .force('x', forceX<SimNode>(cx).strength(0.05))
    .force('y', forceY<SimNode>(cy).strength(0.05 * Math.max(1, aspect)));
  // Start from the spiral around the box's centre.
  for (const n of sim) {
    n.x = (n.x ?? 0) + cx;
    n.y = (n.y ?? 0) + cy;
  }
  const clamp = () => {
    for (const n of sim) {
      n.x = Math.min(box.x + box.width - n.r, Math.max(box.x + n.r, n.x ?? cx));
      n.y = Math.min(box.y + box.height - n.r, Math.max(box.y + n.r, n.y ?? cy));
    }
  };
  for (let i = 0; i < ticks; i++) {
    simulation.tick();
    clamp();
  }
  fit(sim, box);
  return sim.map((n) => ({ id: n.id, x: n.x ?? cx, y: n.y ?? cy }));
}
