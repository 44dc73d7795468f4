/** Plane points and cubic Bézier pieces, the vocabulary of the drawing modules. */
export interface Point {
  readonly x: number;
  readonly y: number;
}

/** One cubic Bézier piece: start, two control points, end. */
export interface Cubic {
  readonly from: Point;
  readonly c1: Point;
  readonly c2: Point;
  readonly to: Point;
}

export const distance = (a: Point, b: Point): number => Math.hypot(a.x - b.x, a.y - b.y);

export function cubicPoint(k: Cubic, t: number): Point {
  const u = 1 - t;
  const a = u * u * u;
  const b = 3 * u * u * t;
  const c = 3 * u * t * t;
  const e = t * t * t;
  return { x: a * k.from.x + b * k.c1.x + c * k.c2.x + e * k.to.x, y: a * k.from.y + b * k.c1.y + c * k.c2.y + e * k.to.y };
}

/** The unit tangent of a cubic at parameter t (falls back to the chord where the derivative vanishes). */
export function cubicTangent(k: Cubic, t: number): Point {
  const u = 1 - t;
  const dx = 3 * u * u * (k.c1.x - k.from.x) + 6 * u * t * (k.c2.x - k.c1.x) + 3 * t * t * (k.to.x - k.c2.x);
  const dy = 3 * u * u * (k.c1.y - k.from.y) + 6 * u * t * (k.c2.y - k.c1.y) + 3 * t * t * (k.to.y - k.c2.y);
  const length = Math.hypot(dx, dy);
  if (length > 0) return { x: dx / length, y: dy / length };
  const chord = distance(k.from, k.to) || 1;
  return { x: (k.to.x - k.from.x) / chord, y: (k.to.y - k.from.y) / chord };
}

const lerp = (a: Point, b: Point, t: number): Point => ({ x: a.x + (b.x - a.x) * t, y: a.y + (b.y - a.y) * t });

/** De Casteljau: the two halves of a cubic split at t. */
export function splitCubic(k: Cubic, t: number): [Cubic, Cubic] {
  const ab = lerp(k.from, k.c1, t);
  const bc = lerp(k.c1, k.c2, t);
  const cd = lerp(k.c2, k.to, t);
  const abc = lerp(ab, bc, t);
  const bcd = lerp(bc, cd, t);
  const mid = lerp(abc, bcd, t);
  return [
    { from: k.from, c1: ab, c2: abc, to: mid },
    { from: mid, c1: bcd, c2: cd, to: k.to },
  ];
}

/** Points of a cubic at t = (i + ½)/samples (never at its ends, so chains meet inside a segment, not at a vertex). */
export function flattenCubic(k: Cubic, samples: number): Point[] {
  return Array.from({ length: samples }, (_, i) => cubicPoint(k, (i + 0.5) / samples));
}

const ARC_SAMPLES = 48;

/** The parameter at which the arc length from the start of the cubic reaches `length` (its end if it is shorter). */
export function parameterAtLength(k: Cubic, length: number): number {
  let travelled = 0;
  let last = k.from;
  for (let i = 1; i <= ARC_SAMPLES; i++) {
    const t = i / ARC_SAMPLES;
    const p = cubicPoint(k, t);
    const step = distance(last, p);
    if (travelled + step >= length) return (i - 1 + (length - travelled) / step) / ARC_SAMPLES;
    travelled += step;
    last = p;
  }
  return 1;
}

export function cubicLength(k: Cubic): number {
  let total = 0;
  let last = k.from;
  for (let i = 1; i <= ARC_SAMPLES; i++) {
    const p = cubicPoint(k, i / ARC_SAMPLES);
    total += distance(last, p);
    last = p;
  }
  return total;
}

export function reverseCubic(k: Cubic): Cubic {
  return { from: k.to, c1: k.c2, c2: k.c1, to: k.from };
}
