/**
 * Skein polynomials (HOMFLY-PT, Kauffman, Dubrovnik) by contraction in the
 * skein module of a disk.
 *
 * Crossings are absorbed one at a time into a growing disk R of the plane. The
 * part of the diagram inside R is a tangle whose 2m ends lie on ∂R, and it is
 * kept as a linear combination of *layered tangles*: arcs joining the ends in
 * pairs, each arc in a horizontal slab of its own, stacked in a fixed
 * (canonical) order. That layered (totally descending) tangles span the skein
 * module of the disk is the descending-diagram argument of Lickorish and Millett
 * (Topology 26, 1987) for the HOMFLY-PT polynomial, and its unoriented form for
 * the Kauffman polynomial (Kauffman, Trans. AMS 318, 1990). A layered tangle is
 * fixed by its pairing and its stacking order alone, so the state of the
 * contraction is a map from pairings to polynomials: at most m! states for
 * oriented arcs, (2m − 1)!! for unoriented ones, where 2m is the boundary width,
 * never 2^crossings.
 *
 * Absorbing a crossing X is a short sequence of moves on the boundary: a new
 * small arc (cup), a crossing of the strands at two neighbouring ends, and the
 * closing of two neighbouring ends (cap). Each move maps a layered tangle to a
 * tangle that is layered in some order; bringing that order back to the
 * canonical one swaps arcs adjacent in the stacking, and two arcs whose chords
 * cross change places by one skein relation at their one crossing.
 *
 * Positions on ∂R are numbered counterclockwise. An arc is drawn as the chord
 * between its ends, so two arcs cross exactly when their ends interleave, and
 * the crossing's sign and its A/B smoothings follow from the cyclic order of
 * the four ends. The disk stays a disk because each absorbed crossing meets R
 * in a run of consecutive ends through consecutive slots (an "ear"); a planar
 * connected diagram always has one.
 */
import { indexDiagram, slotIsIncoming, type LinkDiagram, type Sign } from '../../diagram/model.ts';
import { InputError } from '../../errors.ts';
import { addProductInto, Laurent2 } from '../../poly/laurent2.ts';

/** The local rules of one skein polynomial, in its own variables. */
export interface SkeinRules {
  /** Oriented (HOMFLY-PT) or unoriented (Kauffman, Dubrovnik) arcs. */
  readonly oriented: boolean;
  /** The value of a crossingless loop beside the rest. */
  readonly loop: Laurent2;
  /** Removing a curl of sign ε multiplies by this (1 for an ambient isotopy invariant). */
  curl(sign: Sign): Laurent2;
  /**
   * L(X) = switched·L(X̄) + smoothA·L(X_A) + smoothB·L(X_B) for a crossing X of sign ε;
   * X_A joins slots 0–1 and 2–3, X_B joins 0–3 and 1–2. Unoriented rules ignore ε.
   */
  crossing(sign: Sign): { readonly switched: Laurent2; readonly smoothA: Laurent2; readonly smoothB: Laurent2 };
}

export interface ContractionLimits {
  /** Largest boundary width (open ends) allowed. */
  readonly maxWidth: number;
  /** Largest number of (state, move) steps allowed in total: the work budget. */
  readonly maxWork: number;
}

export interface ContractionResult {
  /** The value with every closed loop counted as `loop` (so the unknot gives `loop`). */
  readonly value: Laurent2;
  /** The widest boundary met. */
  readonly width: number;
  /** Largest number of states held at once. */
  readonly states: number;
  /** Work units spent (term products and skein moves), the quantity the budget limits. */
  readonly work: number;
}

/** A linear combination of canonical layered tangles, keyed by their pairing. */
type Combination = Map<string, Laurent2>;

/** partner[p]: the other end of the arc at position p. An arc is named by its lower end. */
type Pairing = readonly number[];

/** Arcs (by name) from top to bottom. */
type Stacking = readonly number[];

export class OverLimit extends Error {}

/** The value of one connected piece of a diagram (crossings > 0, no free loops). */
export function contractPiece(d: LinkDiagram, rules: SkeinRules, limits: ContractionLimits): ContractionResult {
  // A summand drawn inside a face beside a crossing can leave no ear on the way in; another
  // starting crossing then reaches it from inside.
  for (let start = 0; ; start++) {
    try {
      return new Contraction(d, rules, limits, start).run();
    } catch (error) {
      if (!(error instanceof NoEar) || start + 1 >= d.crossings.length) throw error;
    }
  }
}

