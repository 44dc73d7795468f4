/**
 * Where a diagram goes in the plane: each connected piece of the projection is
 * circle-packed (triangulation.ts, circle-packing.ts) with its outer face as the
 * removed vertex; crossings sit at their circles' centres and each edge runs
 * through the centres of its end, midpoint and end circles. The packing shrinks
 * twist regions and clasps, so each piece is then relaxed (relaxed-piece.ts)
 * without changing its embedding. Pieces are set side by side in rows,
 * followed by the free loops.
 */
import { indexDiagram, type LinkDiagram } from '../diagram/model.ts';
import { connectedPieces, faceStructure } from '../diagram/faces.ts';
import { packDisc } from './circle-packing.ts';
import { relaxPiece } from './relaxed-piece.ts';
import { cornerVertex, crossingVertex, endVertex, faceVertex, midpointVertex, packingComplex } from './triangulation.ts';
import type { Point } from './geometry.ts';

export interface DiagramLayout {
  /** Per crossing: its centre. */
  readonly crossing: readonly Point[];
  /** Per crossing: half its shortest arm (crossing to edge end), the local scale of the drawing there. */
  readonly crossingSize: readonly number[];
  /** Per slot 4c+q: the waypoint on that edge next to the crossing. */
  readonly end: readonly Point[];
  /** Per edge: its midpoint. */
  readonly midpoint: readonly Point[];
  /**
   * Per edge e and k = 0…3: a lower bound on the distance from the k-th straight
   * segment along it (crossing, end, midpoint, end, crossing) to every segment
   * sharing no point with it: how far a curve along it may bend.
   */
  readonly segmentRoom: readonly number[];
  /** Per free loop: its centre and radius. */
  readonly loops: readonly { readonly centre: Point; readonly radius: number }[];
}

/** The face on the left of an edge (the corner just clockwise of where it leaves its tail crossing). */
export function faceLeftOfEdge(d: LinkDiagram, edge: number): number {
  const { tail } = indexDiagram(d);
  const t = tail[edge]!;
  return faceStructure(d).faceOfCorner[4 * t.crossing + t.slot]!;
}

/** The largest face of each piece (most corners; the lowest-numbered among equals), or the one asked for. */
function outerFaces(d: LinkDiagram, pieceOfCrossing: Int32Array, pieceCount: number, chosen: number | undefined): number[] {
  const { faces } = faceStructure(d);
  const outer = new Array<number>(pieceCount).fill(-1);
  faces.forEach((corners, f) => {
    const p = pieceOfCrossing[corners[0]! >> 2]!;
    if (outer[p]! < 0 || corners.length > faces[outer[p]!]!.length) outer[p] = f;
  });
  if (chosen !== undefined) outer[pieceOfCrossing[faces[chosen]![0]! >> 2]!] = chosen;
  return outer;
}

/** Layout units: each piece's packing is scaled to median crossing radius 1 before it is relaxed. */
export function layOutDiagram(d: LinkDiagram, outerFace?: number): DiagramLayout {
  const n = d.crossings.length;
  const { pieceOfCrossing, pieceCount } = connectedPieces(d);
  const { faces, faceCount } = faceStructure(d);
  const { opposite } = indexDiagram(d);
  const outer = outerFaces(d, pieceOfCrossing, pieceCount, outerFace);
  const complex = packingComplex(d, new Set(outer));
  const radius = new Float64Array(complex.vertexCount);
  const x = new Float64Array(complex.vertexCount);
  const y = new Float64Array(complex.vertexCount);
  const vertices: number[][] = Array.from({ length: pieceCount }, () => []);
  // Crossings first, so each disc is laid out from a crossing (never on the boundary).
  for (let c = 0; c < n; c++) vertices[pieceOfCrossing[c]!]!.push(crossingVertex(c));
  for (let s = 0; s < 4 * n; s++) vertices[pieceOfCrossing[s >> 2]!]!.push(endVertex(n, s), cornerVertex(n, s));
  for (let s = 0; s < 4 * n; s++) if (s < opposite[s]!) vertices[pieceOfCrossing[s >> 2]!]!.push(midpointVertex(n, d.crossings[s >> 2]!.edges[s & 3]!));
  for (let f = 0; f < faceCount; f++) {
    const piece = pieceOfCrossing[faces[f]![0]! >> 2]!;
    vertices[piece]!.push(...complex.fill[f]!);
    if (f !== outer[piece]) vertices[piece]!.push(faceVertex(n, f));
  }
  const boxes: Box[] = [];
  const room = new Float64Array(4 * d.edgeCount);
  for (let p = 0; p < pieceCount; p++) {
    packDisc(complex.flowers, vertices[p]!, faceVertex(n, outer[p]!), radius, x, y);
    normalisePiece(vertices[p]!, n, radius, x, y);
    relaxPiece(d, vertices[p]!.filter((v) => v < n), x, y, room);
    boxes.push(boxOf(vertices[p]!, n, x, y));
  }
  const loops = Array.from({ length: d.freeLoops }, (): Box => ({ vertices: [], minX: -2, minY: -2, maxX: 2, maxY: 2 }));
  const offsets = arrangeInRows([...boxes, ...loops]);
  const at = (v: number, p: number): Point => ({ x: x[v]! + offsets[p]!.x, y: y[v]! + offsets[p]!.y });
  return {
    crossing: Array.from({ length: n }, (_, c) => at(crossingVertex(c), pieceOfCrossing[c]!)),
    crossingSize: Array.from({ length: n }, (_, c) => shortestArm(n, c, x, y) / 2),
    end: Array.from({ length: 4 * n }, (_, s) => at(endVertex(n, s), pieceOfCrossing[s >> 2]!)),
    midpoint: midpoints(d, (e, p) => at(midpointVertex(n, e), p), pieceOfCrossing),
    segmentRoom: Array.from(room),
    loops: loops.map((_, i) => ({ centre: { x: offsets[pieceCount + i]!.x, y: offsets[pieceCount + i]!.y }, radius: 1.5 })),
  };
}

