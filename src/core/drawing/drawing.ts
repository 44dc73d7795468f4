/**
 * drawDiagram: the whole figure of a diagram as plain geometry in figure units
 * (y upwards, origin at the lower left): one chain of cubics per component
 * (the centre line through every crossing), the strokes actually drawn (the
 * chain with a break where the component passes under), arrowheads and labels.
 * The writers (svg.ts, tikz.ts) only print it; read-back.ts checks it.
 */
import { indexDiagram, type LinkDiagram, type Sign } from '../diagram/model.ts';
import { chainTangents, componentChain, circleCubics, cutStrokes, perpendicularPair, smoothClosedChain, type ComponentChain, type Stroke } from './curves.ts';
import { cubicTangent, distance, type Cubic, type Point } from './geometry.ts';
import { crossingLabelPoints } from './label-placement.ts';
import { faceLeftOfEdge, layOutDiagram, type DiagramLayout } from './layout.ts';
import { resolveOptions, type FigureOptions, type LabelChoice } from './options.ts';

export interface DrawnCrossing {
  readonly at: Point;
  readonly sign: Sign;
  /** The local scale there (half its shortest arm to the edge-end waypoints), in figure units. */
  readonly size: number;
  /** The length of the break in its under-strand. */
  readonly gap: number;
}

export interface DrawnComponent {
  /** 0-based: the diagram's components in order, then its free loops. */
  readonly component: number;
  readonly colour: string;
  /** The closed centre line. */
  readonly centreLine: readonly Cubic[];
  readonly strokes: readonly Stroke[];
}

export interface Arrowhead {
  readonly tip: Point;
  readonly left: Point;
  readonly right: Point;
  readonly colour: string;
}

export interface Label {
  readonly text: string;
  readonly at: Point;
  readonly kind: 'crossing' | 'edge';
}

export interface Drawing {
  readonly width: number;
  readonly height: number;
  readonly lineWidth: number;
  /** Typical distance between neighbouring crossings along an edge, in figure units. */
  readonly edgeLength: number;
  readonly fontSize: number;
  readonly crossings: readonly DrawnCrossing[];
  readonly components: readonly DrawnComponent[];
  readonly arrowheads: readonly Arrowhead[];
  readonly labels: readonly Label[];
}

export type { FigureOptions } from './options.ts';

/**
 * A palette that people with the common colour-vision deficiencies can tell
 * apart (Okabe & Ito, "Color Universal Design", 2008), ordered so neighbours
 * also differ in lightness and so stay apart in greyscale.
 */
export const COMPONENT_COLOURS = ['#000000', '#e69f00', '#0072b2', '#56b4e9', '#d55e00', '#009e73', '#cc79a7'] as const;

const MARGIN = 2; // layout units (crossing radii) around the figure

export function drawDiagram(d: LinkDiagram, options: FigureOptions = {}): Drawing {
  const resolved = resolveOptions(d, options);
  const layout = layOutDiagram(d, resolved.outerEdge === undefined ? undefined : faceLeftOfEdge(d, resolved.outerEdge));
  const chains = d.components.map((_, k) => componentChain(d, layout, k));
  const tangents = crossingTangents(d, chains);
  const centreLines = chains.map((chain, k) => smoothClosedChain(chain.points, chain.room, tangents[k]));
  const loopLines = layout.loops.map((loop) => circleCubics(loop.centre, loop.radius));
  const box = boundingBox([...centreLines.flat(), ...loopLines.flat()]);
  const scale = resolved.size / (Math.max(box.maxX - box.minX, box.maxY - box.minY) + 2 * MARGIN);
  const place = (p: Point): Point => ({ x: (p.x - box.minX + MARGIN) * scale, y: (p.y - box.minY + MARGIN) * scale });
  const placeCubic = (k: Cubic): Cubic => ({ from: place(k.from), c1: place(k.c1), c2: place(k.c2), to: place(k.to) });
  const width = (box.maxX - box.minX + 2 * MARGIN) * scale;
  const height = (box.maxY - box.minY + 2 * MARGIN) * scale;

  const lineWidth = resolved.lineWidth ?? Math.min(2.5, 0.2 * scale);
  const gapWanted = resolved.gap ?? Math.max(1.2 * scale, 3 * lineWidth);
  const crossings: DrawnCrossing[] = d.crossings.map((c, i) => {
    const size = layout.crossingSize[i]! * scale;
    // Never past the waypoints next to the crossing, where the strand's neighbours begin.
    const nearest = Math.min(...[0, 1, 2, 3].map((q) => distance(layout.crossing[i]!, layout.end[4 * i + q]!))) * scale;
    return { at: place(layout.crossing[i]!), sign: c.sign, size, gap: Math.min(gapWanted, nearest) };
  });
  const colourOf = (k: number): string => (resolved.colours ? COMPONENT_COLOURS[k % COMPONENT_COLOURS.length]! : COMPONENT_COLOURS[0]);
  const components: DrawnComponent[] = chains.map((chain, k) => {
    const centreLine = centreLines[k]!.map(placeCubic);
    const cuts = chain.visits.filter((v) => v.under).map((v) => ({ at: v.at, half: crossings[v.crossing]!.gap / 2 }));
    return { component: k, colour: colourOf(k), centreLine, strokes: cutStrokes(centreLine, cuts) };
  });
  loopLines.forEach((line, i) => {
    const centreLine = line.map(placeCubic);
    components.push({ component: d.components.length + i, colour: colourOf(d.components.length + i), centreLine, strokes: [{ cubics: centreLine, closed: true }] });
  });
  const edgeLength = typicalEdgeLength(d, layout) * scale;
  const fontSize = Math.max(4, Math.min(12, 0.9 * scale));
  return {
    width,
    height,
    lineWidth,
    edgeLength,
    fontSize,
    crossings,
    components,
    arrowheads: resolved.arrows ? arrowheads(chains, components, lineWidth) : [],
    labels: labels(d, layout, chains, components, resolved.labels, place, fontSize),
  };
}