class NoEar extends Error {}

function pairingKey(partner: Pairing): string {
  return String.fromCharCode(...partner);
}

function pairingOf(key: string): number[] {
  const partner = new Array<number>(key.length);
  for (let i = 0; i < key.length; i++) partner[i] = key.charCodeAt(i);
  return partner;
}

/** The canonical stacking: arcs by their lower end, the lowest on top. */
function canonicalStacking(partner: Pairing): number[] {
  const arcs: number[] = [];
  for (let p = 0; p < partner.length; p++) if (partner[p]! > p) arcs.push(p);
  return arcs;
}

function interleave(p1: number, q1: number, p2: number, q2: number): boolean {
  const [a, b] = p1 < q1 ? [p1, q1] : [q1, p1];
  const inside = (x: number): boolean => a < x && x < b;
  return inside(p2) !== inside(q2);
}

class Contraction {
  private readonly index;
  /** Boundary: the slot id (4c + q) of each open end, counterclockwise. */
  private boundary: number[] = [];
  /** inward[p]: the edge at end p is directed into R. */
  private inward: boolean[] = [];
  private states: Map<string, Map<number, bigint>> = new Map([['', new Map()]]);
  private memo = new Map<string, Combination>();
  private work = 0;
  private widest = 0;
  private mostStates = 1;
  private readonly one = Laurent2.one;

  constructor(
    private readonly d: LinkDiagram,
    private readonly rules: SkeinRules,
    private readonly limits: ContractionLimits,
    private readonly start: number,
  ) {
    this.index = indexDiagram(d);
    this.states = new Map([['', new Map(Laurent2.one.entries())]]);
  }

  run(): ContractionResult {
    const n = this.d.crossings.length;
    const absorbed = new Uint8Array(n);
    for (let step = 0; step < n; step++) {
      const ear = step === 0 ? { crossing: this.start, anchor: -1, glued: 0 } : this.findEar(absorbed);
      absorbed[ear.crossing] = 1;
      this.absorb(ear.crossing, ear.anchor, ear.glued);
    }
    if (this.boundary.length !== 0) throw new Error('internal: skein contraction ended with open ends');
    const value = this.states.get('');
    return { value: value ? Laurent2.fromPackedMap(value) : Laurent2.zero, width: this.widest, states: this.mostStates, work: this.work };
  }

  private positionOfSlot(): Map<number, number> {
    const map = new Map<number, number>();
    this.boundary.forEach((slot, p) => map.set(slot, p));
    return map;
  }

  /**
   * The next crossing to absorb: one whose edges into R leave consecutive slots
   * and reach consecutive ends (an ear), preferring the smallest new width.
   */
  private findEar(absorbed: Uint8Array): { crossing: number; anchor: number; glued: number } {
    const { opposite } = this.index;
    const position = this.positionOfSlot();
    const width = this.boundary.length;
    let best: { crossing: number; anchor: number; glued: number; growth: number } | undefined;
    const seen = new Set<number>();
    for (const slot of this.boundary) {
      const c = opposite[slot]! >> 2;
      if (absorbed[c] || seen.has(c)) continue;
      seen.add(c);
      const gluedAt = [0, 1, 2, 3].map((q) => position.get(opposite[4 * c + q]!) ?? -1);
      const glued = gluedAt.filter((p) => p >= 0).length;
      const kinks = [0, 1, 2, 3].filter((q) => opposite[4 * c + q]! >> 2 === c).length;
      for (let s = 0; s < 4; s++) {
        let ok = true;
        for (let i = 0; i < glued && ok; i++) ok = gluedAt[(s - i + 4) & 3] === (gluedAt[s]! + i) % width && gluedAt[s]! >= 0;
        if (!ok) continue;
        const growth = 4 - 2 * glued - kinks;
        if (!best || growth < best.growth) best = { crossing: c, anchor: s, glued, growth };
        break;
      }
    }
    if (!best) throw new NoEar('internal: no crossing can be absorbed while keeping the region a disk');
    return best;
  }

