/**
 * analyzeDiagram: every invariant and property of one diagram, computed once,
 * as a DiagramReport that front ends and the claims layer only read.
 */
import { componentCount } from '../diagram/model.ts';
import type { LinkDiagram } from '../diagram/model.ts';
import { diagramProperties } from '../diagram/properties.ts';
import { crossingNumberBounds } from '../diagram/crossing-bounds.ts';
import { splitPieces } from '../diagram/operations.ts';
import { kauffmanBracket } from '../invariants/bracket.ts';
import { jonesFromBracket } from '../invariants/jones.ts';
import { classicalInvariants } from '../invariants/classical/index.ts';
import type { ClassicalInvariants } from '../invariants/classical/index.ts';
import type { DiagramReport } from './report.ts';

export function analyzeDiagram(d: LinkDiagram): DiagramReport {
  // The classical invariants cost seconds on diagrams of hundreds of crossings: computed on first read.
  let classical: ClassicalInvariants | undefined;
  const properties = diagramProperties(d);
  const { bracket, boundaryWidth } = kauffmanBracket(d);
  const jones = jonesFromBracket(bracket, properties.writhe);
  const report: Omit<DiagramReport, 'classical'> = {
    diagram: d,
    notation: d.notation,
    crossings: properties.crossings,
    components: componentCount(d),
    writhe: properties.writhe,
    positiveCrossings: properties.signs.positive,
    negativeCrossings: properties.signs.negative,
    linking: properties.linking,
    bracket,
    jones,
    span: jones.span,
    // The bracket and V of a diagram are never zero, so the degrees exist.
    jonesMinDegree: jones.minDegree ?? 0,
    jonesMaxDegree: jones.maxDegree ?? 0,
    bracketSpan: bracket.span,
    bracketMinDegree: bracket.minDegree ?? 0,
    bracketMaxDegree: bracket.maxDegree ?? 0,
    connected: properties.connected,
    nugatory: properties.nugatory,
    reduced: properties.reduced,
    alternating: properties.alternating,
    aAdequate: properties.aAdequate,
    bAdequate: properties.bAdequate,
    adequate: properties.adequate,
    stateCircles: properties.stateCircles,
    chiralityFixed: d.chiralityFixed,
    crossingNumber: crossingNumberBounds({
      properties,
      jonesSpan: jones.span,
      // Pieces of a disconnected diagram are connected, so this recursion is one level deep.
      pieces: properties.connected ? undefined : splitPieces(d).map((piece) => analyzeDiagram(piece).crossingNumber),
    }),
    boundaryWidth,
  };
  return Object.defineProperty(report, 'classical', {
    enumerable: true,
    get: () => (classical ??= classicalInvariants(d)),
  }) as DiagramReport;
}
