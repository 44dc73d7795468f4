/**
 * Reading a drawing back into a diagram, using nothing but its geometry: the
 * crossings are where the drawn centre lines intersect, the strand broken there
 * (no ink just before and after the intersection) is the under-strand, and
 * walking each curve gives the edges. The tests compare the result with the
 * diagram the drawing was made from (`sameDiagram`): equal up to relabelling
 * means the figure shows exactly the code's diagram.
 */
import { assembleDiagram, type RawCrossing } from '../diagram/assemble.ts';

import { indexDiagram, type LinkDiagram, type Sign } from '../diagram/model.ts';
import type { Drawing } from './drawing.ts';
import { flattenCubic, type Cubic, type Point } from './geometry.ts';

/** Samples per cubic when flattening; the waypoints are close, so a few dozen follow each piece closely. */
const SAMPLES = 32;

interface Polyline {
  readonly points: readonly Point[];
  readonly closed: boolean;
}

export interface Intersection {
  readonly at: Point;
  /** The two strands: component, position along its centre line (segment index + fraction), direction of travel. */
  readonly strands: readonly [StrandPass, StrandPass];
}

export interface StrandPass {
  readonly component: number;
  readonly position: number;
  readonly direction: Point;
}

function flatten(cubics: readonly Cubic[], closed: boolean): Polyline {
  const points = cubics.flatMap((k) => flattenCubic(k, SAMPLES));
  // An open stroke keeps its true ends, so ink reaches exactly where it is drawn.
  if (!closed && cubics.length > 0) return { points: [cubics[0]!.from, ...points, cubics[cubics.length - 1]!.to], closed };
  return { points, closed };
}

interface Segment {
  readonly line: number;
  readonly index: number;
  readonly a: Point;
  readonly b: Point;
}

function segmentsOf(lines: readonly Polyline[]): Segment[] {
  const result: Segment[] = [];
  lines.forEach((line, k) => {
    const n = line.points.length;
    const count = line.closed ? n : n - 1;
    for (let i = 0; i < count; i++) result.push({ line: k, index: i, a: line.points[i]!, b: line.points[(i + 1) % n]! });
  });
  return result;
}

/** Segments bucketed by the grid cells their bounding boxes touch. */
class SegmentGrid {
  private readonly cells = new Map<string, number[]>();
  constructor(
    readonly segments: readonly Segment[],
    readonly cell: number,
  ) {
    segments.forEach((s, i) => this.forCells(s.a, s.b, 0, (key) => {
      const list = this.cells.get(key);
      if (list) list.push(i);
      else this.cells.set(key, [i]);
    }));
  }
  private forCells(a: Point, b: Point, pad: number, visit: (key: string) => void): void {
    const x0 = Math.floor((Math.min(a.x, b.x) - pad) / this.cell);
    const x1 = Math.floor((Math.max(a.x, b.x) + pad) / this.cell);
    const y0 = Math.floor((Math.min(a.y, b.y) - pad) / this.cell);
    const y1 = Math.floor((Math.max(a.y, b.y) + pad) / this.cell);
    for (let x = x0; x <= x1; x++) for (let y = y0; y <= y1; y++) visit(`${x},${y}`);
  }
  /** Indexes of segments whose cells meet the box of a–b grown by `pad`, each once. */
  near(a: Point, b: Point, pad: number): Set<number> {
    const found = new Set<number>();
    this.forCells(a, b, pad, (key) => this.cells.get(key)?.forEach((i) => found.add(i)));
    return found;
  }
}

const cross = (ux: number, uy: number, vx: number, vy: number): number => ux * vy - uy * vx;

/** The proper intersection of two segments as fractions along each, or undefined. */
function segmentIntersection(s: Segment, t: Segment): { u: number; v: number } | undefined {
  const rx = s.b.x - s.a.x;
  const ry = s.b.y - s.a.y;
  const qx = t.b.x - t.a.x;
  const qy = t.b.y - t.a.y;
  const denominator = cross(rx, ry, qx, qy);
  if (denominator === 0) return undefined;
  const wx = t.a.x - s.a.x;
  const wy = t.a.y - s.a.y;
  const u = cross(wx, wy, qx, qy) / denominator;
  const v = cross(wx, wy, rx, ry) / denominator;
  return u >= 0 && u < 1 && v >= 0 && v < 1 ? { u, v } : undefined;
}