function midpoints(d: LinkDiagram, at: (edge: number, piece: number) => Point, pieceOfCrossing: Int32Array): Point[] {
  const { tail } = indexDiagram(d);
  return Array.from({ length: d.edgeCount }, (_, e) => at(e, pieceOfCrossing[tail[e]!.crossing]!));
}

interface Box {
  readonly vertices: readonly number[];
  readonly minX: number;
  readonly minY: number;
  readonly maxX: number;
  readonly maxY: number;
}

function shortestArm(n: number, c: number, x: Float64Array, y: Float64Array): number {
  return Math.min(...[0, 1, 2, 3].map((q) => Math.hypot(x[endVertex(n, 4 * c + q)]! - x[c]!, y[endVertex(n, 4 * c + q)]! - y[c]!)));
}

/** Scales a packed piece so its median crossing radius is 1. */
function normalisePiece(vertices: readonly number[], n: number, radius: Float64Array, x: Float64Array, y: Float64Array): void {
  const crossingRadii = vertices.filter((v) => v < n).map((v) => radius[v]!).sort((a, b) => a - b);
  const scale = 1 / crossingRadii[crossingRadii.length >> 1]!;
  for (const v of vertices) {
    radius[v] = radius[v]! * scale;
    x[v] = x[v]! * scale;
    y[v] = y[v]! * scale;
  }
}

/** The bounding box of a piece's drawn points. */
function boxOf(vertices: readonly number[], n: number, x: Float64Array, y: Float64Array): Box {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const v of vertices) {
    // Only crossings, edge ends and midpoints are points the curves pass through (corners,
    // face centres and fillings keep their packed places, which relaxation leaves behind).
    if (v >= cornerVertex(n, 0)) continue;
    minX = Math.min(minX, x[v]!);
    minY = Math.min(minY, y[v]!);
    maxX = Math.max(maxX, x[v]!);
    maxY = Math.max(maxY, y[v]!);
  }
  return { vertices, minX, minY, maxX, maxY };
}

const PIECE_SPACING = 3;

/**
 * Offsets that put the boxes in rows, left to right, each row about as wide as
 * the square root of the total area, so many pieces make a block, not a strip.
 * Rows are built bottom-up in the order given; the first row ends up on top.
 */
function arrangeInRows(boxes: readonly Box[]): Point[] {
  const area = boxes.reduce((s, b) => s + (b.maxX - b.minX + PIECE_SPACING) * (b.maxY - b.minY + PIECE_SPACING), 0);
  const widest = Math.max(0, ...boxes.map((b) => b.maxX - b.minX));
  const rowWidth = Math.max(widest, Math.sqrt(area) * 1.2);
  const rows: { members: number[]; width: number; height: number }[] = [];
  boxes.forEach((b, i) => {
    const w = b.maxX - b.minX;
    const h = b.maxY - b.minY;
    const row = rows[rows.length - 1];
    if (row && row.width + PIECE_SPACING + w <= rowWidth) {
      row.members.push(i);
      row.width += PIECE_SPACING + w;
      row.height = Math.max(row.height, h);
    } else rows.push({ members: [i], width: w, height: h });
  });
  const offsets: Point[] = new Array(boxes.length);
  let top = 0;
  for (const row of rows) {
    let left = 0;
    for (const i of row.members) {
      const b = boxes[i]!;
      // Centred vertically in its row; rows go downwards.
      const centreY = top - row.height / 2;
      offsets[i] = { x: left - b.minX, y: centreY - (b.minY + b.maxY) / 2 };
      left += b.maxX - b.minX + PIECE_SPACING;
    }
    top -= row.height + PIECE_SPACING;
  }
  return offsets;
}
