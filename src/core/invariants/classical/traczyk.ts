/**
 * Traczyk's formula: for a reduced, alternating, connected diagram with at
 * least one crossing, σ(L) = s_A − n₊ − 1, where s_A is the number of circles of
 * the all-A state and n₊ the number of positive crossings (recalled from
 * memory; the form and sign here are the ones that agree with sign(V + Vᵀ),
 * checked in the tests). An independent second route to the signature that
 * needs no matrix at all.
 */
import type { LinkDiagram } from '../../diagram/model.ts';
import { isAlternatingDiagram, isConnectedDiagram, nugatoryCrossings, uniformStateCircles } from '../../diagram/properties.ts';

/** σ by Traczyk's formula, or null when the diagram is not reduced, alternating and connected. */
export function traczykSignature(d: LinkDiagram): number | null {
  if (d.crossings.length === 0 || !isConnectedDiagram(d) || !isAlternatingDiagram(d) || nugatoryCrossings(d).length > 0) return null;
  const positive = d.crossings.filter((c) => c.sign === 1).length;
  return uniformStateCircles(d, 'A').count - positive - 1;
}
