/**
 * Evening out a packed layout without changing its picture: the straight-line
 * graph of crossings and waypoints is moved by forces (springs that hold each
 * crossing's arms at one length and keep the other segments from getting
 * short, but pull long ones in only weakly, so an edge can be as long as its
 * route needs instead of crumpling; repulsion between points and segments, and
 * between all crossings at any distance, as charges, so crowded parts spread
 * into empty ones; strands pulled straight at midpoints and crossings, and on
 * along each arm's direction; the four arms of each crossing pulled to right
 * angles and equal length), while every point's step is capped so that no segment can
 * touch another during the step. So the relaxed graph has exactly the
 * crossings and the cyclic orders of the packed one, and the drawing built on
 * it is the same diagram.
 *
 * The capped step is the idea of F. Bertault, "A force-directed algorithm that
 * preserves edge crossing properties", Inf. Process. Lett. 74 (2000) 7–13, in a
 * simpler global form: for every point x and segment ab not incident to it at
 * distance d, each of x, a, b moves less than d/3, so after the step (and all
 * along it, since every point of a moving segment moves at most as far as its
 * farther end) the distance is still above d/3 > 0. Segments can only come to
 * cross by an end first touching the other segment, so none ever does.
 * Pairs farther apart than the reach R are covered by capping every step at R/3.
 */
import { checkTimeBudget } from '../limits.ts';

export interface PlaneGraph {
  /** Coordinates, changed in place. */
  readonly x: Float64Array;
  readonly y: Float64Array;
  /** Segments as pairs of point indices: [a0, b0, a1, b1, …]. */
  readonly segments: Int32Array;
  /** Triples (a, b, c) of consecutive points along a strand: b is pulled to the middle of a and c. */
  readonly straights: Int32Array;
  /** Five-tuples (centre, arm0, arm1, arm2, arm3), arms counterclockwise: pulled to a right-angled cross. */
  readonly crosses: Int32Array;
  /** Triples (a, b, c) along a strand: c is pulled onto the ray from a through b, keeping its distance from b. */
  readonly continuations: Int32Array;
  /** Points that repel each other at every distance, with a force falling as 1/distance. */
  readonly charges: Int32Array;
  /** Per segment: 1 for an arm (its rest length is the target), 0 for a segment that may be as short as SLACK_LENGTH. */
  readonly isArm: Uint8Array;
}

/** The fixed schedule: same input, same steps, same bytes. */
const ITERATIONS = 160;
const REACH = 2; // interaction reach, in target lengths
const SPRING = 0.5;
/**
 * A segment longer than its rest length is pulled in this much more weakly than
 * a short one is pushed out: the packing leaves outer edges long, and pulling
 * them to the length of the inner ones squeezes the inner strands into zigzags.
 */
const STRETCHED_SPRING = 0.1;
/** Rest length of a segment that is not an arm, in target lengths. */
const SLACK_LENGTH = 0.5;
const SEGMENT_REPULSION = 0.3;
const STRAIGHTEN = 0.2;
const CONTINUE = 0.3;
/** Charge repulsion: two charges at distance d push each other with CHARGE·target²/d. */
const CHARGE = 0.1;
const CROSS = 0.5;

/** Relaxes the graph toward segments of length `target`; moves points in place. */
export function relaxPlaneGraph(g: PlaneGraph, target: number): void {
  const count = g.x.length;
  const fx = new Float64Array(count);
  const fy = new Float64Array(count);
  const cap = new Float64Array(count);
  const cx = new Float64Array(count);
  const cy = new Float64Array(count);
  const reach = REACH * target;
  const turn = armTurns(g);
  for (let step = 0; step < ITERATIONS; step++) {
    if ((step & 15) === 0) checkTimeBudget();
    fx.fill(0);
    fy.fill(0);
    cap.fill(reach / 3);
    const grid = new SegmentGrid(g, reach);
    springs(g, target, fx, fy);
    straighten(g, fx, fy);
    continueArms(g, fx, fy);
    repelCharges(g, target, fx, fy);
    cx.fill(0);
    cy.fill(0);
    crosses(g, turn, target, cx, cy);
    nearPairs(g, grid, target, reach, fx, fy, cap);
    const cooling = 1 - (0.8 * step) / ITERATIONS;
    for (let v = 0; v < count; v++) {
      // The crosses are not cooled: every step goes as far toward right angles as the caps allow.
      let dx = fx[v]! * cooling + cx[v]!;
      let dy = fy[v]! * cooling + cy[v]!;
      const length = Math.hypot(dx, dy);
      // Strictly below the cap, so equality never lets two things touch.
      const limit = 0.99 * cap[v]!;
      if (length > limit) {
        dx *= limit / length;
        dy *= limit / length;
      }
      g.x[v] = g.x[v]! + dx;
      g.y[v] = g.y[v]! + dy;
    }
  }
}

