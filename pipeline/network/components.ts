/** Connected components of a graph, by breadth-first search. */

import type Graph from 'graphology-types';

/**
 * The connected components, each a list of node keys in the graph's node
 * order; components are listed in the order of their first node.
 */
export function connectedComponents(graph: Graph): string[][] {
  const seen = new Set<string>();
  const out: string[][] = [];
  graph.forEachNode((start) => {
    if (seen.has(start)) return;
    seen.add(start);
    const queue = [start];
    for (let k = 0; k < queue.length; k++) {
      graph.forEachNeighbor(queue[k]!, (n) => {
        if (!seen.has(n)) {
          seen.add(n);
          queue.push(n);
        }
      });
    }
    const order = new Set(queue);
    out.push(graph.filterNodes((n) => order.has(n)));
  });
  return out;
}