  private absorb(c: number, anchor: number, glued: number): void {
    const crossing = this.d.crossings[c]!;
    const sign = crossing.sign;
    const { opposite } = this.index;
    const slotIn = (q: number): boolean => slotIsIncoming(((q % 4) + 4) % 4, sign);
    const mod4 = (q: number): number => ((q % 4) + 4) % 4;
    this.memo.clear();
    let moves: Move[] = [];
    let newSlots: number[];
    if (glued === 0) {
      // The first crossing: its four slots, counterclockwise, starting so that no curl wraps around.
      let t = 0;
      while (t < 4 && opposite[4 * c + mod4(t + 3)]! === 4 * c + t) t++;
      const slots = [0, 1, 2, 3].map((i) => mod4(t + i));
      this.boundary = slots.map((q) => 4 * c + q);
      this.inward = slots.map((q) => slotIn(q));
      const partner = [2, 3, 0, 1];
      const overFirst = slots[0]! % 2 === 1 ? [0, 1] : [1, 0];
      this.replaceStates(() => this.normalize(partner, overFirst));
      newSlots = [...this.boundary];
      this.boundary = [];
    } else {
      const width = this.boundary.length;
      let j = this.positionOfSlot().get(opposite[4 * c + anchor]!)!;
      if (j + glued > width) {
        moves.push({ kind: 'rotate', by: j });
        j = 0;
      }
      const s = anchor;
      if (glued === 1) {
        moves.push({ kind: 'cup', at: j, inward: [slotIn(s + 1), slotIn(s + 3)] });
        moves.push({ kind: 'cross', at: j + 1, b0: mod4(s + 1), sign });
      } else if (glued === 2) {
        moves.push({ kind: 'cross', at: j, b0: s, sign });
      } else if (glued === 3) {
        moves.push({ kind: 'cross', at: j, b0: s, sign }, { kind: 'cap', at: j + 1 });
      } else {
        moves.push({ kind: 'cross', at: j + 1, b0: mod4(s - 1), sign }, { kind: 'cap', at: j }, { kind: 'cap', at: j });
      }
      newSlots = [];
      for (let i = 1; i <= 4 - glued; i++) newSlots.push(4 * c + mod4(s + i));
      this.applyMoves(moves);
      const rotated = moves[0]?.kind === 'rotate' ? rotate(this.boundary, (moves[0] as RotateMove).by) : this.boundary;
      this.boundary = [...rotated.slice(0, j), ...newSlots, ...rotated.slice(j + glued)];
      newSlots = this.boundary;
      this.boundary = [];
    }
    this.boundary = newSlots;
    this.inward = this.boundary.map((slot) => slotIsIncoming(slot & 3, this.d.crossings[slot >> 2]!.sign));
    // Curls: an edge from this crossing back to itself closes two neighbouring ends.
    for (let q = 0; q < 4; q++) {
      const far = opposite[4 * c + q]!;
      if (far >> 2 !== c || far < 4 * c + q) continue;
      const width = this.boundary.length;
      let p = this.boundary.indexOf(4 * c + q);
      let p2 = this.boundary.indexOf(far);
      moves = [];
      if (Math.abs(p - p2) !== 1) {
        // The two ends sit at the two extremes: turn the boundary by one so that they meet.
        moves.push({ kind: 'rotate', by: width - 1 });
        p = (p + 1) % width;
        p2 = (p2 + 1) % width;
      }
      moves.push({ kind: 'cap', at: Math.min(p, p2) });
      this.applyMoves(moves);
      const rotated = moves[0]!.kind === 'rotate' ? rotate(this.boundary, width - 1) : this.boundary;
      rotated.splice(Math.min(p, p2), 2);
      this.boundary = rotated;
      this.inward = this.boundary.map((slot) => slotIsIncoming(slot & 3, this.d.crossings[slot >> 2]!.sign));
    }
    this.widest = Math.max(this.widest, this.boundary.length);
  }

  /** Runs the moves on every state, tracking the boundary's orientation as it changes. */
  private applyMoves(moves: readonly Move[]): void {
    for (const move of moves) {
      const before = this.inward;
      let after: boolean[];
      switch (move.kind) {
        case 'rotate':
          after = rotate(before, move.by);
          break;
        case 'cup':
          after = [...before.slice(0, move.at), ...move.inward, ...before.slice(move.at)];
          break;
        case 'cross':
          after = [...before];
          [after[move.at], after[move.at + 1]] = [before[move.at + 1]!, before[move.at]!];
          break;
        case 'cap':
          after = [...before.slice(0, move.at), ...before.slice(move.at + 2)];
          break;
      }
      this.memo.clear();
      this.replaceStates((partner) => this.move(move, partner, before, after));
      this.inward = after;
    }
  }

