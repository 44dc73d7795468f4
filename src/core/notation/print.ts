/**
 * Printers from the diagram model back to the notations that can express an
 * arbitrary diagram (PD, signed Gauss; DT for knots). Each printed code parses
 * back to a diagram of the same link (the PD code of a component that only
 * passes over may come back with the opposite orientation, see README
 * `notations`).
 */
import { indexDiagram, isOverSlot, type LinkDiagram } from '../diagram/model.ts';

/** PD code: one 4-tuple per crossing, edges numbered 1, 2, … consecutively along each component. */
export function printPdCode(d: LinkDiagram): string {
  if (d.freeLoops > 0) throw new RangeError('a PD code cannot express a crossingless component');
  if (d.crossings.length === 0) throw new RangeError('a PD code needs at least one crossing');
  const label = new Array<number>(d.edgeCount);
  let next = 1;
  for (const component of d.components) for (const e of component) label[e] = next++;
  return d.crossings.map((c) => `(${c.edges.map((e) => label[e]).join(',')})`).join(' ');
}

/**
 * Signed Gauss code in our syntax: visits `o<k><sign>` / `u<k><sign>` along
 * each component, crossings numbered 1 … n in model order; with several
 * components (or a free loop) each component is parenthesised and a free loop
 * is `()`.
 */
export function printGaussCode(d: LinkDiagram): string {
  const { head } = indexDiagram(d);
  const components = d.components.map((edges) =>
    edges
      .map((e) => {
        const at = head[e]!;
        const sign = d.crossings[at.crossing]!.sign === 1 ? '+' : '-';
        return `${isOverSlot(at.slot) ? 'o' : 'u'}${at.crossing + 1}${sign}`;
      })
      .join(' '),
  );
  for (let k = 0; k < d.freeLoops; k++) components.push('');
  if (components.length === 1 && d.freeLoops === 0) return components[0]!;
  return components.map((c) => `(${c})`).join(' ');
}

/**
 * DT code of a knot diagram, starting at the first edge of the component: for
 * the odd visits 1, 3, 5, … the paired even visit, negative when the even
 * visit passes over.
 */
export function printDtCode(d: LinkDiagram): string {
  if (d.components.length !== 1 || d.freeLoops > 0) throw new RangeError('a DT code describes a knot diagram with crossings');
  const { head } = indexDiagram(d);
  const visits = new Map<number, { label: number; over: boolean }[]>();
  d.components[0]!.forEach((e, k) => {
    const at = head[e]!;
    const list = visits.get(at.crossing) ?? [];
    list.push({ label: k + 1, over: isOverSlot(at.slot) });
    visits.set(at.crossing, list);
  });
  const evenOf = new Map<number, number>();
  for (const [, pair] of visits) {
    const [a, b] = pair as [{ label: number; over: boolean }, { label: number; over: boolean }];
    if (a.label % 2 === b.label % 2) throw new RangeError('the diagram is not planar: a crossing joins two visits of the same parity');
    const [odd, even] = a.label % 2 === 1 ? [a, b] : [b, a];
    evenOf.set(odd.label, even.over ? -even.label : even.label);
  }
  const entries: number[] = [];
  for (let odd = 1; odd < 2 * d.crossings.length; odd += 2) entries.push(evenOf.get(odd)!);
  return entries.join(' ');
}
