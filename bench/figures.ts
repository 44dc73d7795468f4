/**
 * Figures: how long drawDiagram takes and how the pictures come out, on
 * classical diagrams and on random braid closures of 100 and 500 crossings.
 * Each row is also read back (read-back.ts) so a fast wrong drawing shows up.
 * Targets: 100 crossings under 1 s, 500 under 10 s; crossing size ratio under 2,
 * without kinks (the sharpest bend) or wavy strands (turning per edge).
 * `node --import tsx bench/figures.ts` runs this table alone.
 */
import { closeBraid } from '../src/core/diagram/braid-closure.ts';
import type { LinkDiagram } from '../src/core/diagram/model.ts';
import { drawDiagram } from '../src/core/drawing/index.ts';
import { figureQuality } from '../src/core/drawing/quality.ts';
import { readBackDrawing, sameDiagram } from '../src/core/drawing/read-back.ts';
import { parseDiagramCode } from '../src/core/notation/index.ts';
import { randomAlternatingBraidWord, randomBraidWord, rng, shuffleDiagram } from '../test/support/random-diagrams.ts';

function timedDraw(d: LinkDiagram, runs: number): { ms: number; drawing: ReturnType<typeof drawDiagram> } {
  const times: number[] = [];
  let drawing = drawDiagram(d);
  for (let i = 0; i < runs; i++) {
    const start = performance.now();
    drawing = drawDiagram(d);
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  return { ms: times[Math.floor(times.length / 2)]!, drawing };
}

const format = (ms: number): string => (ms < 1000 ? `${ms.toFixed(0)} ms` : `${(ms / 1000).toFixed(2)} s`);

export function runFigureBench(): void {
  const random = rng(20261205);
  const rows: [string, LinkDiagram, number][] = [
    ['trefoil (PD)', parseDiagramCode('(1,5,2,4) (3,1,4,6) (5,3,6,2)', 'pd'), 5],
    ['figure eight (braid 1 -2 1 -2)', parseDiagramCode('1 -2 1 -2', 'braid'), 5],
    ['torus 3 4', parseDiagramCode('torus 3 4', 'family'), 5],
    ['pretzel -2 3 7', parseDiagramCode('pretzel -2 3 7', 'family'), 5],
    ['random alternating 4-braid, 100 crossings', shuffleDiagram(closeBraid(randomAlternatingBraidWord(random, 4, 100), 4), random), 3],
    ['random 8-braid, 100 crossings', shuffleDiagram(closeBraid(randomBraidWord(random, 8, 100), 8), random), 3],
    ['random alternating 6-braid, 500 crossings', shuffleDiagram(closeBraid(randomAlternatingBraidWord(random, 6, 500), 6), random), 1],
    ['random 12-braid, 500 crossings', shuffleDiagram(closeBraid(randomBraidWord(random, 12, 500), 12), random), 1],
  ];
  const lines = [
    '| diagram | crossings | draw (median) | crossing size ratio | closest strands / edge length | crossing angles | sharpest bend | turning per edge | read back |',
    '| --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: | --- |',
  ];
  for (const [label, d, runs] of rows) {
    const { ms, drawing } = timedDraw(d, runs);
    const q = figureQuality(drawing);
    const back = readBackDrawing(drawing);
    const ok = back.diagram !== undefined && sameDiagram(d, back.diagram);
    lines.push(
      `| ${label} | ${d.crossings.length} | ${format(ms)} | ${q.crossingSizeRatio.toFixed(2)} | ${q.closestStrands.toFixed(2)} | ${q.crossingAngles.min.toFixed(0)}°–${q.crossingAngles.max.toFixed(0)}° | ${q.bends.sharpest.toFixed(0)}° | ${q.bends.perEdge.toFixed(0)}° | ${ok ? 'same diagram ✓' : `WRONG: ${back.problems.length} problems`} |`,
    );
  }
  console.log(`\n${lines.join('\n')}`);
}

if (process.argv[1]?.endsWith('figures.ts')) runFigureBench();