function springs(g: PlaneGraph, target: number, fx: Float64Array, fy: Float64Array): void {
  const { x, y, segments } = g;
  for (let i = 0; i < segments.length; i += 2) {
    const a = segments[i]!;
    const b = segments[i + 1]!;
    const dx = x[b]! - x[a]!;
    const dy = y[b]! - y[a]!;
    const length = Math.hypot(dx, dy) || 1e-12;
    const rest = g.isArm[i >> 1] ? target : SLACK_LENGTH * target;
    const pull = ((length > rest ? STRETCHED_SPRING : SPRING) * (length - rest)) / length;
    fx[a] = fx[a]! + pull * dx;
    fy[a] = fy[a]! + pull * dy;
    fx[b] = fx[b]! - pull * dx;
    fy[b] = fy[b]! - pull * dy;
  }
}

function straighten(g: PlaneGraph, fx: Float64Array, fy: Float64Array): void {
  const { x, y, straights } = g;
  for (let i = 0; i < straights.length; i += 3) {
    const a = straights[i]!;
    const b = straights[i + 1]!;
    const c = straights[i + 2]!;
    fx[b] = fx[b]! + STRAIGHTEN * ((x[a]! + x[c]!) / 2 - x[b]!);
    fy[b] = fy[b]! + STRAIGHTEN * ((y[a]! + y[c]!) / 2 - y[b]!);
  }
}

/** The last point of each continuation triple is pulled to where the strand would go on straight. */
function continueArms(g: PlaneGraph, fx: Float64Array, fy: Float64Array): void {
  const { x, y, continuations: list } = g;
  for (let i = 0; i < list.length; i += 3) {
    const a = list[i]!;
    const b = list[i + 1]!;
    const c = list[i + 2]!;
    const ux = x[b]! - x[a]!;
    const uy = y[b]! - y[a]!;
    const along = Math.hypot(x[c]! - x[b]!, y[c]! - y[b]!) / (Math.hypot(ux, uy) || 1e-12);
    fx[c] = fx[c]! + CONTINUE * (x[b]! + ux * along - x[c]!);
    fy[c] = fy[c]! + CONTINUE * (y[b]! + uy * along - y[c]!);
  }
}

/**
 * Every pair of charges pushes apart with CHARGE·target²/distance (the
 * repulsion of Fruchterman and Reingold's force-directed layout), so a crowded
 * part of the picture spreads into empty room however far away it is. Only the
 * crossings are charged, so the pairs stay few enough (n²/2 per step).
 */
function repelCharges(g: PlaneGraph, target: number, fx: Float64Array, fy: Float64Array): void {
  const { x, y, charges: list } = g;
  const strength = CHARGE * target * target;
  for (let i = 0; i < list.length; i++) {
    const a = list[i]!;
    for (let j = i + 1; j < list.length; j++) {
      const b = list[j]!;
      const dx = x[a]! - x[b]!;
      const dy = y[a]! - y[b]!;
      const push = strength / (dx * dx + dy * dy || 1e-12);
      fx[a] = fx[a]! + push * dx;
      fy[a] = fy[a]! + push * dy;
      fx[b] = fx[b]! - push * dx;
      fy[b] = fy[b]! - push * dy;
    }
  }
}

/**
 * Per cross, +1 when its arms follow each other counterclockwise, −1 when
 * clockwise (the sign of the summed turns from each arm to the next), read once
 * from the start: the steps keep the cyclic order, so it never changes.
 */
