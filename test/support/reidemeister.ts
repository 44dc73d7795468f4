/**
 * Random Reidemeister moves on diagrams, for invariance tests. The second move
 * is written here from its picture (a finger of one side of a face pushed over
 * or under another side of the same face), independently of the simplifier,
 * which only ever removes bigons; the first and third moves and the removals
 * come from the core's surgery and simplifier. Every result is printed as a PD
 * code and read back, so the PD reader sees each diagram as a user would write it.
 */
import { assembleDiagram, type RawCrossing } from '../../src/core/diagram/assemble.ts';
import { faceStructure } from '../../src/core/diagram/faces.ts';
import { indexDiagram, slotIsIncoming, type LinkDiagram, type Sign } from '../../src/core/diagram/model.ts';
import { addCurl } from '../../src/core/diagram/operations.ts';
import { parseDiagramCode, printPdCode } from '../../src/core/notation/index.ts';
import { deleteCrossings, overBigons, slidableTriangles, slideTriangle } from '../../src/core/simplify/moves.ts';
import { randomInt } from './random-diagrams.ts';

type Edges = [number, number, number, number];

/** One strand end at a new crossing: its label and whether the strand enters there. */
interface End {
  readonly label: number;
  readonly incoming: boolean;
}

/**
 * A crossing from its four ends listed counterclockwise (east, north, west,
 * south), the horizontal strand at east/west and the vertical one at north/south.
 * Slots start at the incoming under end; the crossing is positive when the over
 * strand enters at slot 3 (common practice: right-handed crossings are positive).
 */
function crossingFromEnds(ends: readonly [End, End, End, End], horizontalOver: boolean): RawCrossing {
  const underPositions = horizontalOver ? [1, 3] : [0, 2];
  const start = underPositions.find((p) => ends[p]!.incoming)!;
  const edges = [0, 1, 2, 3].map((k) => ends[(start + k) % 4]!.label) as Edges;
  const overIncomingSlot = [1, 3].find((k) => ends[(start + k) % 4]!.incoming)!;
  return { edges, sign: (overIncomingSlot === 3 ? 1 : -1) as Sign };
}

/**
 * Reidemeister II: the side at corner `corner1` of a face is pushed across the
 * face and over (or under) the side at `corner2`, making two new crossings and a
 * bigon. Returns undefined when the two sides are the same edge or an edge
 * bounds the face twice (a finger would then have to cross itself).
 *
 * The picture, with the face walked so that it lies on the left: the second
 * side runs east along the bottom, the first runs west along the top; the
 * finger leaves the first side, goes down at the east (crossing Q), along
 * below the second side and back up at the west (crossing P).
 */
export function pushFinger(d: LinkDiagram, corner1: number, corner2: number, over: boolean): LinkDiagram | undefined {
  const { opposite } = indexDiagram(d);
  const face = faceStructure(d).faces[faceStructure(d).faceOfCorner[corner1]!]!;
  const edgeAt = (corner: number) => d.crossings[corner >> 2]!.edges[corner & 3]!;
  const [e1, e2] = [edgeAt(corner1), edgeAt(corner2)];
  if (e1 === e2 || face.filter((c) => edgeAt(c) === e1 || edgeAt(c) === e2).length !== 2) return undefined;
  // Travel agrees with the walk when the side leaves its corner's crossing through an outgoing slot.
  const alongWalk = (corner: number) => !slotIsIncoming(corner & 3, d.crossings[corner >> 2]!.sign);
  const [forward1, forward2] = [alongWalk(corner1), alongWalk(corner2)];
  const raw = d.crossings.map((c) => [...c.edges] as Edges);
  let next = d.edgeCount;
  // Pieces in walking order: a (at the corner's end), m (between the new crossings), b (at the far end).
  const [a1, m1, b1, a2, m2, b2] = [next++, next++, next++, next++, next++, next++];
  for (const [corner, first, last] of [
    [corner1, a1, b1],
    [corner2, a2, b2],
  ] as const) {
    const far = opposite[corner]!;
    raw[corner >> 2]![corner & 3] = first;
    raw[far >> 2]![far & 3] = last;
  }
  // P (west): second side a2 → m2 west to east, first side m1 → b1 south to north (in walking directions).
  const p = crossingFromEnds(
    [
      { label: m2, incoming: !forward2 },
      { label: b1, incoming: !forward1 },
      { label: a2, incoming: forward2 },
      { label: m1, incoming: forward1 },
    ],
    !over,
  );
  // Q (east): second side m2 → b2 west to east, first side a1 → m1 north to south.
  const q = crossingFromEnds(
    [
      { label: b2, incoming: !forward2 },
      { label: a1, incoming: forward1 },
      { label: m2, incoming: forward2 },
      { label: m1, incoming: !forward1 },
    ],
    !over,
  );
  const crossings: RawCrossing[] = [...raw.map((edges, i) => ({ edges, sign: d.crossings[i]!.sign })), p, q];
  return assembleDiagram(crossings, { notation: d.notation, freeLoops: d.freeLoops, chiralityFixed: d.chiralityFixed });
}

