/**
 * Khovanov homology by Bar-Natan's local algorithm (Bar-Natan, Fast Khovanov
 * homology computations, J. Knot Theory Ramifications 16 (2007) 243–255).
 *
 * The diagram is cut open at one edge and absorbed crossing by crossing, in
 * the narrow order the bracket engine uses (crossing-order.ts). The absorbed
 * region is a tangle; its complex lives in Bar-Natan's category of
 * crossingless matchings and dotted cobordisms. After each crossing, every
 * closed circle is delooped (O ≅ ∅{+1} ⊕ ∅{−1}) and every invertible
 * differential (±identity between equal matchings at equal shift) is cancelled
 * by Gaussian elimination, so the complex stays small. At the end the tangle
 * has two ends; closing them gives the unreduced complex, dropping the dotted
 * part gives the reduced one, and Smith normal form gives the homology over ℤ.
 *
 * Morphisms. Between matchings m and m′ of the same w boundary points, every
 * cobordism reduces (neck cutting, sphere and dot relations) to a ℤ-linear
 * combination of "dotted disks": one disk for each loop of m ∪ m′, dotted or
 * not. A morphism is therefore a map from dot sets (bit masks over the loops
 * of m ∪ m′, numbered by their first boundary point) to integers. Gluing
 * pieces together (a crossing to the tangle, or two morphisms in a row)
 * produces connected surfaces with k boundary loops, genus g and d dots, which
 * are evaluated in the Frobenius algebra A = ℤ[X]/(X² − hX) seen as
 * Δ^(k)(X^d (2X − h)^g) ∈ A^⊗k (the handle is 2X − h), with 1 an undotted and
 * X a dotted disk.
 *
 * Two theories share the code: Khovanov's (h = 0) and Bar-Natan's deformation
 * (h of quantum degree −2), used for Rasmussen's invariant. The deformed one
 * is computed at h = 1: every term is homogeneous, so the power of h a term
 * carries is recovered from the quantum degrees of its ends and its dots.
 *
 * Gradings follow cube.ts: the 0-resolution is the A-smoothing; a crossing's
 * complex is (0-resolution){0} → (1-resolution){1}; the whole complex is
 * shifted by [−n₋]{n₊ − 2n₋}. Tensoring puts the sign (−1)^h on the new
 * crossing's saddle.
 */
import type { LinkDiagram } from '../../diagram/model.ts';
import { planSteps, type StepPlan } from '../bracket.ts';
import { planContraction } from '../crossing-order.ts';
import { GradedComplex, unlinkHomology, withUnknottedCircles, type KhovanovHomology } from './homology.ts';

export type Theory = 'khovanov' | 'deformed';

/** Over-budget diagrams throw this, so callers can report "over the limit" instead of hanging. */
export class KhovanovBudgetError extends RangeError {
  override readonly name = 'KhovanovBudgetError';
  /** The work budget that was spent, when that (and not the width or a coefficient) stopped the computation. */
  readonly workBudget: number | undefined;
  constructor(message: string, workBudget?: number) {
    super(message);
    this.workBudget = workBudget;
  }
}

export interface LocalOptions {
  /** Absorption order (a permutation of the crossings); planned when absent. */
  readonly order?: readonly number[];
  /** Stop with a KhovanovBudgetError after this many elementary operations (compositions and gluings). */
  readonly workBudget?: number;
}

/** A morphism: dot mask → coefficient. */
type Morph = Map<number, number>;

interface Obj {
  /** Cube degree (number of 1-resolutions), before the shift by −n₋. */
  h: number;
  /** Matching id in the current stage's table. */
  m: number;
  /** Quantum shift. */
  s: number;
  out: Map<number, Morph>;
  inc: Set<number>;
  alive: boolean;
}

/** The complex of the absorbed tangle at the end: objects over the two-ended arc. */
export interface ArcComplex {
  readonly theory: Theory;
  /** Objects: cube degree h and quantum shift s (before the global shift). */
  readonly objects: readonly { readonly h: number; readonly s: number }[];
  /** Differential entries: from object, to object, coefficient of the undotted arc, coefficient of the dotted arc. */
  readonly entries: readonly (readonly [from: number, to: number, plain: number, dotted: number])[];
  readonly nPlus: number;
  readonly nMinus: number;
  /** Work units spent (for the benchmark and the budget). */
  readonly work: number;
}

