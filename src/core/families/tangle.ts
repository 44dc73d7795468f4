/**
 * Unoriented tangles for building diagrams of the tangle families (rational,
 * Montesinos and pretzel links). A tangle is a piece of diagram in a disk with
 * four ends, NW, NE, SW and SE; its crossings are recorded without
 * orientation (slots counterclockwise from one end of the under strand), and
 * the orientation is chosen only when a closure has made every strand a closed
 * component (`orientAndAssemble`).
 *
 * Crossing type: every twist is a half twist whose over strand has positive
 * slope (it runs from the lower left to the upper right of the crossing) for
 * +1, negative slope for −1. This is the convention in which the tangle [1]
 * is the same picture whether read as a horizontal or a vertical twist, so
 * that horizontal twisting adds 1 to the fraction of a rational tangle and
 * vertical twisting adds 1 to the fraction's reciprocal; a continued fraction
 * with all terms of one sign then gives an alternating tangle (Conway).
 */
import { assembleDiagram, type RawCrossing } from '../diagram/assemble.ts';
import type { LinkDiagram, Sign } from '../diagram/model.ts';

/** The four ends of a tangle, as arc labels of its builder. */
export interface Tangle {
  readonly nw: number;
  readonly ne: number;
  readonly sw: number;
  readonly se: number;
}

type Ends = [number, number, number, number];

export class TangleBuilder {
  private readonly parent: number[] = [];
  /** Slots counterclockwise starting at one end of the under strand (slots 0 and 2 are the under strand). */
  private readonly crossings: Ends[] = [];
  private loops = 0;

  private fresh(): number {
    this.parent.push(this.parent.length);
    return this.parent.length - 1;
  }

  private find(x: number): number {
    while (this.parent[x] !== x) x = this.parent[x] = this.parent[this.parent[x]!]!;
    return x;
  }

  /**
   * Joins two free ends by an arc. Every arc class has exactly two ends, so
   * joining the two ends of one class closes a circle that meets no crossing.
   */
  join(a: number, b: number): void {
    const ra = this.find(a);
    const rb = this.find(b);
    if (ra === rb) this.loops++;
    else this.parent[ra] = rb;
  }

  /** The tangle 0: an arc from NW to NE and one from SW to SE. */
  zero(): Tangle {
    const top = this.fresh();
    const bottom = this.fresh();
    return { nw: top, ne: top, sw: bottom, se: bottom };
  }

  /** The tangle ∞: an arc from NW to SW and one from NE to SE. */
  infinity(): Tangle {
    const left = this.fresh();
    const right = this.fresh();
    return { nw: left, sw: left, ne: right, se: right };
  }

  /** One crossing with the given labels at its four corners; `type` +1 puts the positive-slope strand over. */
  private cross(ne: number, nw: number, sw: number, se: number, type: Sign): void {
    // Counterclockwise the corners are NE, NW, SW, SE. Type +1: SW–NE over, so NW–SE is the under strand.
    this.crossings.push(type === 1 ? [nw, sw, se, ne] : [ne, nw, sw, se]);
  }

  /** Adds |n| half twists of sign sign(n) on the right (the fraction grows by n). */
  twistRight(t: Tangle, n: number): Tangle {
    let { ne, se } = t;
    const type: Sign = n > 0 ? 1 : -1;
    for (let k = 0; k < Math.abs(n); k++) {
      const newNe = this.fresh();
      const newSe = this.fresh();
      this.cross(newNe, ne, se, newSe, type);
      ne = newNe;
      se = newSe;
    }
    return { ...t, ne, se };
  }

  /** Adds |n| half twists of sign sign(n) at the bottom (the fraction's reciprocal grows by n). */
  twistBelow(t: Tangle, n: number): Tangle {
    let { sw, se } = t;
    const type: Sign = n > 0 ? 1 : -1;
    for (let k = 0; k < Math.abs(n); k++) {
      const newSw = this.fresh();
      const newSe = this.fresh();
      this.cross(se, sw, newSw, newSe, type);
      sw = newSw;
      se = newSe;
    }
    return { ...t, sw, se };
  }

  /**
   * The rational tangle of the continued fraction b₀ + 1/(b₁ + 1/(… + 1/bₘ)):
   * built from the inside out, bₘ first, horizontal twists for the terms of
   * even index and vertical twists for those of odd index.
   */
  rational(terms: readonly number[]): Tangle {
    const m = terms.length - 1;
    let t = m % 2 === 0 ? this.zero() : this.infinity();
    for (let i = m; i >= 0; i--) t = i % 2 === 0 ? this.twistRight(t, terms[i]!) : this.twistBelow(t, terms[i]!);
    return t;
  }

  /** The tangle sum: `left` beside `right`, NE joined to NW and SE to SW. */
  sum(left: Tangle, right: Tangle): Tangle {
    this.join(left.ne, right.nw);
    this.join(left.se, right.sw);
    return { nw: left.nw, sw: left.sw, ne: right.ne, se: right.se };
  }

  /** The numerator closure: NW joined to NE over the top, SW to SE under the bottom. */
  closeNumerator(t: Tangle): void {
    this.join(t.nw, t.ne);
    this.join(t.sw, t.se);
  }

  /**
   * The closed diagram, oriented: each component is traced from the lowest
   * crossing slot it passes and oriented so that it leaves through that slot's
   * strand in the direction of the slot's opposite; slots are then rotated to
   * start at the incoming under end, and signs read off.
   */
  orientAndAssemble(): LinkDiagram {
    const ends = this.crossings.map((c) => c.map((label) => this.find(label)) as Ends);
    // The two slots of each arc class.
    const slotsOf = new Map<number, number[]>();
    ends.forEach((c, ci) => c.forEach((label, slot) => slotsOf.set(label, [...(slotsOf.get(label) ?? []), 4 * ci + slot])));
    for (const [label, slots] of slotsOf) if (slots.length !== 2) throw new Error(`internal: tangle arc ${label} has ${slots.length} crossing ends; a closure is missing`);
    // incoming[4c + s]: true when the strand enters crossing c at slot s.
    const incoming = new Array<boolean | undefined>(4 * ends.length);
    for (let start = 0; start < incoming.length; start++) {
      if (incoming[start] !== undefined) continue;
      let enter = start;
      while (incoming[enter] === undefined) {
        const exit = 4 * (enter >> 2) + (((enter & 3) + 2) & 3);
        incoming[enter] = true;
        incoming[exit] = false;
        const [a, b] = slotsOf.get(ends[exit >> 2]![exit & 3]!)!;
        enter = a === exit ? b! : a!;
      }
    }
    const raw: RawCrossing[] = ends.map((c, ci) => {
      const rotated: Ends = incoming[4 * ci] ? c : [c[2], c[3], c[0], c[1]];
      const overEntersAt3 = incoming[4 * ci] ? incoming[4 * ci + 3] : incoming[4 * ci + 1];
      return { edges: rotated, sign: overEntersAt3 ? 1 : -1 };
    });
    return assembleDiagram(raw, { notation: 'family', freeLoops: this.loops });
  }
}