function unit(a: Point, b: Point): Point {
  const length = Math.hypot(b.x - a.x, b.y - a.y) || 1;
  return { x: (b.x - a.x) / length, y: (b.y - a.y) / length };
}

/** Every point where the centre lines meet (a curve meeting itself included), ordered by place. */
export function centreLineIntersections(drawing: Drawing): Intersection[] {
  const lines = drawing.components.map((c) => flatten(c.centreLine, true));
  const segments = segmentsOf(lines);
  const grid = new SegmentGrid(segments, Math.max(1e-9, drawing.edgeLength / 4));
  const result: Intersection[] = [];
  segments.forEach((s, i) => {
    for (const j of grid.near(s.a, s.b, 0)) {
      if (j <= i) continue;
      const t = segments[j]!;
      if (s.line === t.line) {
        const n = lines[s.line]!.points.length;
        const apart = Math.abs(s.index - t.index);
        if (apart <= 1 || apart === n - 1) continue; // neighbours share an end point
      }
      const hit = segmentIntersection(s, t);
      if (!hit) continue;
      const at = { x: s.a.x + (s.b.x - s.a.x) * hit.u, y: s.a.y + (s.b.y - s.a.y) * hit.u };
      result.push({
        at,
        strands: [
          { component: s.line, position: s.index + hit.u, direction: unit(s.a, s.b) },
          { component: t.line, position: t.index + hit.v, direction: unit(t.a, t.b) },
        ],
      });
    }
  });
  return result;
}

/** Whether some drawn stroke passes within `tolerance` of a point. */
function inkNear(grid: SegmentGrid, p: Point, tolerance: number): boolean {
  for (const i of grid.near(p, p, tolerance)) {
    const s = grid.segments[i]!;
    const dx = s.b.x - s.a.x;
    const dy = s.b.y - s.a.y;
    const length2 = dx * dx + dy * dy;
    const t = length2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - s.a.x) * dx + (p.y - s.a.y) * dy) / length2));
    if (Math.hypot(s.a.x + t * dx - p.x, s.a.y + t * dy - p.y) <= tolerance) return true;
  }
  return false;
}

export interface ReadBack {
  /** The diagram the drawing shows, when every intersection has exactly one broken strand. */
  readonly diagram: LinkDiagram | undefined;
  readonly intersections: readonly Intersection[];
  /** What makes the drawing unreadable, one line per place. */
  readonly problems: readonly string[];
}

export function readBackDrawing(drawing: Drawing): ReadBack {
  const intersections = centreLineIntersections(drawing);
  const strokeLines = drawing.components.flatMap((c) => c.strokes.map((s) => flatten(s.cubics, s.closed)));
  const strokeGrid = new SegmentGrid(segmentsOf(strokeLines), Math.max(1e-9, drawing.edgeLength / 4));
  const problems: string[] = [];
  // For each intersection: which of its two strands is broken (no ink a little before and after).
  const underIndex = intersections.map((x) => {
    // Look a quarter of the nearest crossing's break before and after the intersection.
    const probe = nearestCrossing(drawing, x.at).gap / 4;
    const tolerance = probe / 3;
    const broken = x.strands.map((s) => {
      const before = { x: x.at.x - s.direction.x * probe, y: x.at.y - s.direction.y * probe };
      const after = { x: x.at.x + s.direction.x * probe, y: x.at.y + s.direction.y * probe };
      return !inkNear(strokeGrid, before, tolerance) && !inkNear(strokeGrid, after, tolerance);
    });
    if (broken[0] === broken[1]) {
      problems.push(`at (${x.at.x.toFixed(1)}, ${x.at.y.toFixed(1)}) ${broken[0] ? 'both strands are' : 'neither strand is'} broken`);
      return -1;
    }
    return broken[0] ? 0 : 1;
  });
  if (problems.length > 0) return { diagram: undefined, intersections, problems };
  return { diagram: rebuild(drawing, intersections, underIndex), intersections, problems };
}

function nearestCrossing(drawing: Drawing, p: Point): Drawing['crossings'][number] {
  let best = drawing.crossings[0]!;
  for (const c of drawing.crossings) if (Math.hypot(c.at.x - p.x, c.at.y - p.y) < Math.hypot(best.at.x - p.x, best.at.y - p.y)) best = c;
  return best;
}

