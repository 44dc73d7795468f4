/**
 * Builds a LinkDiagram from crossings whose edge labels are arbitrary numbers
 * and whose orientation is fixed by their signs: components are traced by
 * following each edge straight through the crossing it enters, and edges are
 * renumbered 0 … E−1 in order of travel. Notation front ends validate the
 * user's code first and report problems in the user's own labels; this throws
 * only on input they should already have refused.
 */
import { slotIsIncoming, structuralProblem, type Crossing, type LinkDiagram, type Notation, type Sign } from './model.ts';

export interface RawCrossing {
  readonly edges: readonly [number, number, number, number];
  readonly sign: Sign;
}

export function assembleDiagram(
  raw: readonly RawCrossing[],
  options: { notation: Notation; freeLoops?: number; chiralityFixed?: boolean },
): LinkDiagram {
  // For each label: where it enters (crossing, slot).
  const enters = new Map<number, { crossing: number; slot: number }>();
  const labels: number[] = [];
  raw.forEach((c, ci) =>
    c.edges.forEach((label, slot) => {
      if (slotIsIncoming(slot, c.sign)) {
        if (enters.has(label)) throw new Error(`internal: label ${label} enters twice`);
        enters.set(label, { crossing: ci, slot });
        labels.push(label);
      }
    }),
  );
  // Travel: the label that leaves straight through from where `label` enters.
  const nextLabel = (label: number): number => {
    const at = enters.get(label)!;
    return raw[at.crossing]!.edges[(at.slot + 2) % 4]!;
  };
  const id = new Map<number, number>();
  const components: number[][] = [];
  for (const start of [...labels].sort((a, b) => a - b)) {
    if (id.has(start)) continue;
    const comp: number[] = [];
    let label = start;
    while (!id.has(label)) {
      id.set(label, id.size);
      comp.push(id.get(label)!);
      label = nextLabel(label);
      if (!enters.has(label)) throw new Error(`internal: label ${label} never enters a crossing`);
    }
    if (label !== start) throw new Error('internal: travel did not close up');
    components.push(comp);
  }
  const crossings: Crossing[] = raw.map((c) => ({
    edges: c.edges.map((l) => id.get(l)!) as unknown as [number, number, number, number],
    sign: c.sign,
  }));
  const diagram: LinkDiagram = {
    notation: options.notation,
    crossings,
    edgeCount: id.size,
    components,
    freeLoops: options.freeLoops ?? 0,
    chiralityFixed: options.chiralityFixed ?? true,
  };
  const problem = structuralProblem(diagram);
  if (problem) throw new Error(`internal: assembled diagram is malformed: ${problem}`);
  return diagram;
}