  private replaceStates(apply: (partner: number[]) => Combination): void {
    const next = new Map<string, Map<number, bigint>>();
    for (const [key, value] of this.states) {
      const source = Laurent2.fromPackedMap(value);
      for (const [target, coefficient] of apply(pairingOf(key))) {
        this.spend(source.termCount * coefficient.termCount);
        let sum = next.get(target);
        if (!sum) next.set(target, (sum = new Map()));
        addProductInto(sum, source, coefficient);
      }
    }
    for (const [key, value] of next) if (value.size === 0) next.delete(key);
    this.states = next;
    this.mostStates = Math.max(this.mostStates, next.size);
    const width = next.size === 0 ? 0 : next.keys().next().value!.length;
    if (width > this.limits.maxWidth) throw new OverLimit(`boundary width ${width}`);
  }

  private spend(units: number): void {
    this.work += units;
    if (this.work > this.limits.maxWork) throw new OverLimit('work budget');
  }

  private move(move: Move, partner: number[], before: readonly boolean[], after: readonly boolean[]): Combination {
    switch (move.kind) {
      case 'rotate': {
        const w = partner.length;
        const to = (p: number): number => (p - move.by + w) % w;
        const rotated = new Array<number>(w);
        partner.forEach((q, p) => (rotated[to(p)] = to(q)));
        const stacking = canonicalStacking(partner).map((arc) => Math.min(to(arc), to(partner[arc]!)));
        return this.normalize(rotated, stacking, after);
      }
      case 'cup':
        return new Map([[pairingKey(cup(partner, move.at)), this.one]]);
      case 'cap':
        return this.cap(partner, canonicalStacking(partner), move.at, before, after);
      case 'cross':
        return this.cross(partner, move, before, after);
    }
  }

  /** The strands at ends j and j+1 cross (X's slot b0 meets end j, b0−1 end j+1; b0+1, b0+2 become the new ends). */
  private cross(partner: number[], move: CrossMove, before: readonly boolean[], after: readonly boolean[]): Combination {
    const j = move.at;
    const swap = (p: number): number => (p === j ? j + 1 : p === j + 1 ? j : p);
    const swapped = new Array<number>(partner.length);
    partner.forEach((q, p) => (swapped[swap(p)] = swap(q)));
    const stacking = canonicalStacking(partner);
    const newStacking = stacking.map((arc) => Math.min(swap(arc), swap(partner[arc]!)));
    const arcAt = (p: number): number => Math.min(p, partner[p]!);
    const x = arcAt(j);
    const y = arcAt(j + 1);
    if (x === y) {
      // One arc crosses itself: a curl. Its sign is X's sign when the arc, run from end j
      // round to end j+1, follows the diagram's orientation on both strands of X, else flipped.
      const followed = (before[j] ? 1 : -1) * (before[j + 1] ? -1 : 1);
      return scaled(this.normalize(swapped, newStacking, after), this.rules.curl((move.sign * followed) as Sign));
    }
    // Slots 1 and 3 are the over strand; b0 is on it when odd.
    const [over, under] = move.b0 % 2 === 1 ? [x, y] : [y, x];
    const layeredAsIs = this.normalize(swapped, newStacking, after);
    if (stacking.indexOf(over) < stacking.indexOf(under)) return layeredAsIs;
    const rule = this.rules.crossing(move.sign);
    const result: Combination = new Map();
    addScaled(result, layeredAsIs, rule.switched);
    // The smoothing that keeps end j on its side (b0 with b0+1) is A when b0 is even.
    const [straight, turned] = move.b0 % 2 === 0 ? [rule.smoothA, rule.smoothB] : [rule.smoothB, rule.smoothA];
    if (!straight.isZero) addScaled(result, new Map([[pairingKey(partner), this.one]]), straight);
    if (!turned.isZero) {
      const closed = this.cap(partner, stacking, j, before, before.filter((_, p) => p !== j && p !== j + 1));
      const reopened: Combination = new Map();
      for (const [key, coefficient] of closed) addScaled(reopened, new Map([[pairingKey(cup(pairingOf(key), j)), this.one]]), coefficient);
      addScaled(result, reopened, turned);
    }
    return result;
  }

