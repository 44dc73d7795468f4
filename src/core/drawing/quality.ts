/**
 * How good a drawing looks, in the numbers the benchmark reports: how much
 * the crossings differ in size, how close two strands come away from the
 * crossings (relative to the typical edge length), the range of angles at
 * which strands cross (90° is best), and how much the strands bend (a picture
 * can make its crossings even by crumpling its strands, so evenness alone is
 * no measure of a good figure).
 */
import type { Drawing } from './drawing.ts';
import { flattenCubic, type Point } from './geometry.ts';
import { centreLineIntersections } from './read-back.ts';

export interface FigureQuality {
  /** Largest over smallest crossing size (half the shortest arm from a crossing to its edge-end waypoints); 1 is uniform. */
  readonly crossingSizeRatio: number;
  /** Smallest distance between two strands outside the crossings, over the typical edge length (capped at 0.5). */
  readonly closestStrands: number;
  /** The smallest and largest angle between the two strands at a crossing, in degrees (0–90). */
  readonly crossingAngles: { readonly min: number; readonly max: number };
  /**
   * How the centre lines turn, in degrees: `sharpest` is the most they turn
   * along any stretch a quarter of the typical edge length long (a kink), and
   * `perEdge` the total turning (left and right both counted) per typical edge
   * length (waviness). A round circle of twelve edge lengths turns 30° per edge.
   */
  readonly bends: { readonly sharpest: number; readonly perEdge: number };
}

const SAMPLES = 12;
const CAP = 0.5;

export function figureQuality(drawing: Drawing): FigureQuality {
  const sizes = drawing.crossings.map((c) => c.size);
  const angles = centreLineIntersections(drawing).map((x) => {
    const [a, b] = x.strands;
    const cosine = Math.abs(a.direction.x * b.direction.x + a.direction.y * b.direction.y);
    return (Math.acos(Math.min(1, cosine)) * 180) / Math.PI;
  });
  return {
    crossingSizeRatio: sizes.length === 0 ? 1 : Math.max(...sizes) / Math.min(...sizes),
    closestStrands: closestStrands(drawing),
    crossingAngles: angles.length === 0 ? { min: 90, max: 90 } : { min: Math.min(...angles), max: Math.max(...angles) },
    bends: bends(drawing),
  };
}

/** The stretch over which turning counts as one kink, in typical edge lengths. */
const KINK_STRETCH = 0.25;

function bends(drawing: Drawing): { sharpest: number; perEdge: number } {
  const unit = drawing.edgeLength;
  let sharpest = 0;
  let turning = 0;
  let length = 0;
  for (const component of drawing.components) {
    const points = component.centreLine.flatMap((k) => flattenCubic(k, SAMPLES));
    const n = points.length;
    // At point i: the length of the chord arriving there and the turn from it to the chord leaving.
    const chord = points.map((p, i) => Math.hypot(p.x - points[(i + n - 1) % n]!.x, p.y - points[(i + n - 1) % n]!.y));
    const turn = points.map((p, i) => {
      const a = points[(i + n - 1) % n]!;
      const b = points[(i + 1) % n]!;
      return Math.abs(Math.atan2((p.x - a.x) * (b.y - p.y) - (p.y - a.y) * (b.x - p.x), (p.x - a.x) * (b.x - p.x) + (p.y - a.y) * (b.y - p.y)));
    });
    turning += turn.reduce((s, t) => s + t, 0);
    length += chord.reduce((s, c) => s + c, 0);
    // A window of points whose chords sum to at most the stretch, slid once round the closed line.
    let end = 0;
    let span = 0;
    let inWindow = 0;
    for (let start = 0; start < n; start++) {
      while (end < start + n && span + chord[(end + 1) % n]! <= KINK_STRETCH * unit) {
        end++;
        span += chord[end % n]!;
        inWindow += turn[end % n]!;
      }
      sharpest = Math.max(sharpest, inWindow + turn[start]!);
      if (end > start) {
        span -= chord[(start + 1) % n]!;
        inWindow -= turn[(start + 1) % n]!;
      } else end = start + 1;
    }
  }
  const degrees = 180 / Math.PI;
  return { sharpest: sharpest * degrees, perEdge: length === 0 ? 0 : ((turning * unit) / length) * degrees };
}

interface Sample {
  readonly at: Point;
  readonly component: number;
  /** Arc length from the start of its component's centre line. */
  readonly along: number;
}

/**
 * Points of the centre lines outside every crossing's disc (its size around
 * it); two points count when they lie on different components, or on one
 * component more than an edge length apart along it.
 */
function closestStrands(drawing: Drawing): number {
  const unit = drawing.edgeLength;
  const reach = CAP * unit;
  const samples: Sample[] = [];
  const lengths: number[] = [];
  drawing.components.forEach((component, k) => {
    let along = 0;
    let last: Point | undefined;
    for (const cubic of component.centreLine) {
      for (const p of flattenCubic(cubic, SAMPLES)) {
        if (last) along += Math.hypot(p.x - last.x, p.y - last.y);
        last = p;
        const nearCrossing = drawing.crossings.some((c) => Math.hypot(c.at.x - p.x, c.at.y - p.y) < c.size);
        if (!nearCrossing) samples.push({ at: p, component: k, along });
      }
    }
    lengths[k] = along;
  });
  const cells = new Map<string, Sample[]>();
  const key = (x: number, y: number): string => `${Math.floor(x / reach)},${Math.floor(y / reach)}`;
  for (const s of samples) {
    const k = key(s.at.x, s.at.y);
    const list = cells.get(k);
    if (list) list.push(s);
    else cells.set(k, [s]);
  }
  let closest = reach;
  for (const s of samples) {
    const cx = Math.floor(s.at.x / reach);
    const cy = Math.floor(s.at.y / reach);
    for (let dx = -1; dx <= 1; dx++) {
      for (let dy = -1; dy <= 1; dy++) {
        for (const t of cells.get(`${cx + dx},${cy + dy}`) ?? []) {
          if (t.component === s.component) {
            const apart = Math.abs(t.along - s.along);
            if (Math.min(apart, lengths[s.component]! - apart) < unit) continue;
          }
          closest = Math.min(closest, Math.hypot(s.at.x - t.at.x, s.at.y - t.at.y));
        }
      }
    }
  }
  return closest / unit;
}