function armTurns(g: PlaneGraph): Int8Array {
  const { x, y, crosses: list } = g;
  const turn = new Int8Array(list.length / 5);
  for (let i = 0; i < list.length; i += 5) {
    const c = list[i]!;
    let sum = 0;
    for (let q = 0; q < 4; q++) {
      const a = list[i + 1 + q]!;
      const b = list[i + 1 + ((q + 1) & 3)]!;
      sum += Math.atan2((x[a]! - x[c]!) * (y[b]! - y[c]!) - (y[a]! - y[c]!) * (x[b]! - x[c]!), (x[a]! - x[c]!) * (x[b]! - x[c]!) + (y[a]! - y[c]!) * (y[b]! - y[c]!));
    }
    turn[i / 5] = sum >= 0 ? 1 : -1;
  }
  return turn;
}

/**
 * Each arm is pulled to where a right-angled cross of arm length `target`
 * would put it, the cross turned to fit the arms best (the mean of the arms'
 * directions with the quarter turns taken out, averaged as 4θ).
 */
function crosses(g: PlaneGraph, turn: Int8Array, target: number, fx: Float64Array, fy: Float64Array): void {
  const { x, y, crosses: list } = g;
  for (let i = 0; i < list.length; i += 5) {
    const c = list[i]!;
    let sx = 0;
    let sy = 0;
    for (let q = 0; q < 4; q++) {
      const arm = list[i + 1 + q]!;
      const theta = Math.atan2(y[arm]! - y[c]!, x[arm]! - x[c]!);
      sx += Math.cos(4 * theta);
      sy += Math.sin(4 * theta);
    }
    const base = Math.atan2(sy, sx) / 4;
    // The quarter turn that the first arm is nearest to fixes the labelling of the others.
    const first = list[i + 1]!;
    const theta0 = Math.atan2(y[first]! - y[c]!, x[first]! - x[c]!);
    const k = Math.round((theta0 - base) / (Math.PI / 2));
    for (let q = 0; q < 4; q++) {
      const arm = list[i + 1 + q]!;
      const angle = base + ((k + turn[i / 5]! * q) * Math.PI) / 2;
      fx[arm] = fx[arm]! + CROSS * (x[c]! + target * Math.cos(angle) - x[arm]!);
      fy[arm] = fy[arm]! + CROSS * (y[c]! + target * Math.sin(angle) - y[arm]!);
    }
  }
}

/** Segments bucketed by the grid cells their bounding boxes touch (cell side: the reach). */
export class SegmentGrid {
  private readonly cells = new Map<number, number[]>();
  private readonly side: number;
  private readonly originX: number;
  private readonly originY: number;

  constructor(g: PlaneGraph, side: number) {
    this.side = side;
    let minX = Infinity;
    let minY = Infinity;
    for (let v = 0; v < g.x.length; v++) {
      minX = Math.min(minX, g.x[v]!);
      minY = Math.min(minY, g.y[v]!);
    }
    this.originX = minX - side;
    this.originY = minY - side;
    const { x, y, segments } = g;
    for (let i = 0; i < segments.length; i += 2) {
      const a = segments[i]!;
      const b = segments[i + 1]!;
      const [x0, x1] = [this.column(Math.min(x[a]!, x[b]!)), this.column(Math.max(x[a]!, x[b]!))];
      const [y0, y1] = [this.row(Math.min(y[a]!, y[b]!)), this.row(Math.max(y[a]!, y[b]!))];
      for (let cx = x0; cx <= x1; cx++) {
        for (let cy = y0; cy <= y1; cy++) {
          const key = cellKey(cx, cy);
          const list = this.cells.get(key);
          if (list) list.push(i >> 1);
          else this.cells.set(key, [i >> 1]);
        }
      }
    }
  }

  column(x: number): number {
    return Math.floor((x - this.originX) / this.side);
  }

  row(y: number): number {
    return Math.floor((y - this.originY) / this.side);
  }

