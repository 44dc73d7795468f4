/** The shared last check of PD and Gauss codes: every piece of the projection must satisfy Euler's formula. */
import { connectedPieces, nonPlanarPieces } from '../diagram/faces.ts';
import type { LinkDiagram } from '../diagram/model.ts';

export interface NonPlanarPiece {
  /** Crossing indices (as given to assembleDiagram) of the first piece that fails. */
  readonly crossings: number[];
  readonly faces: number;
  readonly expected: number;
}

export function firstNonPlanarPiece(d: LinkDiagram): NonPlanarPiece | undefined {
  const bad = nonPlanarPieces(d);
  if (bad.length === 0) return undefined;
  const { pieceOfCrossing } = connectedPieces(d);
  const piece = bad[0]!;
  const crossings: number[] = [];
  pieceOfCrossing.forEach((p, c) => {
    if (p === piece.piece) crossings.push(c);
  });
  return { crossings, faces: piece.faces, expected: piece.expected };
}
