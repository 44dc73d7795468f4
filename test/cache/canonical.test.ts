/**
 * The canonical text that keys the disk cache: equal for the same diagram
 * written differently (relabelled, reordered, rotated braid word, another
 * notation), different for a true change. Soundness is checked independently:
 * the text is decoded back into a diagram here, and that diagram must have the
 * original's Jones and Alexander polynomials (independent engines of the
 * project, each checked against published values in its own tests).
 */
import { describe, expect, it } from 'vitest';
import { canonicalDiagramText } from '../../src/core/cache/canonical.ts';
import { assembleDiagram, type RawCrossing } from '../../src/core/diagram/assemble.ts';
import { mirrorDiagram, type LinkDiagram, type Sign } from '../../src/core/diagram/model.ts';
import { switchCrossing, withFreeLoops, disjointUnion } from '../../src/core/diagram/operations.ts';
import { parseDiagramCode, printPdCode } from '../../src/core/notation/index.ts';
import { kauffmanBracket } from '../../src/core/invariants/bracket.ts';
import { jonesFromBracket } from '../../src/core/invariants/jones.ts';
import { writhe } from '../../src/core/diagram/model.ts';
import { classicalInvariants } from '../../src/core/invariants/classical/index.ts';
import { randomDiagram, rng, shuffleDiagram } from '../support/random-diagrams.ts';

const text = canonicalDiagramText;
const jones = (d: LinkDiagram) => jonesFromBracket(kauffmanBracket(d).bracket, writhe(d));

/** The diagram a canonical text describes (each piece: crossings as sign and four far ends "4·crossing + slot"). */
function decode(canonical: string): LinkDiagram {
  const parts = canonical.split('|');
  const loops = Number(parts.pop()!.replace('loops ', ''));
  const raw: RawCrossing[] = [];
  for (const part of parts) {
    const numbers = part.split(' ').map(Number);
    const base = raw.length;
    const size = numbers.length / 5;
    const ends = (c: number, slot: number) => numbers[5 * c + 1 + slot]!;
    for (let c = 0; c < size; c++) {
      // An edge's label: the smaller of its two slot numbers (global).
      const edges = [0, 1, 2, 3].map((slot) => Math.min(4 * (base + c) + slot, 4 * base + ends(c, slot))) as unknown as RawCrossing['edges'];
      raw.push({ sign: numbers[5 * c] as Sign, edges });
    }
  }
  return assembleDiagram(raw, { notation: 'pd', freeLoops: loops });
}

describe('canonical text of a diagram', () => {
  it('is the same for every relabelling and reordering of a diagram (random braid closures, shuffled)', () => {
    const random = rng(11);
    for (let trial = 0; trial < 60; trial++) {
      const d = randomDiagram(random, 14, 4);
      const t = text(d);
      for (let k = 0; k < 3; k++) expect(text(shuffleDiagram(d, random))).toBe(t);
    }
  });

  it('is the same for a PD code with its tuples reordered and its edges renamed (common practice: a PD code is read up to relabelling)', () => {
    const trefoil = parseDiagramCode('1 1 1', 'braid');
    const pd = printPdCode(trefoil);
    const tuples = pd.match(/\([^)]*\)/g)!;
    const renamed = [...tuples].reverse().join(' ').replace(/\d+/g, (n) => String(Number(n) + 40));
    expect(text(parseDiagramCode(renamed, 'pd'))).toBe(text(trefoil));
  });

  it('is the same for a braid word rotated by conjugation: the closures are the same diagram (common practice)', () => {
    const word = [1, 2, -1, 2, 2, -3, 2, 1];
    const base = text(parseDiagramCode(word.join(' '), 'braid'));
    for (let r = 1; r < word.length; r++) {
      const rotated = [...word.slice(r), ...word.slice(0, r)];
      expect(text(parseDiagramCode(rotated.join(' '), 'braid'))).toBe(base);
    }
  });

  it('differs for the mirror image of the trefoil, which is chiral (its Jones polynomial is not symmetric: Jones 1985)', () => {
    const trefoil = parseDiagramCode('1 1 1', 'braid');
    expect(jones(mirrorDiagram(trefoil)).equals(jones(trefoil))).toBe(false);
    expect(text(mirrorDiagram(trefoil))).not.toBe(text(trefoil));
    expect(text(parseDiagramCode('-1 -1 -1', 'braid'))).toBe(text(mirrorDiagram(trefoil)));
  });

  it('differs after switching a crossing, adding a free loop or a split piece', () => {
    const random = rng(5);
    for (let trial = 0; trial < 30; trial++) {
      const d = randomDiagram(random, 12, 4);
      if (d.crossings.length === 0) continue;
      expect(text(switchCrossing(d, 0))).not.toBe(text(d));
      expect(text(withFreeLoops(d))).not.toBe(text(d));
      expect(text(disjointUnion(d, parseDiagramCode('1 1 1', 'braid')))).not.toBe(text(d));
    }
  });

  it('determines the diagram: the diagram decoded from it has the same Jones and Alexander polynomials', () => {
    const random = rng(23);
    for (let trial = 0; trial < 40; trial++) {
      const d = randomDiagram(random, 12, 4);
      const back = decode(text(d));
      expect(back.crossings.length).toBe(d.crossings.length);
      expect(jones(back).equals(jones(d))).toBe(true);
      expect(classicalInvariants(back).alexander.equals(classicalInvariants(d).alexander)).toBe(true);
      // And the decoded diagram is the same diagram up to relabelling.
      expect(text(back)).toBe(text(d));
    }
  });

  it('equal texts always carry equal Jones polynomials (random pairs; a collision would be a wrong cache hit)', () => {
    const random = rng(99);
    const byText = new Map<string, string>();
    for (let trial = 0; trial < 200; trial++) {
      const d = randomDiagram(random, 6, 3);
      const v = jones(d).toPlainString('t');
      const t = text(d);
      if (byText.has(t)) expect(byText.get(t)).toBe(v);
      else byText.set(t, v);
    }
    expect(byText.size).toBeGreaterThan(20);
  });
});