  /** Closes ends j and j+1 of a tangle stacked in any order. */
  private cap(partner: Pairing, stacking: Stacking, j: number, before: readonly boolean[], after: readonly boolean[]): Combination {
    const key = `c${pairingKey(partner)}|${pairingKey(stacking)}|${j}`;
    const known = this.memo.get(key);
    if (known) return known;
    this.spend(1);
    const w = partner.length;
    const drop = (p: number): number => (p < j ? p : p - 2);
    const arcAt = (p: number): number => Math.min(p, partner[p]!);
    const x = arcAt(j);
    const y = arcAt(j + 1);
    let result: Combination;
    if (x === y) {
      const rest = new Array<number>(w - 2);
      for (let p = 0; p < w; p++) if (p !== j && p !== j + 1) rest[drop(p)] = drop(partner[p]!);
      const order = stacking.filter((arc) => arc !== x).map(drop);
      result = scaled(this.normalize(rest, order, after), this.rules.loop);
    } else {
      const dx = stacking.indexOf(x);
      const dy = stacking.indexOf(y);
      if (Math.abs(dx - dy) === 1) result = this.merge(partner, stacking, j, dx < dy, after);
      else {
        // Bring the arc at j+1 one step nearer the arc at j in the stacking.
        const k = dx < dy ? dy - 1 : dy;
        result = new Map();
        for (const term of this.swapAdjacent(partner, stacking, k, before)) {
          addScaled(result, this.cap(term.partner, term.stacking, j, before, after), term.coefficient);
        }
      }
    }
    this.memo.set(key, result);
    return result;
  }

  /** Joins the arcs at ends j and j+1 (adjacent in the stacking) into one arc. */
  private merge(partner: Pairing, stacking: Stacking, j: number, firstOnTop: boolean, after: readonly boolean[]): Combination {
    const w = partner.length;
    const farFirst = partner[j]!;
    const farSecond = partner[j + 1]!;
    let factor = this.one;
    if (!this.rules.oriented && interleave(farFirst, j, j + 1, farSecond)) {
      // The joined arc crosses itself once: a curl, whose sign the chords' cyclic order gives.
      const [overFrom, overTo, underFrom, underTo] = firstOnTop ? [farFirst, j, j + 1, farSecond] : [j + 1, farSecond, farFirst, j];
      factor = this.rules.curl(chordCrossingSign(overFrom, overTo, underFrom, underTo, w));
    }
    const drop = (p: number): number => (p < j ? p : p - 2);
    const joined = new Array<number>(w - 2);
    for (let p = 0; p < w; p++) if (p !== j && p !== j + 1) joined[drop(p)] = drop(partner[p]!);
    joined[drop(farFirst)] = drop(farSecond);
    joined[drop(farSecond)] = drop(farFirst);
    const arcSecond = Math.min(j + 1, farSecond);
    const arcFirst = Math.min(j, farFirst);
    const name = Math.min(drop(farFirst), drop(farSecond));
    const order = stacking.filter((arc) => arc !== arcSecond).map((arc) => (arc === arcFirst ? name : drop(arc)));
    return scaled(this.normalize(joined, order, after), factor);
  }

  /** Brings a tangle stacked in any order to canonical layered tangles. */
  private normalize(partner: Pairing, stacking: Stacking, inward: readonly boolean[] = this.inward): Combination {
    let k = 0;
    while (k + 1 < stacking.length && stacking[k]! < stacking[k + 1]!) k++;
    if (k + 1 >= stacking.length) return new Map([[pairingKey(partner), this.one]]);
    const key = `n${pairingKey(partner)}|${pairingKey(stacking)}${this.rules.oriented ? inward.map((i) => (i ? 1 : 0)).join('') : ''}`;
    const known = this.memo.get(key);
    if (known) return known;
    this.spend(1);
    const result: Combination = new Map();
    for (const term of this.swapAdjacent(partner, stacking, k, inward)) {
      addScaled(result, this.normalize(term.partner, term.stacking, inward), term.coefficient);
    }
    this.memo.set(key, result);
    return result;
  }

