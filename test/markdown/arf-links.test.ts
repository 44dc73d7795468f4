/**
 * The Arf invariant in a manuscript that mixes knots and links. Values: the positive trefoil (braid 1 1 1) has
 * Arf 1 and the positive Hopf link (1 1) linking number +1 (both from memory), so the Hopf link is not proper
 * and has no Arf invariant (Robertello 1965); T(2,4) (1 1 1 1) has lk = 2, so it is proper, and fusing it at one
 * crossing gives the trefoil, so its Arf invariant is 1 (Robertello's definition).
 */
import { describe, expect, it } from 'vitest';
import { placed, processMarkdown } from './helpers.ts';

const DIAGRAMS = ['```skein id=t3 notation=braid', '1 1 1', '```', '', '```skein id=hopf notation=braid', '1 1', '```', '', '```skein id=t24 notation=braid', '1 1 1 1', '```', ''].join('\n');

describe('Markdown: the Arf invariant of knots and links', () => {
  it('a table fills knots and proper links and takes an empty cell or a not-applicable mark for a link that is not proper', async () => {
    const rows = ['| t3 | |', '| t24 | |', '| t24 | $1$ |', '| hopf | |', '| hopf | — |', '| hopf | n/a |'];
    const r = await processMarkdown(`${DIAGRAMS}:::invariants\n| diagram | Arf |\n|---|---|\n${rows.join('\n')}\n:::\n`);
    expect(r.diagnostics).toEqual([]);
    expect(r.built).toContain('| t3 | $1$ |\n| t24 | $1$ |\n| t24 | $1$ |\n| hopf | |\n| hopf | — |\n| hopf | n/a |');
    expect(r.file.data.skeinproof!.session.counts.notApplicable).toBe(3);
  });

  it('a value in the row of a link that is not proper is claim-inapplicable, and says which component links oddly', async () => {
    const r = await processMarkdown(`${DIAGRAMS}:::invariants\n| diagram | arf |\n|---|---|\n| hopf | $0$ |\n:::\n`);
    expect(placed(r.diagnostics)).toEqual(['error claim-inapplicable 15:10']);
    expect(r.diagnostics[0]!.message).toMatch(/not proper, since component 1 .* total linking number 1 with the other components, an odd number/);
  });

  it('in prose: a claim about T(2,4) is judged, a wrong one contradicted; a claim or fill-in about the Hopf link is claim-inapplicable with the reason', async () => {
    const text = `${DIAGRAMS}Arf :arf[$1$]{of=t24} and :arf[$0$]{of=t24}; Hopf :arf[$1$]{of=hopf} and :arf{of=hopf}.\n`;
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual(['error claim-contradicted 12:32', 'error claim-inapplicable 12:56', 'error claim-inapplicable 12:74']);
    expect(r.diagnostics[0]!.message).toMatch(/Arf invariant/);
    for (const d of r.diagnostics.slice(1)) expect(d.message).toMatch(/not defined for this link: it is not proper/);
  });
});
