/** The read-back check shared by the figure tests: the drawing of d reads back as d. */
import { expect } from 'vitest';
import type { LinkDiagram } from '../../src/core/diagram/model.ts';
import { drawDiagram } from '../../src/core/drawing/index.ts';
import { readBackDrawing, sameDiagram } from '../../src/core/drawing/read-back.ts';

export function expectReadsBack(d: LinkDiagram, label: string): void {
  const back = readBackDrawing(drawDiagram(d));
  expect(back.problems, label).toEqual([]);
  expect(back.intersections.length, label).toBe(d.crossings.length);
  expect(back.diagram !== undefined && sameDiagram(d, back.diagram), label).toBe(true);
}