const A_PARTNER = [1, 0, 3, 2];
const B_PARTNER = [3, 2, 1, 0];
/** Work units charged per gluing or composition on top of its terms (about 10⁶ units per second on the development machine). */
const WORK_PER_CALL = 16;
/** The budget without a time budget to scale it (the core's default); the deformed run for s gets the same again. */
export const DEFAULT_WORK_BUDGET = 2e7;
/**
 * Work units per second of a time budget (`--time-budget`): the command line's default of 10 s gives the
 * default 2·10⁷. Units are counted, not timed, so a verdict does not depend on the machine or its load.
 */
export const WORK_UNITS_PER_SECOND = 2e6;

/** The work budget for a time budget in milliseconds (DEFAULT_WORK_BUDGET when none is given). */
export function workBudgetFor(timeBudgetMs: number | undefined): number {
  return timeBudgetMs === undefined ? DEFAULT_WORK_BUDGET : Math.max(1, Math.round((timeBudgetMs / 1000) * WORK_UNITS_PER_SECOND));
}
/** Boundary widths beyond this need more matchings (and loop bits) than the engine keeps. */
export const MAX_KHOVANOV_WIDTH = 30;

const popcount = (x: number): number => {
  let c = 0;
  for (; x; x &= x - 1) c++;
  return c;
};

function checkedProduct(a: number, b: number): number {
  const p = a * b;
  if (!Number.isSafeInteger(p)) throw new KhovanovBudgetError('Khovanov computation: a coefficient left the exact integer range');
  return p;
}

function addTerm(target: Morph, mask: number, value: number): void {
  const sum = (target.get(mask) ?? 0) + value;
  if (!Number.isSafeInteger(sum)) throw new KhovanovBudgetError('Khovanov computation: a coefficient left the exact integer range');
  if (sum === 0) target.delete(mask);
  else target.set(mask, sum);
}

/**
 * A connected surface with k boundary loops, genus g and d dots, as dotted
 * disks on its loops: a list of (local dot mask, coefficient).
 */
function evaluateComponent(theory: Theory, k: number, d: number, g: number): [number, number][] {
  const all = k >= 31 ? -1 : (1 << k) - 1;
  if (theory === 'khovanov') {
    const t = d + g;
    if (t >= 2) return [];
    const factor = 2 ** g;
    if (k === 0) return t === 1 ? [[0, factor]] : [];
    if (t === 1) return [[all, factor]];
    const terms: [number, number][] = [];
    for (let i = 0; i < k; i++) terms.push([all & ~(1 << i), 1]);
    return terms;
  }
  // h = 1: X² = X, handle 2X − 1; a = α + βX.
  let alpha = d >= 1 ? 0 : 1;
  let beta = d >= 1 ? 1 : 0;
  for (let i = 0; i < g % 2; i++) [alpha, beta] = [-alpha, 2 * alpha + beta];
  if (k === 0) return beta === 0 ? [] : [[0, beta]];
  // Δ^(k)(1) = X^⊗k − (X − 1)^⊗k, Δ^(k)(X) = X^⊗k.
  const terms = new Map<number, number>();
  if (alpha + beta !== 0) terms.set(all, alpha + beta);
  if (alpha !== 0) {
    for (let mask = 0; mask <= all; mask++) {
      const sign = (k - popcount(mask)) % 2 === 0 ? 1 : -1;
      const v = (terms.get(mask) ?? 0) - alpha * sign;
      if (v === 0) terms.delete(mask);
      else terms.set(mask, v);
    }
  }
  return [...terms];
}

/** Loops of m ∪ m′ (partner arrays on the same w points): loop of every point and the count. */
interface PairLoops {
  readonly loopOf: Int32Array;
  readonly count: number;
}

function pairLoops(a: Uint8Array, b: Uint8Array): PairLoops {
  const w = a.length;
  const loopOf = new Int32Array(w).fill(-1);
  let count = 0;
  for (let p = 0; p < w; p++) {
    if (loopOf[p]! >= 0) continue;
    let x = p;
    while (loopOf[x]! < 0) {
      loopOf[x] = count;
      const y = a[x]!;
      loopOf[y] = count;
      x = b[y]!;
    }
    count++;
  }
  return { loopOf, count };
}

