/**
 * Random diagrams for property tests. Closures of random braid words cover
 * every link type; relabelling and shuffling the crossings makes sure no
 * engine relies on the order a notation happened to produce.
 */
import { assembleDiagram } from '../../src/core/diagram/assemble.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { slotIsIncoming, structuralProblem, type Crossing, type LinkDiagram } from '../../src/core/diagram/model.ts';

/** A small deterministic PRNG (mulberry32), so failures reproduce from the seed. */
export function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function randomInt(random: () => number, lo: number, hi: number): number {
  return lo + Math.floor(random() * (hi - lo + 1));
}

export function randomBraidWord(random: () => number, strands: number, length: number): number[] {
  return Array.from({ length }, () => randomInt(random, 1, strands - 1) * (random() < 0.5 ? 1 : -1));
}

/**
 * An alternating braid word: generator i always has sign (−1)^(i+1), which makes
 * the closure alternating. Each generator appears at least twice, so no crossing
 * is nugatory and the closure is reduced and connected.
 */
export function randomAlternatingBraidWord(random: () => number, strands: number, length: number): number[] {
  if (length < 2 * (strands - 1)) throw new RangeError('too short to use every generator twice');
  const word: number[] = [];
  for (let i = 1; i < strands; i++) word.push(i, i);
  while (word.length < length) word.push(randomInt(random, 1, strands - 1));
  for (let k = word.length - 1; k > 0; k--) {
    const j = randomInt(random, 0, k);
    [word[k], word[j]] = [word[j]!, word[k]!];
  }
  return word.map((g) => (g % 2 === 1 ? g : -g));
}

/** The same diagram with crossings in random order and edges renumbered at random. */
export function shuffleDiagram(d: LinkDiagram, random: () => number): LinkDiagram {
  const order = d.crossings.map((_, i) => i);
  for (let k = order.length - 1; k > 0; k--) {
    const j = randomInt(random, 0, k);
    [order[k], order[j]] = [order[j]!, order[k]!];
  }
  const relabel = Array.from({ length: d.edgeCount }, (_, i) => i);
  for (let k = relabel.length - 1; k > 0; k--) {
    const j = randomInt(random, 0, k);
    [relabel[k], relabel[j]] = [relabel[j]!, relabel[k]!];
  }
  const crossings: Crossing[] = order.map((i) => {
    const c = d.crossings[i]!;
    return { sign: c.sign, edges: c.edges.map((e) => relabel[e]!) as unknown as Crossing['edges'] };
  });
  return { ...d, crossings, components: d.components.map((comp) => comp.map((e) => relabel[e]!)) };
}

export function randomDiagram(random: () => number, maxCrossings: number, maxStrands = 4): LinkDiagram {
  const strands = randomInt(random, 2, maxStrands);
  const length = randomInt(random, 1, maxCrossings);
  return shuffleDiagram(closeBraid(randomBraidWord(random, strands, length), strands), random);
}

export function randomReducedAlternating(random: () => number, crossings: number, maxStrands = 5): LinkDiagram {
  const strands = Math.min(maxStrands, Math.max(2, Math.floor(crossings / 2) + 1), randomInt(random, 2, maxStrands));
  return shuffleDiagram(closeBraid(randomAlternatingBraidWord(random, strands, crossings), strands), random);
}

/**
 * Exchanges the edges at two incoming slots of different crossings. Each edge
 * still enters once and leaves once, but the rotation system usually stops
 * being planar. Returns undefined when the result is not a valid diagram.
 */
export function rewired(d: LinkDiagram, random: () => number): LinkDiagram | undefined {
  if (d.crossings.length < 2) return undefined;
  const incoming: [number, number][] = [];
  d.crossings.forEach((c, ci) => c.edges.forEach((_, q) => slotIsIncoming(q, c.sign) && incoming.push([ci, q])));
  const [c1, q1] = incoming[randomInt(random, 0, incoming.length - 1)]!;
  const [c2, q2] = incoming[randomInt(random, 0, incoming.length - 1)]!;
  if (c1 === c2) return undefined;
  const raw = d.crossings.map((c) => ({ sign: c.sign, edges: [...c.edges] as [number, number, number, number] }));
  [raw[c1]!.edges[q1], raw[c2]!.edges[q2]] = [raw[c2]!.edges[q2]!, raw[c1]!.edges[q1]!];
  try {
    const result = assembleDiagram(raw, { notation: 'pd', freeLoops: d.freeLoops });
    return structuralProblem(result) ? undefined : result;
  } catch {
    return undefined;
  }
}