export type MoveKind = 'R1+' | 'R1-' | 'R2+' | 'R2-' | 'R3';

/** Nugatory crossings that are kinks: one edge joins two of the crossing's own slots. */
function kinks(d: LinkDiagram): number[] {
  const { opposite } = indexDiagram(d);
  return d.crossings.flatMap((_, c) => ([0, 1, 2, 3].some((s) => opposite[4 * c + s]! >> 2 === c) ? [c] : []));
}

function pick<T>(random: () => number, items: readonly T[]): T | undefined {
  return items.length === 0 ? undefined : items[randomInt(random, 0, items.length - 1)];
}

/** One random move of the given kind, or undefined when the diagram has no place for it. */
export function randomMove(d: LinkDiagram, kind: MoveKind, random: () => number): LinkDiagram | undefined {
  if (d.crossings.length === 0) return kind === 'R1+' && d.edgeCount > 0 ? addCurl(d, 0, random() < 0.5 ? 1 : -1, random() < 0.5) : undefined;
  switch (kind) {
    case 'R1+':
      return addCurl(d, randomInt(random, 0, d.edgeCount - 1), random() < 0.5 ? 1 : -1, random() < 0.5);
    case 'R1-': {
      const kink = pick(random, kinks(d));
      return kink === undefined ? undefined : deleteCrossings(d, new Set([kink]));
    }
    case 'R2+': {
      const { faces } = faceStructure(d);
      const face = faces[randomInt(random, 0, faces.length - 1)]!;
      if (face.length < 2) return undefined;
      const i = randomInt(random, 0, face.length - 1);
      const j = (i + randomInt(random, 1, face.length - 1)) % face.length;
      return pushFinger(d, face[i]!, face[j]!, random() < 0.5);
    }
    case 'R2-': {
      const bigon = pick(random, overBigons(d));
      return bigon === undefined ? undefined : deleteCrossings(d, new Set(bigon));
    }
    case 'R3': {
      const triangle = pick(random, slidableTriangles(d));
      return triangle === undefined ? undefined : slideTriangle(d, triangle);
    }
  }
}

const KINDS: readonly MoveKind[] = ['R1+', 'R1-', 'R2+', 'R2+', 'R2-', 'R3', 'R3'];

/**
 * `steps` random moves (a step with no place for its move is skipped), each
 * result read back from its PD code. Free loops cannot be written as PD, so a
 * diagram with them is moved without the round trip. Returns the moves made.
 */
export function randomMoves(d: LinkDiagram, steps: number, random: () => number): { diagram: LinkDiagram; moves: MoveKind[] } {
  let diagram = d;
  const moves: MoveKind[] = [];
  for (let s = 0; s < steps; s++) {
    const kind = KINDS[randomInt(random, 0, KINDS.length - 1)]!;
    const moved = randomMove(diagram, kind, random);
    if (!moved) continue;
    diagram = moved.freeLoops === 0 && moved.crossings.length > 0 ? parseDiagramCode(printPdCode(moved), 'pd') : moved;
    moves.push(kind);
  }
  return { diagram, moves };
}
