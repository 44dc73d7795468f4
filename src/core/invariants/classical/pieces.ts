/**
 * A diagram split into its connected pieces, each a diagram of its own with
 * edges renumbered 0 … E−1. A diagram with more than one piece (free loops
 * count as pieces) shows a split link, and the classical invariants of a split
 * link are assembled from those of its pieces.
 */
import { connectedPieces } from '../../diagram/faces.ts';
import { indexDiagram, type Crossing, type LinkDiagram } from '../../diagram/model.ts';

export function diagramPieces(d: LinkDiagram): LinkDiagram[] {
  const { pieceOfCrossing, pieceCount } = connectedPieces(d);
  if (pieceCount <= 1 && d.freeLoops === 0) return [d];
  const { head } = indexDiagram(d);
  const pieces: LinkDiagram[] = [];
  for (let p = 0; p < pieceCount; p++) {
    const renumber = new Map<number, number>();
    const components: number[][] = [];
    for (const comp of d.components) {
      if (pieceOfCrossing[head[comp[0]!]!.crossing] !== p) continue;
      components.push(comp.map((e) => {
        renumber.set(e, renumber.size);
        return renumber.get(e)!;
      }));
    }
    const crossings: Crossing[] = d.crossings
      .filter((_, c) => pieceOfCrossing[c] === p)
      .map((c) => ({ sign: c.sign, edges: c.edges.map((e) => renumber.get(e)!) as unknown as Crossing['edges'] }));
    pieces.push({ ...d, crossings, edgeCount: renumber.size, components, freeLoops: 0 });
  }
  for (let k = 0; k < d.freeLoops; k++) {
    pieces.push({ ...d, crossings: [], edgeCount: 0, components: [], freeLoops: 1 });
  }
  return pieces;
}
