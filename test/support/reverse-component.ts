/**
 * A link diagram with one component's orientation reversed, written through
 * the signed Gauss code (our syntax): that component's visits are listed
 * backwards, and a crossing between it and another component changes sign
 * (one of its two strands turns round); its self-crossings keep their sign.
 */
import type { LinkDiagram } from '../../src/core/diagram/model.ts';
import { parseDiagramCode, printGaussCode } from '../../src/core/notation/index.ts';

export function reverseComponent(d: LinkDiagram, k: number): LinkDiagram {
  const text = printGaussCode(d);
  const groups = text.startsWith('(') ? [...text.matchAll(/\(([^)]*)\)/g)].map((m) => m[1]!.split(' ').filter(Boolean)) : [text.split(' ')];
  const crossingOf = (visit: string) => visit.slice(1, -1);
  const reversed = new Set(groups[k]!.map(crossingOf));
  const mixed = new Set([...reversed].filter((c) => groups.some((g, i) => i !== k && g.some((v) => crossingOf(v) === c))));
  const flip = (visit: string) => (mixed.has(crossingOf(visit)) ? visit.slice(0, -1) + (visit.endsWith('+') ? '-' : '+') : visit);
  const written = groups.map((g, i) => (i === k ? [...g].reverse() : g).map(flip).join(' '));
  return parseDiagramCode(written.map((g) => `(${g})`).join(' '), 'gauss');
}
