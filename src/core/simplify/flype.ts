/**
 * Flypes on the diagram model. A flype takes a crossing c that sits beside a
 * tangle T with four ends (two of c's edges run into T), turns T over about the
 * axis through c, and so moves c to T's other side. It keeps the link and the
 * crossing count; it pays when the moved crossing lands beside another one it
 * can cancel with (Reidemeister II) or otherwise opens a move the simplifier
 * takes. A flype keeps a diagram alternating (or not) and keeps its adequacy,
 * so on its own it never turns an undecided diagram into a decided one.
 *
 * Picture c on the left with its ends upper-left (UL), lower-left (LL),
 * lower-right (LR) and upper-right (UR), counterclockwise; UR runs into T's
 * north-west end and LR into its south-west end. Above the picture lies the
 * face F₁ (at c's corner between UR and UL), below it F₂ (between LL and LR).
 * T is closed off on its right by two edges: the north-east one between F₁ and
 * a face F₃ right of T, the south-east one between F₃ and F₂. The closed curve
 * through the four faces (the one right of c, F₂, F₃, F₁) crosses the diagram
 * exactly at T's four ends, so it bounds T.
 *
 * Turning T over about the horizontal axis reflects its projection (north and
 * south swap, every rotation at its crossings reverses) and exchanges over and
 * under at each of its crossings; the strands keep their direction, so the
 * signs stay. Its north-west end now lies where the south-west end was, so
 * UL and LR of c join without crossing, as do LL and UR, and c disappears on
 * the left; on the right the north-east and south-east strands now cross, in
 * a new crossing of the same kind as c (the strand from lower left to upper
 * right is over in both, or under in both).
 */
import { assembleDiagram, type RawCrossing } from '../diagram/assemble.ts';
import { faceStructure } from '../diagram/faces.ts';
import { indexDiagram, isOverSlot, slotIsIncoming, type LinkDiagram } from '../diagram/model.ts';

/** Where a flype may be: a crossing, the side it faces the tangle on, and the tangle's far edges. */
export interface FlypeSite {
  readonly crossing: number;
  /** Slot of `crossing` (the LR end) whose edge and the next one counterclockwise (UR) run into the tangle. */
  readonly slot: number;
  /** A slot id (4·crossing + slot) at one end of the tangle's north-east edge, and of its south-east edge. */
  readonly northEast: number;
  readonly southEast: number;
  /**
   * True when the far edges end at one crossing in the way that makes the moved crossing and that
   * one a bigon with one strand over at both ends, which Reidemeister II then removes (if that
   * crossing lies outside the tangle, which only making the flype tells).
   */
  readonly opensBigon: boolean;
}

const next = (slotId: number, by: number): number => (slotId & ~3) | (((slotId & 3) + by) & 3);

/**
 * Every place where a flype can be made: each crossing, each pair of its
 * neighbouring edges that lead away from it, and each face F₃ that closes
 * off a tangle there (a side on F₁ and a side on F₂). The tangle itself is
 * found when the flype is made (`flype`), which refuses sites where it is not
 * a proper tangle. Sites that open a bigon for Reidemeister II come first.
 */
export function flypeSites(d: LinkDiagram): FlypeSite[] {
  const { opposite } = indexDiagram(d);
  const { faceOfCorner, faces } = faceStructure(d);
  // The face across the edge at slot id s from the face of corner s: that of corner s − 1.
  const across = (s: number): number => faceOfCorner[next(s, 3)]!;
  const bigons: FlypeSite[] = [];
  const others: FlypeSite[] = [];
  for (let c = 0; c < d.crossings.length; c++) {
    for (let q = 0; q < 4; q++) {
      const lowerRight = 4 * c + q;
      const upperRight = next(lowerRight, 1);
      if (opposite[lowerRight]! >> 2 === c || opposite[upperRight]! >> 2 === c) continue;
      const right = faceOfCorner[lowerRight]!;
      const above = faceOfCorner[upperRight]!;
      const below = faceOfCorner[next(lowerRight, 3)]!;
      // One face above and below c is a nugatory crossing: undone, not flyped.
      if (above === below || right === above || right === below) continue;
      const farFaces = new Map<number, number[]>();
      for (const side of faces[above]!) {
        const f = across(side);
        if (f !== right && f !== above && f !== below) farFaces.set(f, [...(farFaces.get(f) ?? []), side]);
      }
      for (const southEast of faces[below]!) {
        for (const northEast of farFaces.get(across(southEast)) ?? []) {
          const opensBigon = [northEast, opposite[northEast]!].some(
            (a) => a >> 2 !== c && [southEast, opposite[southEast]!].some((b) => b >> 2 === a >> 2) && isOverSlot(a & 3) === isOverSlot(upperRight & 3),
          );
          (opensBigon ? bigons : others).push({ crossing: c, slot: q, northEast, southEast, opensBigon });
        }
      }
    }
  }
  return [...bigons, ...others];
}

