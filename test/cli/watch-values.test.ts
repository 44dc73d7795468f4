/**
 * What `watch` keeps from save to save (ManuscriptValues): after an edit, only a diagram whose code (or
 * the keys asked of it) changed is computed again, and the report is exactly that of a fresh run.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { markdownFormat } from '../../src/cli/formats/markdown.ts';
import { ManuscriptValues } from '../../src/cli/manuscript-pool.ts';

const work = mkdtempSync(join(tmpdir(), 'skeinproof-watch-values-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));
const path = join(work, 'paper.md');

/** Three diagrams; the values claimed are the positive trefoil's det 3, the figure-eight's det 5 and the Hopf link's |lk| = 1 (from memory). */
function manuscript(trefoilDeterminant: string, eightCode: string): string {
  return [
    '```skein id=trefoil notation=braid\n1 1 1\n```',
    `The trefoil has determinant :determinant[$${trefoilDeterminant}$]{of=trefoil} and Jones polynomial :jones{of=trefoil}.`,
    `\`\`\`skein id=eight notation=braid\n${eightCode}\n\`\`\``,
    'The figure-eight knot has determinant :determinant[$5$]{of=eight}.',
    '```skein id=hopf notation=braid\n1 1\n```',
    'The Hopf link has crossing number :crossing-number[$2$]{of=hopf}.',
    '',
  ].join('\n\n');
}

async function check(values?: ManuscriptValues) {
  const result = await markdownFormat.check(path, values ? { precompute: values.precompute } : {});
  return JSON.stringify({ diagnostics: result.diagnostics, counts: result.counts, failed: result.failed });
}

describe('values kept between saves', () => {
  it('recomputes only the diagram whose code changed, and reports what a fresh run reports', async () => {
    const values = new ManuscriptValues({ jobs: 1 });
    writeFileSync(path, manuscript('3', '1 -2 1 -2'));
    expect(await check(values)).toBe(await check());
    expect(values.computedDiagrams).toBe(3);

    // One claim edited (now contradicted): no diagram is computed again.
    writeFileSync(path, manuscript('7', '1 -2 1 -2'));
    const afterClaimEdit = await check(values);
    expect(afterClaimEdit).toBe(await check());
    expect(afterClaimEdit).toContain('claim-contradicted');
    expect(values.computedDiagrams).toBe(3);

    // One code edited ((σ₁σ₂⁻¹)³, another diagram; its determinant claim is now judged against it): only it is computed.
    writeFileSync(path, manuscript('7', '1 -2 1 -2 1 -2'));
    expect(await check(values)).toBe(await check());
    expect(values.computedDiagrams).toBe(4);

    // Back to the first code: its values are still in memory, nothing is computed.
    writeFileSync(path, manuscript('3', '1 -2 1 -2'));
    expect(await check(values)).toBe(await check());
    expect(values.computedDiagrams).toBe(4);
  });
});
