/**
 * The lazily computed values behind the HOMFLY-PT, Kauffman, braid-index and
 * Arf modules. A refusal (over the work limit) is remembered like a value, so
 * a second reader does not spend the budget again.
 */
import type { DiagramReport } from '../../analyze/report.ts';
import { InputError } from '../../errors.ts';
import type { Laurent2 } from '../../poly/laurent2.ts';
import { arfOfKnot, arfOfLink, type ArfResult } from '../arf.ts';
import { braidIndexBounds, type BraidIndexBounds } from '../braid-index.ts';
import { homflyPolynomial } from '../homfly/homfly.ts';
import { kauffmanPolynomial } from '../kauffman-polynomial/kauffman.ts';
import { quantity, valueOf } from '../registry/lazy.ts';
import { storeOf, throughStore } from '../../cache/store.ts';
import { STORED } from '../../cache/stored.ts';

type Outcome<T> = { readonly value: T } | { readonly refused: InputError };

function remembered<T>(name: string, compute: (report: DiagramReport) => T): (report: DiagramReport) => T {
  const q = quantity<Outcome<T>>(name, (report) => {
    try {
      return { value: compute(report) };
    } catch (error) {
      if (error instanceof InputError) return { refused: error };
      throw error;
    }
  });
  return (report) => {
    const outcome = valueOf(report, q);
    if ('refused' in outcome) throw outcome.refused;
    return outcome.value;
  };
}

export const homflyOf: (report: DiagramReport) => Laurent2 = remembered('homfly', (report) =>
  throughStore(storeOf(report), STORED.homfly, report.diagram, () => homflyPolynomial(report.diagram).polynomial),
);
export const kauffmanOf: (report: DiagramReport) => Laurent2 = remembered('kauffman', (report) =>
  throughStore(storeOf(report), STORED.kauffman, report.diagram, () => kauffmanPolynomial(report.diagram, 'kauffman').polynomial),
);
export const dubrovnikOf: (report: DiagramReport) => Laurent2 = remembered('dubrovnik', (report) =>
  throughStore(storeOf(report), STORED.dubrovnik, report.diagram, () => kauffmanPolynomial(report.diagram, 'dubrovnik').polynomial),
);
export const braidIndexOf: (report: DiagramReport) => BraidIndexBounds = remembered('braid-index', (report) =>
  braidIndexBounds(homflyOf(report), report.classical.seifertCircles, report.diagram.notation),
);
/** Knots read only the classical invariants; links also the Jones polynomial (Murakami's V(i)). */
export const arfOf: (report: DiagramReport) => ArfResult = remembered('arf', (report) =>
  report.components === 1
    ? { value: arfOfKnot(report.classical.conway, report.classical.alexander) }
    : arfOfLink({ diagram: report.diagram, linking: report.linking, jones: () => report.jones }),
);
