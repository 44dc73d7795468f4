/**
 * Prints a diagram as a PD code: one tuple per crossing, its four edge labels
 * counterclockwise from the incoming under-edge, e.g.
 * `(4,2,5,1) (2,6,3,5) (6,4,1,3)`. Labels are 1-based and consecutive along
 * each component in its direction of travel (component 1 first), which is how
 * PD codes carry orientation.
 */
import type { LinkDiagram } from '../diagram/model.ts';

/**
 * Throws a RangeError for crossingless components (`freeLoops > 0`): a PD code
 * has no way to write them, and dropping them would silently change the link.
 */
export function formatPD(d: LinkDiagram): string {
  if (d.freeLoops > 0) {
    throw new RangeError(`a PD code cannot write the ${d.freeLoops} crossingless component(s) of this diagram`);
  }
  const label = new Array<number>(d.edgeCount);
  let next = 1;
  for (const component of d.components) for (const e of component) label[e] = next++;
  return d.crossings.map((c) => `(${c.edges.map((e) => label[e]).join(',')})`).join(' ');
}