  /**
   * The arcs at stacking places k (above) and k+1 exchange places. Chords that
   * do not cross do so freely; chords that cross obey the skein relation at
   * their crossing, whose smoothings reconnect the two arcs.
   */
  private swapAdjacent(partner: Pairing, stacking: Stacking, k: number, inward: readonly boolean[]): { coefficient: Laurent2; partner: Pairing; stacking: Stacking }[] {
    const top = stacking[k]!;
    const bottom = stacking[k + 1]!;
    const exchanged = [...stacking];
    exchanged[k] = bottom;
    exchanged[k + 1] = top;
    if (!interleave(top, partner[top]!, bottom, partner[bottom]!)) return [{ coefficient: this.one, partner, stacking: exchanged }];
    const w = partner.length;
    // Orient each chord from its inward end (any orientation will do for unoriented rules).
    const [overFrom, overTo] = !this.rules.oriented || inward[top] ? [top, partner[top]!] : [partner[top]!, top];
    const [underFrom, underTo] = !this.rules.oriented || inward[bottom] ? [bottom, partner[bottom]!] : [partner[bottom]!, bottom];
    const sign = chordCrossingSign(overFrom, overTo, underFrom, underTo, w);
    const rule = this.rules.crossing(sign);
    const terms: { coefficient: Laurent2; partner: Pairing; stacking: Stacking }[] = [{ coefficient: rule.switched, partner, stacking: exchanged }];
    // Around the crossing the four ends lie in their cyclic order: the A-smoothing joins an
    // under end with the over end that follows it counterclockwise.
    const after = (p: number): number => (p - underFrom + w) % w;
    const [overNext, overOther] = after(overFrom) < after(overTo) ? [overFrom, overTo] : [overTo, overFrom];
    for (const [coefficient, pairs] of [
      [rule.smoothA, [[underFrom, overNext], [underTo, overOther]]],
      [rule.smoothB, [[underFrom, overOther], [underTo, overNext]]],
    ] as const) {
      if (coefficient.isZero) continue;
      const rejoined = [...partner];
      for (const [p, q] of pairs) {
        rejoined[p] = q;
        rejoined[q] = p;
      }
      const names = pairs.map(([p, q]) => Math.min(p, q)).sort((a, b) => a - b);
      const restacked = [...stacking];
      restacked[k] = names[0]!;
      restacked[k + 1] = names[1]!;
      terms.push({ coefficient, partner: rejoined, stacking: restacked });
    }
    return terms;
  }
}

/**
 * The sign of the crossing of two chords of a disk whose ends are numbered
 * counterclockwise, the first chord over: positive when, counterclockwise from
 * where the over chord starts, the under chord's start comes before the over
 * chord's end (the model's convention: slots counterclockwise from the
 * incoming under end, over strand 3 → 1 at a positive crossing).
 */
function chordCrossingSign(overFrom: number, overTo: number, underFrom: number, underTo: number, w: number): Sign {
  const after = (p: number): number => (p - overFrom + w) % w;
  void underTo;
  return after(underFrom) < after(overTo) ? 1 : -1;
}

function cup(partner: Pairing, j: number): number[] {
  const shift = (p: number): number => (p < j ? p : p + 2);
  const result = new Array<number>(partner.length + 2);
  partner.forEach((q, p) => (result[shift(p)] = shift(q)));
  result[j] = j + 1;
  result[j + 1] = j;
  return result;
}

function rotate<T>(items: readonly T[], by: number): T[] {
  return [...items.slice(by), ...items.slice(0, by)];
}

function scaled(combination: Combination, factor: Laurent2): Combination {
  if (factor.equals(Laurent2.one)) return combination;
  const result: Combination = new Map();
  addScaled(result, combination, factor);
  return result;
}

function addScaled(target: Combination, source: Combination, factor: Laurent2): void {
  for (const [key, coefficient] of source) {
    const sum = (target.get(key) ?? Laurent2.zero).add(coefficient.mul(factor));
    if (sum.isZero) target.delete(key);
    else target.set(key, sum);
  }
}

interface RotateMove {
  readonly kind: 'rotate';
  /** The end at position `by` becomes position 0. */
  readonly by: number;
}

interface CrossMove {
  readonly kind: 'cross';
  readonly at: number;
  readonly b0: number;
  readonly sign: Sign;
}

type Move = RotateMove | { readonly kind: 'cup'; readonly at: number; readonly inward: readonly [boolean, boolean] } | CrossMove | { readonly kind: 'cap'; readonly at: number };

export function overLimitError(invariant: string, crossings: number, reason: string): InputError {
  return new InputError(
    'limit-exceeded',
    `the ${invariant} of this ${crossings}-crossing diagram is over the work limit skeinproof sets for it (${reason}), so it is not computed; ` +
      'give a diagram of the same link with fewer crossings, or one drawn as a braid closure on fewer strands.',
  );
}