/** Each chain's tangents, with the two strands at every crossing made perpendicular. */
function crossingTangents(d: LinkDiagram, chains: readonly ComponentChain[]): Point[][] {
  const tangents = chains.map((chain) => chainTangents(chain.points));
  const passes: { component: number; at: number }[][] = d.crossings.map(() => []);
  chains.forEach((chain, k) => {
    for (const v of chain.visits) passes[v.crossing]!.push({ component: k, at: v.at });
  });
  for (const [first, second] of passes) {
    const [u, v] = perpendicularPair(tangents[first!.component]![first!.at]!, tangents[second!.component]![second!.at]!);
    tangents[first!.component]![first!.at] = u;
    tangents[second!.component]![second!.at] = v;
  }
  return tangents;
}

function boundingBox(cubics: readonly Cubic[]): { minX: number; minY: number; maxX: number; maxY: number } {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const k of cubics) {
    for (const p of [k.from, k.c1, k.c2, k.to]) {
      minX = Math.min(minX, p.x);
      minY = Math.min(minY, p.y);
      maxX = Math.max(maxX, p.x);
      maxY = Math.max(maxY, p.y);
    }
  }
  if (minX === Infinity) return { minX: 0, minY: 0, maxX: 0, maxY: 0 };
  return { minX, minY, maxX, maxY };
}

/** The median length of the waypoint polyline of an edge, crossing to crossing, in layout units. */
function typicalEdgeLength(d: LinkDiagram, layout: DiagramLayout): number {
  if (d.edgeCount === 0) return 2 * (layout.loops[0]?.radius ?? 1);
  const { tail, head } = indexDiagram(d);
  const lengths = Array.from({ length: d.edgeCount }, (_, e) => {
    const from = tail[e]!;
    const to = head[e]!;
    const path = [layout.crossing[from.crossing]!, layout.end[4 * from.crossing + from.slot]!, layout.midpoint[e]!, layout.end[4 * to.crossing + to.slot]!, layout.crossing[to.crossing]!];
    return path.slice(1).reduce((s, p, i) => s + distance(path[i]!, p), 0);
  }).sort((a, b) => a - b);
  return lengths[lengths.length >> 1]!;
}

/** One arrowhead per edge, at its midpoint, pointing along the direction of travel. */
function arrowheads(chains: ReturnType<typeof componentChain>[], components: readonly DrawnComponent[], lineWidth: number): Arrowhead[] {
  const length = 4 * lineWidth;
  const result: Arrowhead[] = [];
  chains.forEach((chain, k) => {
    const line = components[k]!.centreLine;
    for (const { at } of chain.midpoints) {
      const centre = line[at]!.from;
      const t = cubicTangent(line[at]!, 0);
      const tip = { x: centre.x + (t.x * length) / 2, y: centre.y + (t.y * length) / 2 };
      const back = { x: centre.x - (t.x * length) / 2, y: centre.y - (t.y * length) / 2 };
      const half = 0.6 * length;
      result.push({ tip, left: { x: back.x - t.y * half, y: back.y + t.x * half }, right: { x: back.x + t.y * half, y: back.y - t.x * half }, colour: components[k]!.colour });
    }
  });
  return result;
}

function labels(
  d: LinkDiagram,
  layout: DiagramLayout,
  chains: ReturnType<typeof componentChain>[],
  components: readonly DrawnComponent[],
  choice: LabelChoice,
  place: (p: Point) => Point,
  fontSize: number,
): Label[] {
  const result: Label[] = [];
  if (choice === 'crossings' || choice === 'both') {
    const corners = d.crossings.map((_, c) => ({
      at: place(layout.crossing[c]!),
      arms: [0, 1, 2, 3].map((q) => place(layout.end[4 * c + q]!)),
      text: `${c + 1}`,
    }));
    const points = crossingLabelPoints(
      corners,
      components.map((k) => k.centreLine),
      fontSize,
    );
    corners.forEach((c, i) => result.push({ text: c.text, at: points[i]!, kind: 'crossing' }));
  }
  if (choice === 'edges' || choice === 'both') {
    chains.forEach((chain, k) => {
      const line = components[k]!.centreLine;
      for (const { at, edge } of chain.midpoints) {
        const centre = line[at]!.from;
        const t = cubicTangent(line[at]!, 0);
        // To the left of the direction of travel, clear of the stroke.
        const offset = 0.9 * fontSize;
        result.push({ text: `${edge + 1}`, at: { x: centre.x - t.y * offset, y: centre.y + t.x * offset }, kind: 'edge' });
      }
    });
  }
  return result;
}
