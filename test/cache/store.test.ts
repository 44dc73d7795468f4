/**
 * The core's side of the disk cache with an in-memory store: a second
 * analysis of the same manuscript diagrams reads every stored value and
 * writes none, each value equals the uncached one, relabelled diagrams share
 * the relabelling-free values but not the boundary width (which depends on
 * the numbering), and a value that fails to decode is recomputed. Expected
 * values are the uncached computations (engines checked against published
 * values in their own tests).
 */
import { describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import type { ResultStore } from '../../src/core/cache/store.ts';
import { parseDiagramCode, printGaussCode, printPdCode } from '../../src/core/notation/index.ts';
import { kauffmanBracket } from '../../src/core/invariants/bracket.ts';
import { homflyOf } from '../../src/core/invariants/registered/skein-values.ts';
import { khovanovOf } from '../../src/core/claims/khovanov-claims.ts';
import { randomDiagram, rng, shuffleDiagram } from '../support/random-diagrams.ts';
import type { DiagramReport } from '../../src/core/analyze/report.ts';

class MemoryStore implements ResultStore {
  readonly entries = new Map<string, string>();
  gets = 0;
  puts = 0;
  get(key: string): string | undefined {
    this.gets++;
    return this.entries.get(key);
  }
  put(key: string, text: string): void {
    this.puts++;
    this.entries.set(key, text);
  }
}

/** Every stored value of a report, as plain text for comparison. */
function values(r: DiagramReport): string[] {
  const c = r.classical;
  return [
    r.jones.toPlainString('t'),
    r.bracket.toPlainString('A'),
    String(r.boundaryWidth),
    c.alexander.toPlainString('t'),
    c.conway.toPlainString('z'),
    String(c.determinant),
    String(c.signature),
    JSON.stringify(c.genusBounds),
    homflyOf(r).toPlainString('v', 'z'),
    JSON.stringify(khovanovOf(r)),
  ];
}

const codes = ['1 1 1', '1 -2 1 -2', '1 1 2 -1 2 2 -1', '1 1'];

describe('analysis through a result store', () => {
  it('stores every value on the first run, reads them all on the second, and they equal the uncached values', () => {
    const store = new MemoryStore();
    const uncached = codes.map((code) => values(analyzeDiagram(parseDiagramCode(code, 'braid'))));
    const first = codes.map((code) => values(analyzeDiagram(parseDiagramCode(code, 'braid'), {}, store)));
    expect(first).toEqual(uncached);
    expect(store.puts).toBeGreaterThan(0);
    const puts = store.puts;
    // Freshly parsed diagrams (new objects: nothing remembered in memory), the same store.
    const second = codes.map((code) => values(analyzeDiagram(parseDiagramCode(code, 'braid'), {}, store)));
    expect(second).toEqual(uncached);
    expect(store.puts).toBe(puts);
  });

  it('shares values between relabelled diagrams but keeps each numbering\'s own boundary width', () => {
    const random = rng(3);
    // A diagram and a relabelling whose crossing orders give different widest boundaries.
    let pair: [ReturnType<typeof randomDiagram>, ReturnType<typeof randomDiagram>] | undefined;
    for (let trial = 0; trial < 200 && !pair; trial++) {
      const d = randomDiagram(random, 24, 6);
      const e = shuffleDiagram(d, random);
      if (kauffmanBracket(d).boundaryWidth !== kauffmanBracket(e).boundaryWidth) pair = [d, e];
    }
    expect(pair).toBeDefined();
    const [d, e] = pair!;
    const store = new MemoryStore();
    analyzeDiagram(d, {}, store).boundaryWidth;
    void analyzeDiagram(d, {}, store).bracket;
    const puts = store.puts;
    const report = analyzeDiagram(e, {}, store);
    expect(report.bracket.equals(kauffmanBracket(e).bracket)).toBe(true);
    expect(store.puts).toBe(puts); // the bracket was read, not computed
    expect(report.boundaryWidth).toBe(kauffmanBracket(e).boundaryWidth);
    expect(store.puts).toBe(puts + 1); // its own width was computed and stored
  });

  it('keys crossing-number bounds by the family marking too: a torus knot built as a family and the same drawing as a PD code each get their own reasons', () => {
    const store = new MemoryStore();
    const family = parseDiagramCode('torus 3 4', 'family');
    const pd = parseDiagramCode(printPdCode(family), 'pd');
    const uncachedFamily = analyzeDiagram(parseDiagramCode('torus 3 4', 'family')).crossingNumber;
    const uncachedPd = analyzeDiagram(parseDiagramCode(printPdCode(family), 'pd')).crossingNumber;
    // Murasugi's torus-knot theorem (1991) applies to the family member only.
    expect(uncachedFamily.reasons.map((x) => x.theorem)).toContain('murasugi-torus');
    expect(uncachedPd.reasons.map((x) => x.theorem)).not.toContain('murasugi-torus');
    expect(analyzeDiagram(family, {}, store).crossingNumber).toEqual(uncachedFamily);
    expect(analyzeDiagram(pd, {}, store).crossingNumber).toEqual(uncachedPd);
    // A second run reads both back unchanged.
    expect(analyzeDiagram(parseDiagramCode('torus 3 4', 'family'), {}, store).crossingNumber).toEqual(uncachedFamily);
    expect(analyzeDiagram(parseDiagramCode(printPdCode(family), 'pd'), {}, store).crossingNumber).toEqual(uncachedPd);
  });

  it('reads a simplified diagram and its crossing-number bounds back the same', () => {
    const store = new MemoryStore();
    const code = '1 2 1 -2 -1 2 2 1 -1';
    const uncached = analyzeDiagram(parseDiagramCode(code, 'braid'));
    void analyzeDiagram(parseDiagramCode(code, 'braid'), {}, store).crossingNumber;
    const puts = store.puts;
    const warm = analyzeDiagram(parseDiagramCode(code, 'braid'), {}, store);
    expect(warm.crossingNumber).toEqual(uncached.crossingNumber);
    expect(printGaussCode(warm.simplified!.diagram)).toBe(printGaussCode(uncached.simplified!.diagram));
    expect(warm.simplified!.diagram.freeLoops).toBe(uncached.simplified!.diagram.freeLoops);
    expect(warm.simplified!.description).toBe(uncached.simplified!.description);
    expect(store.puts).toBe(puts);
  });

  it('never serves a diagram\'s values to its mirror image (the trefoil is chiral)', () => {
    const store = new MemoryStore();
    void values(analyzeDiagram(parseDiagramCode('1 1 1', 'braid'), {}, store));
    const mirror = values(analyzeDiagram(parseDiagramCode('-1 -1 -1', 'braid'), {}, store));
    expect(mirror).toEqual(values(analyzeDiagram(parseDiagramCode('-1 -1 -1', 'braid'))));
    expect(mirror[0]).not.toBe(values(analyzeDiagram(parseDiagramCode('1 1 1', 'braid')))[0]);
  });

  it('recomputes a value whose stored text does not decode, and stores it again', () => {
    const store = new MemoryStore();
    const expected = values(analyzeDiagram(parseDiagramCode('1 -2 1 -2', 'braid')));
    void values(analyzeDiagram(parseDiagramCode('1 -2 1 -2', 'braid'), {}, store));
    for (const key of store.entries.keys()) store.entries.set(key, '{"not":"a value"}');
    expect(values(analyzeDiagram(parseDiagramCode('1 -2 1 -2', 'braid'), {}, store))).toEqual(expected);
    for (const text of store.entries.values()) expect(text).not.toBe('{"not":"a value"}');
  });
});