/**
 * The crossings of the tangle at a site: those reached from the north-west
 * end without passing one of the four ends. Undefined when the site does not
 * bound a tangle worth turning (it reaches c, has fewer than two crossings,
 * or leaves nothing but c outside).
 */
function tangleAt(d: LinkDiagram, site: FlypeSite): Set<number> | undefined {
  const { opposite } = indexDiagram(d);
  const lowerRight = 4 * site.crossing + site.slot;
  const upperRight = next(lowerRight, 1);
  const cut = new Set<number>();
  for (const s of [lowerRight, upperRight, site.northEast, site.southEast]) cut.add(s).add(opposite[s]!);
  const inside = new Set<number>([opposite[upperRight]! >> 2]);
  const stack = [...inside];
  while (stack.length > 0) {
    const x = stack.pop()!;
    for (let s = 4 * x; s < 4 * x + 4; s++) {
      if (cut.has(s)) continue;
      const y = opposite[s]! >> 2;
      if (!inside.has(y)) {
        inside.add(y);
        stack.push(y);
      }
    }
  }
  if (inside.has(site.crossing) || inside.size < 2 || inside.size >= d.crossings.length - 1) return undefined;
  // A proper tangle has exactly one end of each of its four edges inside.
  for (const s of [lowerRight, upperRight, site.northEast, site.southEast]) {
    if (inside.has(s >> 2) === inside.has(opposite[s]! >> 2)) return undefined;
  }
  return inside;
}

/** The diagram after the flype at `site`, or undefined when the site bounds no tangle to turn. */
export function flype(d: LinkDiagram, site: FlypeSite): LinkDiagram | undefined {
  const tangle = tangleAt(d, site);
  if (!tangle) return undefined;
  const { opposite } = indexDiagram(d);
  const n = d.crossings.length;
  // Ends are slot ids; the new crossing's ends are 4n + 0…3, named by where they sit.
  const [newUpperLeft, newLowerLeft, newLowerRight, newUpperRight] = [4 * n, 4 * n + 1, 4 * n + 2, 4 * n + 3];
  const partner = Int32Array.from({ length: 4 * n + 4 }, (_, s) => (s < 4 * n ? opposite[s]! : -1));
  const incoming = Array.from({ length: 4 * n + 4 }, (_, s) => s < 4 * n && slotIsIncoming(s & 3, d.crossings[s >> 2]!.sign));
  const join = (a: number, b: number) => {
    partner[a] = b;
    partner[b] = a;
  };
  const splitEdge = (end: number, newEnd: number) => {
    // The new crossing's end takes the direction the far end of the edge had.
    incoming[newEnd] = !incoming[end];
    join(end, newEnd);
  };
  const innerEnd = (s: number) => (tangle.has(s >> 2) ? s : opposite[s]!);
  // The new crossing on the right: the north-east strand now arrives at its lower left, the south-east one at its upper left.
  const [innerNE, innerSE] = [innerEnd(site.northEast), innerEnd(site.southEast)];
  splitEdge(innerNE, newLowerLeft);
  splitEdge(opposite[innerNE]!, newUpperRight);
  splitEdge(innerSE, newUpperLeft);
  splitEdge(opposite[innerSE]!, newLowerRight);
  // The old crossing goes: each of its strands is carried straight through.
  const c = site.crossing;
  const lowerRight = 4 * c + site.slot;
  const [upperRight, upperLeft, lowerLeft] = [next(lowerRight, 1), next(lowerRight, 2), next(lowerRight, 3)];
  join(partner[upperLeft]!, partner[lowerRight]!);
  join(partner[lowerLeft]!, partner[upperRight]!);

  // Each crossing as its ends counterclockwise with the under strand at positions 0 and 2.
  const rings: number[][] = d.crossings.map((_, x) => (tangle.has(x) ? [4 * x + 3, 4 * x + 2, 4 * x + 1, 4 * x] : [4 * x, 4 * x + 1, 4 * x + 2, 4 * x + 3]));
  // Same kind as c: the strand from lower left to upper right is over at both or at neither.
  rings[c] = isOverSlot(upperRight & 3) ? [newUpperLeft, newLowerLeft, newLowerRight, newUpperRight] : [newLowerLeft, newLowerRight, newUpperRight, newUpperLeft];
  const label = new Int32Array(4 * n + 4).fill(-1);
  let labels = 0;
  const raw: RawCrossing[] = rings.map((ring) => {
    for (const end of ring) if (label[end]! < 0) label[end] = label[partner[end]!] = labels++;
    const [r0, r1, r2, r3] = incoming[ring[0]!] ? ring : [ring[2]!, ring[3]!, ring[0]!, ring[1]!];
    if (!incoming[r0!] || incoming[r2!] || incoming[r1!] === incoming[r3!]) throw new Error('internal: a flype broke the orientation of a strand');
    return { edges: [label[r0!]!, label[r1!]!, label[r2!]!, label[r3!]!], sign: incoming[r3!] ? 1 : -1 };
  });
  return assembleDiagram(raw, { notation: d.notation, freeLoops: d.freeLoops, chiralityFixed: d.chiralityFixed });
}