/** Union–find over small integer ids. */
class Components {
  readonly parent: Int32Array;
  constructor(size: number) {
    this.parent = new Int32Array(size);
    for (let i = 0; i < size; i++) this.parent[i] = i;
  }
  find(x: number): number {
    const parent = this.parent;
    while (parent[x] !== x) {
      parent[x] = parent[parent[x]!]!;
      x = parent[x]!;
    }
    return x;
  }
  union(x: number, y: number): void {
    const a = this.find(x);
    const b = this.find(y);
    if (a !== b) this.parent[a] = b;
  }
}

/**
 * The surface bookkeeping shared by every term of one gluing: its connected
 * components, each with its Euler characteristic, its boundary loops (as bits
 * of the result's dot masks) and the pieces (input loops, capped circles) that
 * carry dots into it.
 */
class Surface {
  private readonly uf: Components;
  private readonly chi: Int32Array;
  constructor(pieceCount: number) {
    this.uf = new Components(pieceCount);
    this.chi = new Int32Array(pieceCount).fill(1);
  }
  /** Glues two pieces along an interval (χ drops by one). */
  glue(x: number, y: number): void {
    this.chi[x]!--;
    this.uf.union(x, y);
  }
  /** Caps a closed circle lying on piece x with a disk (χ rises by one). */
  cap(x: number): void {
    this.chi[x]!++;
  }
  find(x: number): number {
    return this.uf.find(x);
  }
  /**
   * Finishes: `boundaryPiece[l]` is a piece containing result loop l. Returns
   * the components (by root) with χ, boundary bits and genus.
   */
  finish(boundaryPiece: readonly number[] | Int32Array, pieceCount: number): Map<number, { chi: number; bits: number[]; genus: number }> {
    const comps = new Map<number, { chi: number; bits: number[]; genus: number }>();
    for (let x = 0; x < pieceCount; x++) {
      const r = this.uf.find(x);
      let c = comps.get(r);
      if (!c) comps.set(r, (c = { chi: 0, bits: [], genus: 0 }));
      c.chi += this.chi[x]!;
    }
    for (let l = 0; l < boundaryPiece.length; l++) comps.get(this.uf.find(boundaryPiece[l]!))!.bits.push(l);
    for (const c of comps.values()) {
      const twiceGenus = 2 - c.bits.length - c.chi;
      if (twiceGenus < 0 || twiceGenus % 2 !== 0) throw new Error('internal: Khovanov gluing produced an impossible surface');
      c.genus = twiceGenus / 2;
    }
    return comps;
  }
}

/**
 * Expands a glued surface: `dotsOf(root)` gives the dots on each component;
 * the result (mask over result loops → coefficient) is added to `target` times `factor`.
 */
function expandSurface(
  theory: Theory,
  comps: Map<number, { chi: number; bits: number[]; genus: number }>,
  dots: Map<number, number>,
  factor: number,
  target: Morph,
): void {
  let partial: [number, number][] = [[0, factor]];
  for (const [root, comp] of comps) {
    const terms = evaluateComponent(theory, comp.bits.length, dots.get(root) ?? 0, comp.genus);
    if (terms.length === 0) return;
    const next: [number, number][] = [];
    for (const [mask, coefficient] of partial) {
      for (const [local, value] of terms) {
        let global = mask;
        comp.bits.forEach((bit, i) => {
          if ((local >> i) & 1) global |= 1 << bit;
        });
        next.push([global, checkedProduct(coefficient, value)]);
      }
    }
    partial = next;
  }
  for (const [mask, value] of partial) addTerm(target, mask, value);
}

/** One stage: the complex of the tangle absorbed so far. */
class Stage {
  readonly matchings: Uint8Array[] = [];
  private readonly matchingIds = new Map<string, number>();
  private readonly loopCache = new Map<number, PairLoops>();
  private readonly composeCache = new Map<string, Morph>();
  objects: Obj[] = [];

  constructor(
    readonly width: number,
    readonly theory: Theory,
    readonly meter: { work: number; budget: number },
  ) {}

  matchingId(partners: Uint8Array): number {
    const k = String.fromCharCode(...partners);
    let id = this.matchingIds.get(k);
    if (id === undefined) {
      id = this.matchings.length;
      this.matchingIds.set(k, id);
      this.matchings.push(partners);
    }
    return id;
  }

