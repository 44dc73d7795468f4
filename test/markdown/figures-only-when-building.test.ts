/**
 * `check` never lays a figure out: the drawing core is called only by a build, once per figure, in both
 * front ends. The core's drawDiagram is wrapped in a counting spy (the real function still runs).
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeEach, describe, expect, it, vi } from 'vitest';
import { markdownFormat } from '../../src/cli/formats/markdown.ts';
import { latexFormat } from '../../src/cli/formats/latex.ts';
import * as drawing from '../../src/core/drawing/index.ts';
import { positionOf, processMarkdown, placed } from './helpers.ts';

vi.mock('../../src/core/drawing/index.ts', async (importOriginal) => {
  const real = await importOriginal<typeof import('../../src/core/drawing/index.ts')>();
  return { ...real, drawDiagram: vi.fn(real.drawDiagram) };
});

const work = mkdtempSync(join(tmpdir(), 'skeinproof-figure-cost-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));
// A hook that returned the mock would have it called as a teardown: hence the braces.
beforeEach(() => {
  vi.mocked(drawing.drawDiagram).mockClear();
});

const TREFOIL = '```skein id=k notation=braid\n1 1 1\n```\n';

describe('the drawing is computed', () => {
  it('not by a Markdown check, once per figure by its build', async () => {
    const path = join(work, 'two.md');
    writeFileSync(path, `${TREFOIL}\n::drawing{of=k}\n\n::drawing{of=k arrows=yes}\n\nNo figure of this one: :writhe[$3$]{of=k}.\n`);
    const checked = await markdownFormat.check(path, {});
    expect(checked.diagnostics).toEqual([]);
    expect(drawing.drawDiagram).not.toHaveBeenCalled();
    await markdownFormat.build(path, { output: join(work, 'two.filled.md') });
    expect(drawing.drawDiagram).toHaveBeenCalledTimes(2);
  });

  it('not by a LaTeX check, once per figure by either build', async () => {
    const path = join(work, 'paper.tex');
    writeFileSync(
      path,
      '\\documentclass{article}\n\\usepackage{skeinproof}\n\\begin{document}\n\\begin{skeincode}{id=k, notation=braid}\n1 1 1\n\\end{skeincode}\n\\skeindrawing[size=3cm]{k}\n\\end{document}\n',
    );
    expect((await latexFormat.check(path, {})).diagnostics).toEqual([]);
    expect(drawing.drawDiagram).not.toHaveBeenCalled();
    await latexFormat.build(path, {});
    await latexFormat.build(path, { output: join(work, 'flat.tex') });
    expect(drawing.drawDiagram).toHaveBeenCalledTimes(2);
  });

  it('not for diagrams without a figure', async () => {
    await processMarkdown(`${TREFOIL}\nThe writhe is :writhe{of=k}.\n`);
    expect(drawing.drawDiagram).not.toHaveBeenCalled();
  });
});

describe('settings the drawing could not honour', () => {
  it('are reported by the check, in the author’s units: strokes wider than a tenth of the figure, gaps wider than a fifth', async () => {
    const text = `${TREFOIL}\n::drawing{of=k size=1in line-width=8pt gap=6mm}\n`;
    const r = await processMarkdown(text, { draw: false });
    expect(placed(r.diagnostics)).toEqual([`error figure-option-invalid ${positionOf(text, '8pt')}`, `error figure-option-invalid ${positionOf(text, '6mm')}`]);
    expect(r.diagnostics[0]!.message).toContain('more than a tenth of the figure\'s size (size=1in)');
    // 1 in / 10 = 7.2 bp and 7pt is 6.97 bp (common practice: 72.27 pt and 72 bp to the inch): accepted, and drawn.
    const fine = await processMarkdown(`${TREFOIL}\n::drawing{of=k size=1in line-width=7pt}\n`);
    expect(fine.diagnostics).toEqual([]);
    expect(drawing.drawDiagram).toHaveBeenCalledTimes(1);
  });
});
