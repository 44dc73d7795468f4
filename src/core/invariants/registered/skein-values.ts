/** The lazily computed values behind the HOMFLY-PT, Kauffman, braid-index and Arf modules. */
import { arfInvariant } from '../arf.ts';
import { braidIndexBounds } from '../braid-index.ts';
import { homflyPolynomial } from '../homfly/homfly.ts';
import { kauffmanPolynomial } from '../kauffman-polynomial/kauffman.ts';
import { quantity } from '../registry/lazy.ts';
import { valueOf } from '../registry/lazy.ts';

export const homflyValue = quantity('homfly', (report) => homflyPolynomial(report.diagram).polynomial);
export const kauffmanValue = quantity('kauffman', (report) => kauffmanPolynomial(report.diagram, 'kauffman').polynomial);
export const dubrovnikValue = quantity('dubrovnik', (report) => kauffmanPolynomial(report.diagram, 'dubrovnik').polynomial);
export const braidIndexValue = quantity('braid-index', (report) =>
  braidIndexBounds(valueOf(report, homflyValue), report.classical.seifertCircles, report.diagram.notation),
);
export const arfValue = quantity('arf', (report) => arfInvariant(report.classical.conway, report.classical.alexander, report.components));