  loops(a: number, b: number): PairLoops {
    const k = a * 67108864 + b;
    let l = this.loopCache.get(k);
    if (!l) this.loopCache.set(k, (l = pairLoops(this.matchings[a]!, this.matchings[b]!)));
    return l;
  }

  addObject(h: number, m: number, s: number): number {
    this.objects.push({ h, m, s, out: new Map(), inc: new Set(), alive: true });
    return this.objects.length - 1;
  }

  addToEntry(from: number, to: number, morph: Morph, factor: number): void {
    if (morph.size === 0) return;
    const source = this.objects[from]!;
    let entry = source.out.get(to);
    if (!entry) {
      entry = new Map();
      source.out.set(to, entry);
      this.objects[to]!.inc.add(from);
    }
    for (const [mask, v] of morph) addTerm(entry, mask, checkedProduct(v, factor));
    if (entry.size === 0) {
      source.out.delete(to);
      this.objects[to]!.inc.delete(from);
    }
  }

  tick(units: number): void {
    this.meter.work += units;
    if (this.meter.work > this.meter.budget) {
      throw new KhovanovBudgetError(`Khovanov computation stopped: more than ${this.meter.budget} elementary steps`, this.meter.budget);
    }
  }

  /** g ∘ f for f: m_a → m_b and g: m_b → m_c, from the cached compositions of single dotted-disk terms. */
  compose(f: Morph, a: number, b: number, g: Morph, c: number): Morph {
    const result: Morph = new Map();
    for (const [maskF, cf] of f) {
      for (const [maskG, cg] of g) {
        const key = `${a},${b},${c},${maskF},${maskG}`;
        let unit = this.composeCache.get(key);
        if (!unit) this.composeCache.set(key, (unit = this.composeTerms(a, b, c, maskF, maskG)));
        this.tick(1 + unit.size);
        const factor = checkedProduct(cf, cg);
        for (const [mask, v] of unit) addTerm(result, mask, checkedProduct(v, factor));
      }
    }
    return result;
  }

  /** The composite of the single dotted-disk terms maskF: m_a → m_b and maskG: m_b → m_c. */
  private composeTerms(a: number, b: number, c: number, maskF: number, maskG: number): Morph {
    const w = this.width;
    const result: Morph = new Map();
    const lf = this.loops(a, b);
    const lg = this.loops(b, c);
    const surface = new Surface(lf.count + lg.count);
    const mb = this.matchings[b]!;
    for (let p = 0; p < w; p++) if (p < mb[p]!) surface.glue(lf.loopOf[p]!, lf.count + lg.loopOf[p]!);
    const lr = this.loops(a, c);
    const boundaryPiece = new Int32Array(lr.count);
    for (let p = 0; p < w; p++) boundaryPiece[lr.loopOf[p]!] = lf.loopOf[p]!;
    const comps = surface.finish(boundaryPiece, lf.count + lg.count);
    this.tick(WORK_PER_CALL * (1 + comps.size));
    const dots = new Map<number, number>();
    for (let i = 0; i < lf.count; i++) if ((maskF >> i) & 1) bump(dots, surface.find(i));
    for (let i = 0; i < lg.count; i++) if ((maskG >> i) & 1) bump(dots, surface.find(lf.count + i));
    expandSurface(this.theory, comps, dots, 1, result);
    return result;
  }

  /** Cancels every ±identity differential, until none is left. */
  reduce(): void {
    const queue: [number, number][] = [];
    this.objects.forEach((o, id) => {
      if (!o.alive) return;
      for (const [to, morph] of o.out) if (this.isUnit(id, to, morph)) queue.push([id, to]);
    });
    while (queue.length > 0) {
      const [b1, b2] = queue.pop()!;
      const o1 = this.objects[b1]!;
      const o2 = this.objects[b2]!;
      if (!o1.alive || !o2.alive) continue;
      const phi = o1.out.get(b2);
      if (!phi || !this.isUnit(b1, b2, phi)) continue;
      const epsilon = phi.get(0)!;
      const sources = [...o2.inc].filter((c) => c !== b1);
      const targets = [...o1.out.keys()].filter((t) => t !== b2);
      for (const c of sources) {
        const delta = this.objects[c]!.out.get(b2)!;
        for (const t of targets) {
          const gamma = o1.out.get(t)!;
          const product = this.compose(delta, this.objects[c]!.m, o2.m, gamma, this.objects[t]!.m);
          this.addToEntry(c, t, product, -epsilon);
          const updated = this.objects[c]!.out.get(t);
          if (updated && this.isUnit(c, t, updated)) queue.push([c, t]);
        }
      }
      for (const id of [b1, b2]) {
        const o = this.objects[id]!;
        for (const s of o.inc) this.objects[s]!.out.delete(id);
        for (const t of o.out.keys()) this.objects[t]!.inc.delete(id);
        o.out.clear();
        o.inc.clear();
        o.alive = false;
      }
    }
  }

