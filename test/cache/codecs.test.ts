/**
 * Every quantity the disk cache keeps survives its text form unchanged
 * (round trip on values the engines compute, including coefficients past
 * 2^53), and a text of the wrong shape decodes to nothing, never to a value.
 * Values come from the project's engines, whose own tests check them against
 * published values; here only the faithfulness of the text form is at stake.
 */
import { describe, expect, it } from 'vitest';
import { STORED } from '../../src/core/cache/stored.ts';
import type { Codec } from '../../src/core/cache/codecs.ts';
import { parseDiagramCode } from '../../src/core/notation/index.ts';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { khovanovReport } from '../../src/core/invariants/khovanov/index.ts';
import { homflyPolynomial } from '../../src/core/invariants/homfly/homfly.ts';
import { kauffmanPolynomial } from '../../src/core/invariants/kauffman-polynomial/kauffman.ts';
import { connectedSum } from '../../src/core/diagram/operations.ts';
import type { LinkDiagram } from '../../src/core/diagram/model.ts';
import { Laurent } from '../../src/core/poly/laurent.ts';
import { Laurent2 } from '../../src/core/poly/laurent2.ts';

const roundTrip = <T>(codec: Codec<T>, value: T): T | undefined => codec.decode(codec.encode(value)!);

// The positive trefoil, the Hopf link (V has half-integer exponents for two components, common practice),
// and a connected sum of 24 figure-eight knots (det 5^24 > 2^53: determinants multiply under connected sum).
const trefoil = parseDiagramCode('1 1 1', 'braid');
const hopf = parseDiagramCode('1 1', 'braid');
const figureEight = parseDiagramCode('1 -2 1 -2', 'braid');
const figureEights = Array.from({ length: 23 }).reduce<LinkDiagram>((sum) => connectedSum(sum, figureEight), figureEight);

describe('codecs of the stored quantities', () => {
  it('round-trips the Kauffman bracket, Alexander and Conway polynomials, determinant and signature', () => {
    for (const d of [trefoil, hopf]) {
      const r = analyzeDiagram(d);
      expect(roundTrip(STORED.bracket, r.bracket)!.equals(r.bracket)).toBe(true);
      expect(roundTrip(STORED.alexander, r.classical.alexander)!.equals(r.classical.alexander)).toBe(true);
      expect(roundTrip(STORED.conway, r.classical.conway)!.equals(r.classical.conway)).toBe(true);
      expect(roundTrip(STORED.determinant, r.classical.determinant)).toBe(r.classical.determinant);
      expect(roundTrip(STORED.signature, r.classical.signature)).toBe(r.classical.signature);
    }
  });

  it('keeps integers past 2^53 exactly', () => {
    const det = analyzeDiagram(figureEights).classical.determinant;
    expect(det).toBe(5n ** 24n);
    expect(roundTrip(STORED.determinant, det)).toBe(det);
    const big = Laurent.fromTerms([[-2.5, 2n ** 70n + 1n], [0.25, -(3n ** 50n)]]);
    expect(roundTrip(STORED.bracket, big)!.equals(big)).toBe(true);
    const big2 = Laurent2.fromTerms([[-3, 2, 2n ** 64n + 7n], [1, -1, -1n]]);
    expect(roundTrip(STORED.homfly, big2)!.equals(big2)).toBe(true);
  });

  it('round-trips Khovanov homology with torsion (the trefoil has a ℤ/2: Bar-Natan 2002, from memory) and the reduced homology', () => {
    const k = khovanovReport(trefoil);
    expect(k.homology.torsion.length).toBeGreaterThan(0);
    expect(roundTrip(STORED.khovanov, k)).toEqual(k);
    const link = khovanovReport(hopf);
    expect(link.reduced).toBeNull();
    expect(roundTrip(STORED.khovanov, link)).toEqual(link);
  });

  it('round-trips the HOMFLY-PT, Kauffman and Dubrovnik polynomials', () => {
    const p = homflyPolynomial(trefoil).polynomial;
    expect(roundTrip(STORED.homfly, p)!.equals(p)).toBe(true);
    const f = kauffmanPolynomial(trefoil, 'kauffman').polynomial;
    expect(roundTrip(STORED.kauffman, f)!.equals(f)).toBe(true);
    const dub = kauffmanPolynomial(hopf, 'dubrovnik').polynomial;
    expect(roundTrip(STORED.dubrovnik, dub)!.equals(dub)).toBe(true);
  });

  it('decodes damaged or foreign texts to nothing', () => {
    const text = STORED.bracket.encode(analyzeDiagram(trefoil).bracket)!;
    for (const bad of [text.slice(0, -3), '', 'null', '{"a":1}', '[[1,"x"]]', '[[0.3,"1"]]', '[[1,"1"],[1,"2"]]', '[[2,"1"],[1,"2"]]', '[[1,"0"]]']) {
      expect(STORED.bracket.decode(bad)).toBeUndefined();
    }
    expect(STORED.determinant.decode('"3.5"')).toBeUndefined();
    expect(STORED.signature.decode('1.5')).toBeUndefined();
    expect(STORED.homfly.decode('[[1,2,"3"],[1,2,"4"]]')).toBeUndefined();
    const k = STORED.khovanov.encode(khovanovReport(trefoil))!;
    expect(STORED.khovanov.decode(k.replace('"thin":true', '"thin":1'))).toBeUndefined();
    expect(STORED.khovanov.decode(k.slice(0, k.length / 2))).toBeUndefined();
  });

  it('round-trips crossing-number bounds with their reasons and the simplified diagram (a non-alternating closure the moves shrink)', () => {
    const r = analyzeDiagram(parseDiagramCode('1 -2 1 2 1 1 -2', 'braid'));
    expect(r.simplified).toBeDefined();
    const simplified = { diagram: r.simplified!.diagram, moves: r.simplified!.moves, description: r.simplified!.description };
    expect(roundTrip(STORED.simplified, simplified)).toEqual(simplified);
    expect(roundTrip(STORED.simplified, null)).toBeNull();
    expect(r.crossingNumber.reasons.some((reason) => reason.afterMoves !== undefined)).toBe(true);
    expect(roundTrip(STORED.crossingNumber, r.crossingNumber)).toEqual(r.crossingNumber);
    const plain = analyzeDiagram(trefoil).crossingNumber;
    expect(roundTrip(STORED.crossingNumber, plain)).toEqual(plain);
  });

  it('refuses a stored diagram that is not a diagram (an edge used three times) and bounds that are not bounds', () => {
    const text = STORED.simplified.encode({ diagram: trefoil, moves: { nugatory: 0, bigons: 0, slides: 0, flypes: 0 }, description: 'no moves' })!;
    expect(STORED.simplified.decode(text)).toBeDefined();
    const json = JSON.parse(text) as { diagram: { crossings: number[][] } };
    json.diagram.crossings[0]![1] = json.diagram.crossings[1]![1]!;
    expect(STORED.simplified.decode(JSON.stringify(json))).toBeUndefined();
    expect(STORED.crossingNumber.decode('{"lower":5,"upper":3,"exact":null,"reasons":[]}')).toBeUndefined();
    expect(STORED.crossingNumber.decode('{"lower":3,"upper":3,"exact":3,"reasons":[{"bound":"exact","value":3,"theorem":"x","text":1}]}')).toBeUndefined();
  });

  it('has one codec name per quantity, each with its format version', () => {
    const names = Object.values(STORED).map((c) => c.name);
    expect(new Set(names).size).toBe(names.length);
    for (const name of names) expect(name).toMatch(/^[a-z-]+\/\d+$/);
  });
});
