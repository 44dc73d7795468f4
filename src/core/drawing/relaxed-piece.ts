/**
 * One packed piece of a diagram as a plane graph (crossings, edge ends and
 * midpoints joined along the strands), relaxed by relax.ts so that crossings
 * come out of similar size with right-angled arms, then written back.
 */
import { indexDiagram, type LinkDiagram } from '../diagram/model.ts';
import { relaxPlaneGraph, segmentRoom, type PlaneGraph } from './relax.ts';
import { crossingVertex, endVertex, midpointVertex } from './triangulation.ts';

/**
 * Relaxes the piece with these crossings in place (x, y indexed by packing
 * vertex) and fills, for each of its edges e, roomOut[4e + k] with the room
 * of the k-th straight segment along it (crossing, end, midpoint, end, crossing).
 */
export function relaxPiece(d: LinkDiagram, crossings: readonly number[], x: Float64Array, y: Float64Array, roomOut: Float64Array): void {
  const n = d.crossings.length;
  const { tail, head } = indexDiagram(d);
  const vertices: number[] = [];
  const local = new Map<number, number>();
  const add = (v: number): number => {
    const known = local.get(v);
    if (known !== undefined) return known;
    local.set(v, vertices.length);
    vertices.push(v);
    return vertices.length - 1;
  };
  const edges: number[] = [];
  for (const c of crossings) {
    add(crossingVertex(c));
    for (let q = 0; q < 4; q++) add(endVertex(n, 4 * c + q));
    for (let q = 0; q < 4; q++) if (tail[d.crossings[c]!.edges[q]!]!.crossing === c && tail[d.crossings[c]!.edges[q]!]!.slot === q) edges.push(d.crossings[c]!.edges[q]!);
  }
  edges.sort((a, b) => a - b);
  const segments: number[] = [];
  const straights: number[] = [];
  const crosses: number[] = [];
  const continuations: number[] = [];
  const isArm: number[] = [];
  for (const e of edges) {
    const t = tail[e]!;
    const h = head[e]!;
    const path = [crossingVertex(t.crossing), endVertex(n, 4 * t.crossing + t.slot), midpointVertex(n, e), endVertex(n, 4 * h.crossing + h.slot), crossingVertex(h.crossing)].map(add);
    for (let k = 0; k < 4; k++) segments.push(path[k]!, path[k + 1]!);
    isArm.push(1, 0, 0, 1);
    // Only the midpoint is pulled into line: pulling an edge end toward the line from
    // its crossing to the midpoint would fight the right-angled cross (and fold a curl shut).
    straights.push(path[1]!, path[2]!, path[3]!);
    // The midpoint is pulled on along each arm instead, which turns no arm.
    continuations.push(path[0]!, path[1]!, path[2]!, path[4]!, path[3]!, path[2]!);
  }
  for (const c of crossings) {
    const arm = (q: number): number => local.get(endVertex(n, 4 * c + q))!;
    const centre = local.get(crossingVertex(c))!;
    crosses.push(centre, arm(0), arm(1), arm(2), arm(3));
    straights.push(arm(0), centre, arm(2), arm(1), centre, arm(3));
  }
  const g: PlaneGraph = {
    x: Float64Array.from(vertices, (v) => x[v]!),
    y: Float64Array.from(vertices, (v) => y[v]!),
    segments: Int32Array.from(segments),
    straights: Int32Array.from(straights),
    crosses: Int32Array.from(crosses),
    continuations: Int32Array.from(continuations),
    charges: Int32Array.from(crossings, (c) => local.get(crossingVertex(c))!),
    isArm: Uint8Array.from(isArm),
  };
  const target = medianSegment(g);
  const packedRatio = crossingSizeRatio(g);
  // An even packing is left as it is: it is smoother than the relaxed picture.
  if (packedRatio >= EVEN_ENOUGH) {
    const packed = { x: g.x.slice(), y: g.y.slice() };
    relaxPlaneGraph(g, target);
    // A safeguard: should the forces leave a crossing pinched, or the piece no
    // more even, it keeps its packing.
    if (!crossesOpen(g) || crossingSizeRatio(g) >= packedRatio) {
      g.x.set(packed.x);
      g.y.set(packed.y);
    }
  }
  vertices.forEach((v, i) => {
    x[v] = g.x[i]!;
    y[v] = g.y[i]!;
  });
  const room = segmentRoom(g, target);
  edges.forEach((e, i) => {
    for (let k = 0; k < 4; k++) roomOut[4 * e + k] = room[4 * i + k]!;
  });
}

/** The crossing size ratio (largest over smallest shortest arm) from which a piece is relaxed: the target. */
const EVEN_ENOUGH = 2;

function crossingSizeRatio(g: PlaneGraph): number {
  const { x, y, crosses } = g;
  let least = Infinity;
  let most = 0;
  for (let i = 0; i < crosses.length; i += 5) {
    const c = crosses[i]!;
    let arm = Infinity;
    for (let q = 1; q <= 4; q++) arm = Math.min(arm, Math.hypot(x[crosses[i + q]!]! - x[c]!, y[crosses[i + q]!]! - y[c]!));
    least = Math.min(least, arm);
    most = Math.max(most, arm);
  }
  return most / least;
}

/** Least and greatest angle between consecutive arms of an acceptable crossing. */
const ARM_ANGLES = { min: (50 * Math.PI) / 180, max: (130 * Math.PI) / 180 };

function crossesOpen(g: PlaneGraph): boolean {
  const { x, y, crosses } = g;
  for (let i = 0; i < crosses.length; i += 5) {
    const c = crosses[i]!;
    for (let q = 0; q < 4; q++) {
      const a = crosses[i + 1 + q]!;
      const b = crosses[i + 1 + ((q + 1) & 3)]!;
      const ax = x[a]! - x[c]!;
      const ay = y[a]! - y[c]!;
      const bx = x[b]! - x[c]!;
      const by = y[b]! - y[c]!;
      const angle = Math.abs(Math.atan2(ax * by - ay * bx, ax * bx + ay * by));
      if (angle < ARM_ANGLES.min || angle > ARM_ANGLES.max) return false;
    }
  }
  return true;
}

function medianSegment(g: PlaneGraph): number {
  const lengths: number[] = [];
  for (let i = 0; i < g.segments.length; i += 2) {
    const a = g.segments[i]!;
    const b = g.segments[i + 1]!;
    lengths.push(Math.hypot(g.x[b]! - g.x[a]!, g.y[b]! - g.y[a]!));
  }
  lengths.sort((a, b) => a - b);
  return lengths[lengths.length >> 1]!;
}