  private isUnit(from: number, to: number, morph: Morph): boolean {
    const a = this.objects[from]!;
    const b = this.objects[to]!;
    if (a.m !== b.m || a.s !== b.s || morph.size !== 1) return false;
    const v = morph.get(0);
    return v === 1 || v === -1;
  }

}

function bump(map: Map<number, number>, key: number): void {
  map.set(key, (map.get(key) ?? 0) + 1);
}

/** How an old object with one smoothing glues up: its new matching, closed circles and delooped objects. */
interface Glued {
  readonly matching: number;
  /** One scratch position on each closed circle. */
  readonly circles: number[];
  /** New object ids by circle labels (bit i set: circle i labelled X). */
  readonly objects: number[];
}

/** Absorbs one crossing into `stage`, returning the next stage (not yet reduced). */
function absorb(stage: Stage, plan: StepPlan): Stage {
  const w = plan.oldWidth;
  const w2 = plan.newWidth;
  const next = new Stage(w2, stage.theory, stage.meter);
  const { joins, layout, compact } = plan;
  const glued: Glued[][] = stage.objects.map(() => []);
  const scratchOf = (m: Uint8Array, smoothing: number): Int32Array => {
    const s = new Int32Array(w + 4);
    for (let p = 0; p < w; p++) s[p] = m[p]!;
    const partner = smoothing === 0 ? A_PARTNER : B_PARTNER;
    for (let q = 0; q < 4; q++) s[w + q] = w + partner[q]!;
    return s;
  };
  stage.objects.forEach((o, id) => {
    if (!o.alive) return;
    for (let smoothing = 0; smoothing < 2; smoothing++) {
      const scratch = scratchOf(stage.matchings[o.m]!, smoothing);
      const circles: number[] = [];
      for (let j = 0; j < joins.length; j += 2) {
        const x = joins[j]!;
        const y = joins[j + 1]!;
        const px = scratch[x]!;
        if (px === y) circles.push(x);
        else {
          const py = scratch[y]!;
          scratch[px] = py;
          scratch[py] = px;
        }
      }
      const partners = new Uint8Array(w2);
      for (let i = 0; i < w2; i++) partners[i] = compact[scratch[layout[i]!]!]!;
      const matching = next.matchingId(partners);
      const objects: number[] = [];
      for (let labels = 0; labels < 1 << circles.length; labels++) {
        const xs = popcount(labels);
        objects.push(next.addObject(o.h + smoothing, matching, o.s + smoothing + circles.length - 2 * xs));
      }
      glued[id]![smoothing] = { matching, circles, objects };
    }
  });
  stage.tick(2 * WORK_PER_CALL * glued.length);

  // Scratch loops of an old entry m → m′ with the same smoothing on both ends.
  const identityLoops = (loops: PairLoops, smoothing: number): { loopOf: Int32Array; count: number } => {
    const loopOf = new Int32Array(w + 4);
    loopOf.set(loops.loopOf);
    const partner = smoothing === 0 ? A_PARTNER : B_PARTNER;
    for (let q = 0; q < 4; q++) loopOf[w + q] = loops.count + (Math.min(q, partner[q]!) === 0 ? 0 : 1);
    return { loopOf, count: loops.count + 2 };
  };

  // Gluing depends only on the matchings, the smoothing and the dot set: each result is computed
  // once (for coefficient 1) and reused for every pair of objects with the same data.
  const glueCache = new Map<string, Morph[]>();
  const add = (
    kind: number,
    from: Obj,
    to: Obj,
    morph: Morph,
    sign: number,
    source: Glued,
    target: Glued,
    scratchOf: () => { loopOf: Int32Array; count: number },
  ): void => {
    for (const [mask, coefficient] of morph) {
      const key = `${kind},${from.m},${to.m},${mask}`;
      let unit = glueCache.get(key);
      if (!unit) glueCache.set(key, (unit = glueTerm(next, plan, scratchOf(), mask, source, target)));
      const factor = coefficient * sign;
      next.tick(unit.length);
      unit.forEach((entry, k) => {
        const a = Math.floor(k / target.objects.length);
        const b = k % target.objects.length;
        next.addToEntry(source.objects[a]!, target.objects[b]!, entry, factor);
      });
    }
  };

  const saddle: Morph = new Map([[0, 1]]);
  stage.objects.forEach((o, id) => {
    if (!o.alive) return;
    // The tangle's own differential, beside the identity on the crossing.
    for (const [to, morph] of o.out) {
      const target = stage.objects[to]!;
      for (let smoothing = 0; smoothing < 2; smoothing++) {
        add(smoothing, o, target, morph, 1, glued[id]![smoothing]!, glued[to]![smoothing]!, () => identityLoops(stage.loops(o.m, target.m), smoothing));
      }
    }
    // The crossing's saddle, beside the identity on the tangle: sign (−1)^h.
    add(2, o, o, saddle, o.h % 2 === 0 ? 1 : -1, glued[id]![0]!, glued[id]![1]!, () => {
      const self = stage.loops(o.m, o.m);
      const loopOf = new Int32Array(w + 4);
      loopOf.set(self.loopOf);
      for (let q = 0; q < 4; q++) loopOf[w + q] = self.count;
      return { loopOf, count: self.count + 1 };
    });
  });
  return next;
}

