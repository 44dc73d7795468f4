/**
 * What figures cost a manuscript, run as a user runs the command line (`npm run bench` prints this table
 * after the others): the same 40 diagrams with and without a figure each, side by side in one run. `check`
 * must cost the same either way (it never lays a figure out); the builds pay for drawing. Each build's
 * output is checked to hold one picture per figure.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const ROOT = join(import.meta.dirname, '..');
const BIN = join(ROOT, 'bin', 'skeinproof.js');
const DIAGRAMS = 40;
const CODES = ['torus 2 5', 'torus 3 4', 'torus 2 7', 'torus 3 5', 'torus 2 9', 'torus 4 5', 'torus 2 11', 'torus 3 7', 'torus 5 6', 'torus 2 13'];

function markdown(figures: boolean): string {
  const parts = ['# Figures bench\n'];
  for (let i = 0; i < DIAGRAMS; i++) {
    parts.push(`\`\`\`skein id=d${i} notation=family\n${CODES[i % CODES.length]}\n\`\`\`\n\nIts writhe is :writhe{of=d${i}}.\n`);
    if (figures) parts.push(`::drawing[Diagram ${i}]{of=d${i} size=5cm arrows=yes}\n`);
  }
  return parts.join('\n');
}

function latex(figures: boolean): string {
  const parts = ['\\documentclass{article}\n\\usepackage{skeinproof}\n\\begin{document}\n'];
  for (let i = 0; i < DIAGRAMS; i++) {
    parts.push(`\\begin{skeincode}{id=d${i}, notation=family}\n${CODES[i % CODES.length]}\n\\end{skeincode}\nIts writhe is \\skeinwrithe{d${i}}.\n`);
    if (figures) parts.push(`\\skeindrawing[size=5cm, arrows=yes]{d${i}}\n`);
  }
  parts.push('\\end{document}\n');
  return parts.join('');
}

function wallMs(args: readonly string[]): number {
  const start = performance.now();
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd: ROOT, stdio: 'ignore' });
  if (r.status !== 0) throw new Error(`skeinproof ${args.join(' ')} failed with status ${r.status}`);
  return performance.now() - start;
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)]!;
}

const format = (ms: number): string => (ms < 1000 ? `${ms.toFixed(0)} ms` : `${(ms / 1000).toFixed(2)} s`);

export function runFigureManuscriptBench(): void {
  const dir = mkdtempSync(join(tmpdir(), 'skeinproof-figure-bench-'));
  try {
    for (const figures of [false, true]) {
      const name = figures ? 'with' : 'without';
      writeFileSync(join(dir, `${name}.md`), markdown(figures));
      writeFileSync(join(dir, `${name}.tex`), latex(figures));
    }
    const commands: [string, (name: string) => string[], string, RegExp][] = [
      ['`check` (Markdown)', (n) => ['check', join(dir, `${n}.md`)], '', /$^/],
      ['`build -o NAME.md`', (n) => ['build', join(dir, `${n}.md`), '-o', join(dir, `${n}.filled.md`)], 'filled.md', /<svg /g],
      ['`build -o NAME.html`', (n) => ['build', join(dir, `${n}.md`), '-o', join(dir, `${n}.html`)], 'html', /<svg /g],
      ['`check` (LaTeX)', (n) => ['check', join(dir, `${n}.tex`)], '', /$^/],
      ['`build` (LaTeX sidecar)', (n) => ['build', join(dir, `${n}.tex`)], 'skein.tex', /\\begin\{tikzpicture\}/g],
    ];
    const lines = [
      `| command (median of 5, ${DIAGRAMS} family diagrams) | without figures | with a figure each | drawing per figure | pictures in the output |`,
      '| --- | ---: | ---: | ---: | ---: |',
    ];
    for (const [label, args, extension, picture] of commands) {
      const times: Record<string, number[]> = { without: [], with: [] };
      for (let run = 0; run < 5; run++) for (const name of ['without', 'with']) times[name]!.push(wallMs(args(name)));
      const without = median(times['without']!);
      const withFigures = median(times['with']!);
      const pictures = extension === '' ? '—' : String(readFileSync(join(dir, `with.${extension}`), 'utf8').match(picture)?.length ?? 0);
      if (extension !== '' && pictures !== String(DIAGRAMS)) throw new Error(`${label}: ${pictures} pictures in the output, expected ${DIAGRAMS}`);
      lines.push(`| ${label} | ${format(without)} | ${format(withFigures)} | ${format((withFigures - without) / DIAGRAMS)} | ${pictures} |`);
    }
    console.log('\nFigures in a manuscript (check draws nothing; builds draw each figure once):\n');
    console.log(lines.join('\n'));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

if (import.meta.url === `file://${process.argv[1]}`) runFigureManuscriptBench();