  /** Every segment whose box touches the cells around (px, py), each once, in increasing order. */
  near(px: number, py: number, seen: Int32Array, stamp: number): number[] {
    const found: number[] = [];
    const cx = this.column(px);
    const cy = this.row(py);
    for (let dx = -1; dx <= 1; dx++) {
      for (let dy = -1; dy <= 1; dy++) {
        for (const s of this.cells.get(cellKey(cx + dx, cy + dy)) ?? []) {
          if (seen[s] === stamp) continue;
          seen[s] = stamp;
          found.push(s);
        }
      }
    }
    return found.sort((a, b) => a - b);
  }
}

const cellKey = (cx: number, cy: number): number => cx * 1_048_576 + cy;

/** The distance from (px, py) to segment ab, and the parameter of the nearest point. */
export function pointSegment(px: number, py: number, ax: number, ay: number, bx: number, by: number): { d: number; t: number } {
  const ux = bx - ax;
  const uy = by - ay;
  const length2 = ux * ux + uy * uy;
  const t = length2 === 0 ? 0 : Math.max(0, Math.min(1, ((px - ax) * ux + (py - ay) * uy) / length2));
  return { d: Math.hypot(px - ax - t * ux, py - ay - t * uy), t };
}

/**
 * Point–segment pairs within reach: repulsion closer than the target length,
 * and the caps that keep the embedding.
 */
function nearPairs(g: PlaneGraph, grid: SegmentGrid, target: number, reach: number, fx: Float64Array, fy: Float64Array, cap: Float64Array): void {
  const { x, y, segments } = g;
  const seen = new Int32Array(segments.length >> 1).fill(-1);
  for (let v = 0; v < x.length; v++) {
    const px = x[v]!;
    const py = y[v]!;
    for (const s of grid.near(px, py, seen, v)) {
      const a = segments[2 * s]!;
      const b = segments[2 * s + 1]!;
      if (a === v || b === v) continue;
      const { d, t } = pointSegment(px, py, x[a]!, y[a]!, x[b]!, y[b]!);
      if (d >= reach) continue;
      const third = d / 3;
      if (third < cap[v]!) cap[v] = third;
      if (third < cap[a]!) cap[a] = third;
      if (third < cap[b]!) cap[b] = third;
      if (d < target && d > 0) {
        const push = SEGMENT_REPULSION * (target / d - 1) * target;
        const nx = (px - x[a]! - t * (x[b]! - x[a]!)) / d;
        const ny = (py - y[a]! - t * (y[b]! - y[a]!)) / d;
        fx[v] = fx[v]! + push * nx;
        fy[v] = fy[v]! + push * ny;
        fx[a] = fx[a]! - (1 - t) * push * nx * 0.5;
        fy[a] = fy[a]! - (1 - t) * push * ny * 0.5;
        fx[b] = fx[b]! - t * push * nx * 0.5;
        fy[b] = fy[b]! - t * push * ny * 0.5;
      }
    }
  }
}

/**
 * For each segment, a lower bound on its distance to every segment that shares
 * no point with it (at most the reach): the room a curve along it has to bend
 * in. Two segments that do not cross are nearest at an end of one of them, so
 * the bound is the least distance from any point to the segment, or from the
 * segment's ends to any segment not at that end.
 */
export function segmentRoom(g: PlaneGraph, target: number): Float64Array {
  const { x, y, segments } = g;
  const reach = REACH * target;
  const grid = new SegmentGrid(g, reach);
  const room = new Float64Array(segments.length >> 1).fill(reach);
  const fromPoint = new Float64Array(x.length).fill(reach);
  const seen = new Int32Array(segments.length >> 1).fill(-1);
  for (let v = 0; v < x.length; v++) {
    for (const s of grid.near(x[v]!, y[v]!, seen, v)) {
      const a = segments[2 * s]!;
      const b = segments[2 * s + 1]!;
      if (a === v || b === v) continue;
      const { d } = pointSegment(x[v]!, y[v]!, x[a]!, y[a]!, x[b]!, y[b]!);
      if (d < room[s]!) room[s] = d;
      if (d < fromPoint[v]!) fromPoint[v] = d;
    }
  }
  for (let s = 0; s < room.length; s++) {
    room[s] = Math.min(room[s]!, fromPoint[segments[2 * s]!]!, fromPoint[segments[2 * s + 1]!]!);
  }
  return room;
}