/** The diagram of the intersections: edges are the arcs between consecutive intersections along each curve. */
function rebuild(drawing: Drawing, intersections: readonly Intersection[], underIndex: readonly number[]): LinkDiagram {
  // Each pass of a curve through an intersection, in order along its component.
  const passes = drawing.components.map(() => [] as { crossing: number; strand: number; position: number }[]);
  intersections.forEach((x, i) => x.strands.forEach((s, k) => passes[s.component]!.push({ crossing: i, strand: k, position: s.position })));
  // Arc labels: the arc leaving pass p of component c is label(c, p); it enters the next pass.
  const outgoing = new Map<string, number>();
  const incoming = new Map<string, number>();
  let label = 0;
  let freeLoops = 0;
  for (const list of passes) {
    if (list.length === 0) {
      freeLoops++;
      continue;
    }
    list.sort((a, b) => a.position - b.position);
    list.forEach((pass, p) => {
      const next = list[(p + 1) % list.length]!;
      outgoing.set(`${pass.crossing}:${pass.strand}`, label);
      incoming.set(`${next.crossing}:${next.strand}`, label);
      label++;
    });
  }
  const raw: RawCrossing[] = intersections.map((x, i) => {
    const under = underIndex[i]!;
    const over = 1 - under;
    const du = x.strands[under]!.direction;
    const dover = x.strands[over]!.direction;
    // Counterclockwise from the incoming under end (direction −du): the over end on its left comes next.
    const outOverNext = cross(-du.x, -du.y, dover.x, dover.y) > 0;
    const inU = incoming.get(`${i}:${under}`)!;
    const outU = outgoing.get(`${i}:${under}`)!;
    const inO = incoming.get(`${i}:${over}`)!;
    const outO = outgoing.get(`${i}:${over}`)!;
    const sign: Sign = outOverNext ? 1 : -1;
    return { edges: outOverNext ? [inU, outO, outU, inO] : [inU, inO, outU, outO], sign };
  });
  return assembleDiagram(raw, { notation: 'pd', freeLoops });
}

/**
 * Whether two diagrams are the same oriented diagram on the sphere up to the
 * numbering of crossings and edges: a bijection of crossings keeping signs,
 * slots and which slot each edge joins. Pieces are matched one by one, each by
 * trying every image of its first crossing and following the edges.
 */
export function sameDiagram(a: LinkDiagram, b: LinkDiagram): boolean {
  if (a.crossings.length !== b.crossings.length || a.freeLoops !== b.freeLoops || a.components.length !== b.components.length) return false;
  const n = a.crossings.length;
  const oppA = indexDiagram(a).opposite;
  const oppB = indexDiagram(b).opposite;
  const usedB = new Uint8Array(n);
  const doneA = new Uint8Array(n);
  for (let root = 0; root < n; root++) {
    if (doneA[root]) continue;
    let matched: Int32Array | undefined;
    for (let image = 0; image < n && !matched; image++) {
      if (usedB[image]) continue;
      matched = extendMatch(a, b, oppA, oppB, root, image, usedB);
    }
    if (!matched) return false;
    for (let c = 0; c < n; c++) {
      if (matched[c]! >= 0) {
        usedB[matched[c]!] = 1;
        doneA[c] = 1;
      }
    }
  }
  return true;
}

/** The map of crossings of a's piece of `root` into b sending root to `image`, or undefined when it fails. */
function extendMatch(a: LinkDiagram, b: LinkDiagram, oppA: Int32Array, oppB: Int32Array, root: number, image: number, usedB: Uint8Array): Int32Array | undefined {
  const n = a.crossings.length;
  const map = new Int32Array(n).fill(-1);
  const taken = new Uint8Array(n);
  const stack = [root];
  map[root] = image;
  taken[image] = 1;
  while (stack.length > 0) {
    const c = stack.pop()!;
    const d = map[c]!;
    if (a.crossings[c]!.sign !== b.crossings[d]!.sign) return undefined;
    for (let q = 0; q < 4; q++) {
      const sa = oppA[4 * c + q]!;
      const sb = oppB[4 * d + q]!;
      if ((sa & 3) !== (sb & 3)) return undefined;
      const ca = sa >> 2;
      const cb = sb >> 2;
      if (map[ca]! >= 0) {
        if (map[ca] !== cb) return undefined;
        continue;
      }
      if (taken[cb] || usedB[cb]) return undefined;
      map[ca] = cb;
      taken[cb] = 1;
      stack.push(ca);
    }
  }
  return map;
}