/**
 * Glues one dotted-disk term (dot set `mask` on the scratch loops `scratch`)
 * along the plan's joins and caps the closed circles of both ends according to
 * their delooping labels. Returns the morphism between every pair of delooped
 * objects (source label a, target label b at index a·|target| + b).
 */
function glueTerm(next: Stage, plan: StepPlan, scratch: { loopOf: Int32Array; count: number }, mask: number, source: Glued, target: Glued): Morph[] {
  const { joins, layout } = plan;
  const surface = new Surface(scratch.count);
  for (let j = 0; j < joins.length; j += 2) surface.glue(scratch.loopOf[joins[j]!]!, scratch.loopOf[joins[j + 1]!]!);
  for (const x of source.circles) surface.cap(scratch.loopOf[x]!);
  for (const x of target.circles) surface.cap(scratch.loopOf[x]!);
  const result = next.loops(source.matching, target.matching);
  const boundaryPiece = new Int32Array(result.count);
  for (let i = 0; i < layout.length; i++) boundaryPiece[result.loopOf[i]!] = scratch.loopOf[layout[i]!]!;
  const comps = surface.finish(boundaryPiece, scratch.count);
  const sourceRoots = source.circles.map((x) => surface.find(scratch.loopOf[x]!));
  const targetRoots = target.circles.map((x) => surface.find(scratch.loopOf[x]!));
  const deformed = next.theory === 'deformed';
  next.tick(WORK_PER_CALL * source.objects.length * target.objects.length * (1 + comps.size));
  const baseDots = new Map<number, number>();
  for (let i = 0; i < scratch.count; i++) if ((mask >> i) & 1) bump(baseDots, surface.find(i));
  const entries: Morph[] = [];
  for (let a = 0; a < source.objects.length; a++) {
    for (let b = 0; b < target.objects.length; b++) {
      // Source circle labelled X: a dotted cup. Target circle: its 1-coordinate is the dotted cap
      // (minus h times the plain cap when deformed), its X-coordinate the plain cap.
      const variants: [Map<number, number>, number][] = [[new Map(baseDots), 1]];
      sourceRoots.forEach((root, i) => {
        if ((a >> i) & 1) for (const [dots] of variants) bump(dots, root);
      });
      targetRoots.forEach((root, i) => {
        if ((b >> i) & 1) return;
        const count = variants.length;
        for (let v = 0; v < count; v++) {
          const [dots, c] = variants[v]!;
          if (deformed) variants.push([new Map(dots), -c]);
          bump(dots, root);
        }
      });
      const entry: Morph = new Map();
      for (const [dots, c] of variants) expandSurface(next.theory, comps, dots, c, entry);
      entries.push(entry);
    }
  }
  return entries;
}

