/**
 * A skein polynomial of a whole diagram: the contraction of each connected
 * piece of the projection, times the loop value for every free loop, divided
 * by one loop value so that the unknot gets 1. Pieces of a split diagram
 * multiply, since a split union is a layered stack of its pieces.
 */
import { assembleDiagram, type RawCrossing } from '../../diagram/assemble.ts';
import { indexDiagram, type LinkDiagram, type Sign } from '../../diagram/model.ts';
import { divideExactly, Laurent2 } from '../../poly/laurent2.ts';
import { diagramPieces } from '../classical/pieces.ts';
import { contractPiece, OverLimit, overLimitError, type ContractionLimits, type SkeinRules } from './engine.ts';

export interface SkeinPolynomialResult {
  /** The value normalised so that the crossingless unknot gets 1 (no writhe factor). */
  readonly value: Laurent2;
  /** The widest boundary any piece's contraction met. */
  readonly width: number;
}

export function skeinPolynomial(d: LinkDiagram, rules: SkeinRules, limits: ContractionLimits, invariantName: string): SkeinPolynomialResult {
  if (d.crossings.length === 0 && d.freeLoops === 0) throw new RangeError('the empty diagram has no skein polynomial');
  let total = Laurent2.one;
  let width = 0;
  const { diagram, curls } = withoutCurls(d);
  for (const sign of curls) total = total.mul(rules.curl(sign));
  for (const piece of diagramPieces(diagram)) {
    if (piece.crossings.length === 0) {
      total = total.mul(rules.loop.pow(piece.freeLoops));
      continue;
    }
    try {
      const result = contractPiece(piece, rules, limits);
      width = Math.max(width, result.width);
      total = total.mul(result.value);
    } catch (error) {
      if (error instanceof OverLimit) throw overLimitError(invariantName, d.crossings.length, error.message);
      throw error;
    }
  }
  return { value: divideExactly(total, rules.loop), width };
}

/**
 * The diagram with every curl (an edge from a crossing back to the same
 * crossing) undone by Reidemeister I, and the signs of the curls undone. A
 * curl's self-crossing has the same sign for either orientation of its strand.
 */
export function withoutCurls(d: LinkDiagram): { diagram: LinkDiagram; curls: Sign[] } {
  const curls: Sign[] = [];
  let current = d;
  for (;;) {
    const { opposite } = indexDiagram(current);
    const slot = opposite.findIndex((far, here) => far >> 2 === here >> 2);
    if (slot < 0) return { diagram: current, curls };
    const c = slot >> 2;
    const crossing = current.crossings[c]!;
    curls.push(crossing.sign);
    // The two slots off the curl: their edges become one (or close up when they are one already).
    const kink = [slot & 3, opposite[slot]! & 3];
    const rest = [0, 1, 2, 3].filter((q) => !kink.includes(q)).map((q) => crossing.edges[q]!);
    const [keep, drop] = [rest[0]!, rest[1]!];
    const raw: RawCrossing[] = current.crossings
      .filter((_, i) => i !== c)
      .map((x) => ({ sign: x.sign, edges: x.edges.map((e) => (e === drop ? keep : e)) as unknown as RawCrossing['edges'] }));
    const closesUp = keep === drop || !raw.some((x) => x.edges.includes(keep));
    current = assembleDiagram(raw, { notation: current.notation, freeLoops: current.freeLoops + (closesUp ? 1 : 0), chiralityFixed: current.chiralityFixed });
  }
}
