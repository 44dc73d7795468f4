/**
 * Where a crossing's number goes: in whichever of its four corners leaves the
 * number most room from the drawn strands and from numbers placed before it,
 * far enough out along the corner's bisector that the text clears both arms.
 * In a dense figure a fixed corner puts numbers on strands and on each other.
 */
import { cubicLength, flattenCubic, type Cubic, type Point } from './geometry.ts';

/** Half the width of a number's text, in font sizes per digit (sans-serif digits are about 0.55 em wide). */
const HALF_DIGIT = 0.28;
/** Half the height of the text, in font sizes. */
const HALF_HEIGHT = 0.36;
/** How far out along the bisector candidates go, in multiples of the distance that just clears both arms. */
const REACHES = [1, 1.3, 1.7] as const;

export interface CrossingCorners {
  readonly at: Point;
  /** The four arm ends, counterclockwise, in figure units. */
  readonly arms: readonly Point[];
  readonly text: string;
}

/** Sample points of the centre lines, bucketed in square cells, for nearest-ink queries. */
class InkGrid {
  private readonly cells = new Map<string, Point[]>();

  constructor(
    lines: readonly (readonly Cubic[])[],
    private readonly side: number,
  ) {
    for (const line of lines) {
      for (const k of line) {
        // Samples at most a quarter of a cell apart, so a distance is off by at most that.
        const count = Math.max(2, Math.ceil((4 * cubicLength(k)) / side));
        for (const p of [k.from, ...flattenCubic(k, count)]) this.add(p);
      }
    }
  }

  add(p: Point): void {
    const key = this.key(Math.floor(p.x / this.side), Math.floor(p.y / this.side));
    const list = this.cells.get(key);
    if (list) list.push(p);
    else this.cells.set(key, [p]);
  }

  /** The distance to the nearest sample, or the cell side when none is that close. */
  nearest(p: Point): number {
    const cx = Math.floor(p.x / this.side);
    const cy = Math.floor(p.y / this.side);
    let best = this.side;
    for (let dx = -1; dx <= 1; dx++) {
      for (let dy = -1; dy <= 1; dy++) {
        for (const q of this.cells.get(this.key(cx + dx, cy + dy)) ?? []) best = Math.min(best, Math.hypot(q.x - p.x, q.y - p.y));
      }
    }
    return best;
  }

  private key(cx: number, cy: number): string {
    return `${cx},${cy}`;
  }
}

const unit = (p: Point): Point => {
  const l = Math.hypot(p.x, p.y) || 1;
  return { x: p.x / l, y: p.y / l };
};

/** One point per crossing, in the order given, for its number at this font size. */
export function crossingLabelPoints(crossings: readonly CrossingCorners[], centreLines: readonly (readonly Cubic[])[], fontSize: number): Point[] {
  const ink = new InkGrid(centreLines, 3 * fontSize);
  const placed: Point[] = [];
  const labels = new InkGrid([], 3 * fontSize);
  for (const c of crossings) {
    const halfWidth = Math.max(HALF_HEIGHT, HALF_DIGIT * c.text.length) * fontSize;
    // The text as a disc: its radius is the half-diagonal of its box.
    const radius = Math.hypot(halfWidth, HALF_HEIGHT * fontSize);
    let best: { at: Point; clearance: number } | undefined;
    for (let q = 0; q < 4; q++) {
      const a = unit({ x: c.arms[q]!.x - c.at.x, y: c.arms[q]!.y - c.at.y });
      const b = unit({ x: c.arms[(q + 1) & 3]!.x - c.at.x, y: c.arms[(q + 1) & 3]!.y - c.at.y });
      const opening = Math.acos(Math.max(-1, Math.min(1, a.x * b.x + a.y * b.y)));
      // Arms counterclockwise, so the corner is the turn from a to b; a reflex corner's bisector points away from both.
      const reflex = a.x * b.y - a.y * b.x < 0;
      const half = reflex ? Math.PI - opening / 2 : opening / 2;
      const bisector = reflex ? unit({ x: -(a.x + b.x), y: -(a.y + b.y) }) : unit({ x: a.x + b.x, y: a.y + b.y });
      const clear = radius / Math.sin(Math.min(half, Math.PI / 2) || 1e-3);
      for (const reach of REACHES) {
        const at = { x: c.at.x + bisector.x * clear * reach, y: c.at.y + bisector.y * clear * reach };
        const clearance = Math.min(ink.nearest(at) - radius, labels.nearest(at) - 2 * radius) - 0.05 * clear * reach;
        // Strictly better only, so ties keep the first corner and the nearer reach: the same bytes every run.
        if (!best || clearance > best.clearance) best = { at, clearance };
      }
    }
    placed.push(best!.at);
    labels.add(best!.at);
  }
  return placed;
}
