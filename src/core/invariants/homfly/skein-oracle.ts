/**
 * The small-diagram oracle for the HOMFLY-PT engine: the skein recursion over
 * descending diagrams (Lickorish–Millett 1987). Walk the components in order
 * from their first edges; at the first crossing met first from below, switch
 * it (P₊ = v²P₋ + vzP₀, P₋ = v⁻²P₊ − v⁻¹zP₀) and recurse on both the switched
 * and the smoothed diagram. A diagram with no such crossing is descending, an
 * unlink of μ circles, P = δ^(μ−1). Exponential in the crossings: tests only.
 */
import { componentCount, indexDiagram, type LinkDiagram } from '../../diagram/model.ts';
import { smoothCrossing, switchCrossing } from '../../diagram/operations.ts';
import { Laurent2 } from '../../poly/laurent2.ts';
import { HOMFLY_LOOP, HOMFLY_RULES } from './homfly.ts';

export function homflyBySkeinTree(d: LinkDiagram): Laurent2 {
  const first = firstAscendingCrossing(d);
  if (first < 0) return HOMFLY_LOOP.pow(componentCount(d) - 1).mul(Laurent2.one);
  const rule = HOMFLY_RULES.crossing(d.crossings[first]!.sign);
  const smoothing = d.crossings[first]!.sign === 1 ? rule.smoothA : rule.smoothB;
  return rule.switched.mul(homflyBySkeinTree(switchCrossing(d, first))).add(smoothing.mul(homflyBySkeinTree(smoothCrossing(d, first))));
}

/** The first crossing the walk meets first on its under strand, or −1 when the diagram is descending. */
function firstAscendingCrossing(d: LinkDiagram): number {
  const { head } = indexDiagram(d);
  const met = new Uint8Array(d.crossings.length);
  for (const component of d.components) {
    for (const edge of component) {
      const { crossing, slot } = head[edge]!;
      if (met[crossing]) continue;
      met[crossing] = 1;
      if (slot === 0) return crossing;
    }
  }
  return -1;
}
