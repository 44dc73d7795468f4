/**
 * Circle packing of one triangulated disc: the radii by the uniform-neighbour
 * iteration of Collins & Stephenson ("A circle packing algorithm", Comput.
 * Geom. 25 (2003) 233–256) with their extrapolation step, then the centres by
 * laying out flower after flower.
 *
 * The disc is a triangulated sphere with one vertex (the outer face) removed.
 * Interior vertices get angle sum 2π. Each boundary vertex gets π minus an
 * equal share of the total turning 2π, so the boundary closes up as a round
 * convex curve and the circles near it keep about the size of the circles
 * inside (fixing boundary radii instead would squeeze or swell them).
 */
import { checkTimeBudget } from '../limits.ts';

export interface PackedDisc {
  /** Radius and centre for every vertex of the disc (indexes as in `flowers`; other vertices untouched). */
  readonly radius: Float64Array;
  readonly x: Float64Array;
  readonly y: Float64Array;
}

/** The angle at a circle of radius r in the triangle it forms with tangent circles of radii a and b. */
function cornerAngle(r: number, a: number, b: number): number {
  const s = (a * b) / ((r + a) * (r + b));
  return 2 * Math.asin(Math.sqrt(s));
}

/** The flower of v as an open chain when v lies on the boundary (the outer vertex cut out), else the closed cycle. */
function petals(flower: Int32Array, outer: number): { chain: Int32Array; closed: boolean } {
  const at = flower.indexOf(outer);
  if (at < 0) return { chain: flower, closed: true };
  const chain = new Int32Array(flower.length - 1);
  for (let i = 1; i < flower.length; i++) chain[i - 1] = flower[(at + i) % flower.length]!;
  return { chain, closed: false };
}

function angleSum(r: number, chain: Int32Array, closed: boolean, radius: Float64Array): number {
  let sum = 0;
  const k = closed ? chain.length : chain.length - 1;
  for (let i = 0; i < k; i++) sum += cornerAngle(r, radius[chain[i]!]!, radius[chain[(i + 1) % chain.length]!]!);
  return sum;
}

const TOLERANCE = 1e-9;
const MAX_SWEEPS = 50_000;

/**
 * Packs the disc made of `vertices` (the outer vertex excluded) and lays it out
 * with the first vertex at the origin. `flowers` are counterclockwise.
 */
export function packDisc(flowers: readonly Int32Array[], vertices: readonly number[], outer: number, radius: Float64Array, x: Float64Array, y: Float64Array): void {
  const flowerOf = vertices.map((v) => petals(flowers[v]!, outer));
  const boundary = vertices.filter((_, i) => !flowerOf[i]!.closed);
  for (const v of vertices) radius[v] = 1;
  // Equal turning at every boundary vertex: the boundary closes up as a round convex curve.
  const boundaryTarget = Math.PI - (2 * Math.PI) / boundary.length;
  const previous = new Float64Array(vertices.length);
  let error = Infinity;
  let lastRatio = 0;
  let extrapolated = false;
  for (let sweep = 0; sweep < MAX_SWEEPS && error > TOLERANCE * Math.sqrt(vertices.length); sweep++) {
    if ((sweep & 63) === 0) checkTimeBudget();
    vertices.forEach((v, i) => (previous[i] = radius[v]!));
    const before = error;
    let squares = 0;
    vertices.forEach((v, i) => {
      const { chain, closed } = flowerOf[i]!;
      const r = radius[v]!;
      const target = closed ? 2 * Math.PI : boundaryTarget;
      const k = closed ? chain.length : chain.length - 1;
      const sum = angleSum(r, chain, closed, radius);
      squares += (sum - target) ** 2;
      // Replace the petals by k equal ones with the same angle sum, then solve for the radius giving the target.
      const beta = Math.sin(sum / (2 * k));
      const delta = Math.sin(target / (2 * k));
      const petal = (r * beta) / (1 - beta);
      radius[v] = (petal * (1 - delta)) / delta;
    });
    error = Math.sqrt(squares);
    const ratio = error / before;
    // Collins–Stephenson's acceleration: once the error falls by a steady ratio, jump ahead along the last step.
    if (!extrapolated && ratio < 1 && Math.abs(ratio - lastRatio) < 0.01) {
      let factor = ratio / (1 - ratio);
      vertices.forEach((v, i) => {
        const step = radius[v]! - previous[i]!;
        if (step < 0) factor = Math.min(factor, (0.5 * radius[v]!) / -step);
      });
      vertices.forEach((v, i) => (radius[v] = radius[v]! + factor * (radius[v]! - previous[i]!)));
      extrapolated = true;
    } else extrapolated = false;
    lastRatio = ratio;
    // Angle sums do not see the scale: keep it near 1 so nothing under- or overflows.
    const scale = 1 / radius[vertices[0]!]!;
    for (const v of vertices) radius[v] = radius[v]! * scale;
  }
  layOut(flowers, vertices, flowerOf, radius, x, y);
}

/** Places the centres: the first vertex at the origin, then each closed flower around its placed centre. */
function layOut(flowers: readonly Int32Array[], vertices: readonly number[], flowerOf: readonly { chain: Int32Array; closed: boolean }[], radius: Float64Array, x: Float64Array, y: Float64Array): void {
  const placed = new Set<number>();
  const closedFlower = new Map<number, Int32Array>();
  vertices.forEach((v, i) => {
    if (flowerOf[i]!.closed) closedFlower.set(v, flowers[v]!);
  });
  const first = vertices[0]!;
  const firstFlower = flowers[first]!;
  x[first] = 0;
  y[first] = 0;
  placed.add(first);
  const w0 = firstFlower[0]!;
  x[w0] = radius[first]! + radius[w0]!;
  y[w0] = 0;
  placed.add(w0);
  const queue = [first];
  const done = new Set<number>([first]);
  for (let head = 0; head < queue.length; head++) {
    const v = queue[head]!;
    const flower = closedFlower.get(v)!;
    const k = flower.length;
    let start = 0;
    while (!placed.has(flower[start]!)) start++;
    let angle = Math.atan2(y[flower[start]!]! - y[v]!, x[flower[start]!]! - x[v]!);
    for (let step = 1; step < k; step++) {
      const a = flower[(start + step - 1) % k]!;
      const b = flower[(start + step) % k]!;
      angle += cornerAngle(radius[v]!, radius[a]!, radius[b]!);
      if (!placed.has(b)) {
        const distance = radius[v]! + radius[b]!;
        x[b] = x[v]! + distance * Math.cos(angle);
        y[b] = y[v]! + distance * Math.sin(angle);
        placed.add(b);
      }
    }
    for (const w of flower) {
      if (!done.has(w) && closedFlower.has(w)) {
        done.add(w);
        queue.push(w);
      }
    }
  }
}
