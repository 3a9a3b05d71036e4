/**
 * The chart kinds, one line each: a kind is defined in its own file with
 * `defineChart` (chart.ts) and registered here under its name, which must be
 * the name it is exported as. Nothing else in the pipeline lists the kinds:
 * the plan's checks, the notes and the panels all read them from here.
 */

export { bars } from './bars.ts';
export { lines } from './lines.ts';
export { strip } from './strip.ts';
export { matrix } from './matrix.ts';
export { network } from './network.ts';
export { tree } from './tree.ts';
export { treemap } from './treemap.ts';
export { kwic } from './kwic.ts';
export { textmap } from './textmap.ts';
export { multiples } from './multiples.ts';
export { scatter } from './scatter.ts';