/** The reduced complex of the diagram cut open at one edge. Exported for the engines in index.ts. */
export function arcComplex(d: LinkDiagram, theory: Theory, options: LocalOptions = {}): ArcComplex {
  const n = d.crossings.length;
  if (n === 0) throw new RangeError('arcComplex needs a crossing to cut next to');
  const order = options.order ?? planContraction(d).order;
  const last = order[order.length - 1]!;
  const cut = d.crossings[last]!.edges[0];
  const steps = planSteps(d, order, cut);
  const widest = steps.reduce((m, s) => Math.max(m, s.newWidth), 0);
  const meter = { work: 0, budget: options.workBudget ?? DEFAULT_WORK_BUDGET };
  if (widest > MAX_KHOVANOV_WIDTH) {
    throw new KhovanovBudgetError(`Khovanov computation refused: the best crossing order keeps ${widest} edge ends open, more than ${MAX_KHOVANOV_WIDTH}`);
  }
  let stage = new Stage(0, theory, meter);
  stage.addObject(0, stage.matchingId(new Uint8Array(0)), 0);
  steps.forEach((plan) => {
    stage = absorb(stage, plan);
    stage.reduce();
  });
  if (stage.width !== 2) throw new Error('internal: the cut diagram did not end with two open ends');
  const live = stage.objects.filter((o) => o.alive);
  const index = new Map(live.map((o, k) => [o, k]));
  const entries: [number, number, number, number][] = [];
  live.forEach((o, k) => {
    for (const [to, morph] of o.out) entries.push([k, index.get(stage.objects[to]!)!, morph.get(0) ?? 0, morph.get(1) ?? 0]);
  });
  const nMinus = d.crossings.filter((c) => c.sign === -1).length;
  return { theory, objects: live.map((o) => ({ h: o.h, s: o.s })), entries, nPlus: n - nMinus, nMinus, work: meter.work };
}

/** Closes the arc: each object becomes a circle, labelled 1 (q + 1) or X (q − 1). */
function closedHomology(arc: ArcComplex): KhovanovHomology {
  const complex = new GradedComplex();
  const shiftQ = arc.nPlus - 2 * arc.nMinus;
  const ids = arc.objects.map((o) => [complex.addGenerator(o.h - arc.nMinus, o.s + 1 + shiftQ), complex.addGenerator(o.h - arc.nMinus, o.s - 1 + shiftQ)] as const);
  for (const [from, to, plain, dotted] of arc.entries) {
    const o = arc.objects[from]!;
    const h = o.h - arc.nMinus;
    if (plain !== 0) {
      complex.addEntry(h, o.s + 1 + shiftQ, ids[from]![0], ids[to]![0], plain);
      complex.addEntry(h, o.s - 1 + shiftQ, ids[from]![1], ids[to]![1], plain);
    }
    if (dotted !== 0) complex.addEntry(h, o.s + 1 + shiftQ, ids[from]![0], ids[to]![1], dotted);
  }
  return complex.homology();
}

/**
 * Reduced Khovanov homology over ℤ of a knot: the marked circle labelled X,
 * i.e. the dotted arc acts as zero, graded so that the unknot has ℤ at (0, 0).
 */
function reducedHomology(arc: ArcComplex): KhovanovHomology {
  const complex = new GradedComplex();
  const shiftQ = arc.nPlus - 2 * arc.nMinus;
  const ids = arc.objects.map((o) => complex.addGenerator(o.h - arc.nMinus, o.s + shiftQ));
  for (const [from, to, plain] of arc.entries) {
    const o = arc.objects[from]!;
    if (plain !== 0) complex.addEntry(o.h - arc.nMinus, o.s + shiftQ, ids[from]!, ids[to]!, plain);
  }
  return complex.homology();
}

/** Unreduced and reduced homology over ℤ from one run of the local algorithm. */
export function khovanovAndReduced(d: LinkDiagram, options: LocalOptions = {}): { unreduced: KhovanovHomology; reduced: KhovanovHomology } {
  if (d.crossings.length === 0) {
    return { unreduced: unlinkHomology(d.freeLoops), reduced: { ranks: [[0, 0, 1]], torsion: [] } };
  }
  const arc = arcComplex(d, 'khovanov', options);
  return { unreduced: withUnknottedCircles(closedHomology(arc), d.freeLoops), reduced: reducedHomology(arc) };
}
