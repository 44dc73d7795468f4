/**
 * Smooth curves through the laid-out waypoints: each component is one closed
 * chain of cubic Béziers through crossing, end, midpoint, end, crossing, …,
 * with the tangent at each waypoint along the chord of its two neighbours
 * (a chord-length Catmull–Rom spline), so tangents are continuous and a strand
 * passes straight through each crossing. The drawn strokes are this chain with
 * the under-passes cut out.
 */
import { indexDiagram, type LinkDiagram } from '../diagram/model.ts';
import { cubicLength, distance, parameterAtLength, reverseCubic, splitCubic, type Cubic, type Point } from './geometry.ts';
import type { DiagramLayout } from './layout.ts';

export interface ComponentChain {
  readonly points: readonly Point[];
  /** For the cubic from each point to the next: how far it may bend away from its chord (layout.segmentRoom). */
  readonly room: readonly number[];
  /** For each crossing the component passes: index in `points`, the crossing, and whether it passes under there. */
  readonly visits: readonly { readonly at: number; readonly crossing: number; readonly under: boolean }[];
  /** For each edge of the component: its index in `points` (its midpoint) and the edge. */
  readonly midpoints: readonly { readonly at: number; readonly edge: number }[];
}

export function componentChain(d: LinkDiagram, layout: DiagramLayout, component: number): ComponentChain {
  const { tail, head } = indexDiagram(d);
  const points: Point[] = [];
  const room: number[] = [];
  const visits: { at: number; crossing: number; under: boolean }[] = [];
  const midpoints: { at: number; edge: number }[] = [];
  for (const edge of d.components[component]!) {
    const from = tail[edge]!;
    const to = head[edge]!;
    visits.push({ at: points.length, crossing: from.crossing, under: from.slot === 2 });
    points.push(layout.crossing[from.crossing]!, layout.end[4 * from.crossing + from.slot]!);
    room.push(layout.segmentRoom[4 * edge]!, layout.segmentRoom[4 * edge + 1]!);
    midpoints.push({ at: points.length, edge });
    points.push(layout.midpoint[edge]!, layout.end[4 * to.crossing + to.slot]!);
    room.push(layout.segmentRoom[4 * edge + 2]!, layout.segmentRoom[4 * edge + 3]!);
  }
  return { points, room, visits, midpoints };
}

/** The tangent direction (scaled as a derivative by arc length, so at most 1 long) at each point of a closed chain. */
export function chainTangents(points: readonly Point[]): Point[] {
  const n = points.length;
  return points.map((_, i) => {
    const before = points[(i + n - 1) % n]!;
    const after = points[(i + 1) % n]!;
    const span = distance(before, points[i]!) + distance(points[i]!, after) || 1;
    return { x: (after.x - before.x) / span, y: (after.y - before.y) / span };
  });
}

/**
 * Cubic i runs from points[i] to points[i+1] (cyclically). Both its control
 * points stay within `ARM_ROOM` of room[i] of their ends, so the cubic (inside
 * the hull of its control points) keeps within ARM_ROOM·room[i] of its chord;
 * two chords sharing no point are at least that room apart, so with
 * ARM_ROOM < ½ their curves cannot meet, whatever the tangents (of length at most 1).
 */
export function smoothClosedChain(points: readonly Point[], room?: readonly number[], m: readonly Point[] = chainTangents(points)): Cubic[] {
  const n = points.length;
  const arm = (i: number, third: number): number => Math.min(third, room ? ARM_ROOM * room[i]! : Infinity);
  return points.map((p, i) => {
    const j = (i + 1) % n;
    const q = points[j]!;
    const third = distance(p, q) / 3;
    const mp = m[i]!;
    const mq = m[j]!;
    const a = arm(i, third);
    return { from: p, c1: { x: p.x + mp.x * a, y: p.y + mp.y * a }, c2: { x: q.x - mq.x * a, y: q.y - mq.y * a }, to: q };
  });
}

const ARM_ROOM = 0.45;

/**
 * The two strands' unit tangents at a crossing turned symmetrically about
 * their bisectors until they are perpendicular, so the strands cross at 90°
 * and the broken one is told apart clearly.
 */
export function perpendicularPair(u: Point, v: Point): [Point, Point] {
  const unit = (p: Point): Point => {
    const l = Math.hypot(p.x, p.y) || 1;
    return { x: p.x / l, y: p.y / l };
  };
  const a = unit(u);
  const b = unit(v);
  const w1 = unit({ x: a.x + b.x, y: a.y + b.y });
  const w2 = unit({ x: a.x - b.x, y: a.y - b.y });
  return [unit({ x: w1.x + w2.x, y: w1.y + w2.y }), unit({ x: w1.x - w2.x, y: w1.y - w2.y })];
}

/** A drawn piece of a component: a run of cubics, closed when the component never passes under. */
export interface Stroke {
  readonly cubics: readonly Cubic[];
  readonly closed: boolean;
}

function trimStart(k: Cubic, length: number): Cubic {
  return splitCubic(k, parameterAtLength(k, length))[1];
}

function trimEnd(k: Cubic, length: number): Cubic {
  return reverseCubic(trimStart(reverseCubic(k), length));
}

/**
 * The strokes of a closed chain cut at the given junctions (cubic index `at`
 * starts at the crossing), `half` the length taken away on each side. A cut is
 * never longer than 90% of the cubic it shortens.
 */
export function cutStrokes(cubics: readonly Cubic[], cuts: readonly { readonly at: number; readonly half: number }[]): Stroke[] {
  if (cuts.length === 0) return [{ cubics, closed: true }];
  const n = cubics.length;
  const sorted = [...cuts].sort((a, b) => a.at - b.at);
  return sorted.map((cut, i) => {
    const next = sorted[(i + 1) % sorted.length]!;
    const count = ((next.at - cut.at + n - 1) % n) + 1;
    const run = Array.from({ length: count }, (_, j) => cubics[(cut.at + j) % n]!);
    const first = run[0]!;
    run[0] = trimStart(first, Math.min(cut.half, 0.9 * cubicLength(first)));
    const last = run[count - 1]!;
    run[count - 1] = trimEnd(last, Math.min(next.half, 0.9 * cubicLength(last)));
    return { cubics: run, closed: false };
  });
}

/** A circle as four cubics, counterclockwise from its rightmost point. */
export function circleCubics(centre: Point, radius: number): Cubic[] {
  const k = 0.5522847498 * radius; // the usual quarter-circle control distance, 4(√2−1)/3
  const at = (dx: number, dy: number): Point => ({ x: centre.x + dx, y: centre.y + dy });
  return [
    { from: at(radius, 0), c1: at(radius, k), c2: at(k, radius), to: at(0, radius) },
    { from: at(0, radius), c1: at(-k, radius), c2: at(-radius, k), to: at(-radius, 0) },
    { from: at(-radius, 0), c1: at(-radius, -k), c2: at(-k, -radius), to: at(0, -radius) },
    { from: at(0, -radius), c1: at(k, -radius), c2: at(radius, -k), to: at(radius, 0) },
  ];
}
