import { spawn, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const root = fileURLToPath(new URL('../..', import.meta.url));

function skeinproof(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const result = spawnSync(process.execPath, ['bin/skeinproof.js', ...args], { cwd: root, encoding: 'utf8', timeout: 30_000 });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

const jsonLines = (stdout: string): Record<string, unknown>[] =>
  stdout.trim().split('\n').map((line) => JSON.parse(line) as Record<string, unknown>);

const REQUIRED_KEYS = [
  'notation', 'crossings', 'components', 'writhe', 'jones', 'bracket', 'span', 'bracketSpan', 'connected',
  'reduced', 'alternating', 'adequate', 'nugatory', 'linking', 'chiralityFixed', 'crossingNumber',
];

describe('skeinproof compute --json', () => {
  it('prints the right-handed trefoil from a PD code and from a braid word (values from memory: V = t + t^3 − t^4, <D> = A^-7 − A^-3 − A^5)', () => {
    // (1,5,2,4) (3,1,4,6) (5,3,6,2): every over strand runs 4→5, 6→1, 2→3, i.e. slot 3 → slot 1, so all crossings are positive (checked by hand).
    const { status, stdout, stderr } = skeinproof('compute', '--json', '(1,5,2,4) (3,1,4,6) (5,3,6,2)');
    expect(stderr).toBe('');
    expect(status).toBe(0);
    const braidRun = skeinproof('compute', '--json', '--notation', 'braid', '1 1 1');
    expect(braidRun.status).toBe(0);
    for (const object of [...jsonLines(stdout), ...jsonLines(braidRun.stdout)]) {
      for (const key of REQUIRED_KEYS) expect(object).toHaveProperty(key);
      expect(object).toMatchObject({
        crossings: 3,
        components: 1,
        writhe: 3,
        jones: { variable: 't', terms: [[1, '1'], [3, '1'], [4, '-1']] },
        bracket: { variable: 'A', terms: [[-7, '1'], [-3, '-1'], [5, '-1']] },
        span: 3,
        bracketSpan: 12,
        connected: true,
        reduced: true,
        alternating: true,
        adequate: true,
        nugatory: [],
        linking: [],
        chiralityFixed: true,
        crossingNumber: { lower: 3, upper: 3, exact: 3 },
      });
    }
    expect(jsonLines(stdout)[0]!['notation']).toBe('pd');
  });

  it('gives half-integer exponents as JSON numbers for the Hopf link (from memory: V = −t^(1/2) − t^(5/2)) and the linking number +1', () => {
    const { status, stdout } = skeinproof('compute', '--json', '--notation', 'braid', '1 1', '-1 -1');
    expect(status).toBe(0);
    const [positive, negative] = jsonLines(stdout);
    expect(positive).toMatchObject({ jones: { terms: [[0.5, '-1'], [2.5, '-1']] }, linking: [{ components: [0, 1], value: 1 }] });
    expect(negative).toMatchObject({ jones: { terms: [[-2.5, '-1'], [-0.5, '-1']] }, linking: [{ components: [0, 1], value: -1 }] });
  });

  it('marks DT codes as fixing the knot only up to mirror image; figure-eight 4 6 8 2 has V = t^-2 − t^-1 + 1 − t + t^2 (from memory)', () => {
    const { status, stdout } = skeinproof('compute', '--json', '--notation', 'dt', '4 6 8 2');
    expect(status).toBe(0);
    expect(jsonLines(stdout)[0]).toMatchObject({
      notation: 'dt',
      chiralityFixed: false,
      jones: { terms: [[-2, '1'], [-1, '-1'], [0, '1'], [1, '-1'], [2, '1']] },
      crossingNumber: { exact: 4 },
    });
  });

  it('exits 2 on an invalid code, still prints the valid ones, and reports the bad one as a JSON error line and on stderr without a stack trace', () => {
    const { status, stdout, stderr } = skeinproof('compute', '--json', '--notation', 'braid', '1 1 1', '1 x 2', '1 -2 1 -2');
    expect(status).toBe(2);
    const lines = jsonLines(stdout);
    expect(lines).toHaveLength(3);
    expect(lines[0]).toMatchObject({ crossings: 3 });
    expect(lines[1]).toMatchObject({ code: '1 x 2', notation: 'braid', error: { ruleId: expect.any(String), span: { start: 2, end: 3 } } });
    expect(lines[2]).toMatchObject({ crossings: 4, span: 4 });
    expect(stderr).toContain('code #2');
    expect(stderr).toContain('"x"');
    expect(stderr).not.toMatch(/\n\s+at /);
    expect(stderr).not.toContain('InputError');
  });
});

describe('skeinproof compute (plain)', () => {
  it('numbers components as the README says: PD by smallest label, braid by leftmost strand, Gauss as written, free loops last', () => {
    // A positive Hopf link (lk = +1, from memory) beside a circle, in each notation.
    const pd = skeinproof('compute', '(5,7,6,8) (7,5,8,6) (1,1,2,2)');
    expect(pd.stdout).toContain('lk(0,1) = 0, lk(0,2) = 0, lk(1,2) = +1');
    const braid = skeinproof('compute', '-n', 'braid', '--strands', '3', '2 2');
    expect(braid.stdout).toContain('lk(0,1) = +1, lk(0,2) = 0, lk(1,2) = 0');
    const gauss = skeinproof('compute', '-n', 'gauss', '() (o1+ u2+) (u1+ o2+) (o3+ u3+)');
    expect(gauss.stdout).toContain('lk(0,1) = +1, lk(0,2) = 0, lk(0,3) = 0, lk(1,2) = 0');
  });
  it('keeps the caret under the token at fault when the code contains tabs (shown as spaces)', () => {
    const code = '(4,2,5,1)\t\t(2,6,3,5)\t(6,4,1,7)';
    const { status, stderr } = skeinproof('compute', code);
    expect(status).toBe(2);
    const [echo, caret] = stderr.split('\n').filter((line) => line.startsWith('  | '));
    expect(echo).toBe(`  | ${code.replace(/\t/g, ' ')}`);
    // Label 3 appears once (tuple 2), at offset 15 of the code.
    expect(caret!.indexOf('^') - '  | '.length).toBe(code.indexOf('3'));
    expect(echo![caret!.indexOf('^')]).toBe('3');
  });
  it('lists only the non-zero linking numbers of a link of many components (three positive Hopf links, lk = +1 each from memory, and a circle)', () => {
    const { status, stdout } = skeinproof('compute', '--notation', 'braid', '--strands', '7', '1 1 3 3 5 5');
    expect(status).toBe(0);
    expect(stdout).toContain('linking  lk(0,1) = +1, lk(2,3) = +1, lk(4,5) = +1; lk = 0 for the other 18 pairs');
  });
  it('writes the degrees of V of the positive Hopf link as fractions, like its polynomial (from memory: V = −t^(1/2) − t^(5/2))', () => {
    const { status, stdout } = skeinproof('compute', '--notation', 'braid', '1 1');
    expect(status).toBe(0);
    expect(stdout).toContain('V(t) = -t^(1/2) - t^(5/2)');
    expect(stdout).toContain('span 2, degrees 1/2 to 5/2');
  });
  it('summarises a kinked trefoil: nugatory crossing, bounds, negative leading generator accepted', () => {
    const { status, stdout, stderr } = skeinproof('compute', '--notation', 'braid', '-1 -1 -1 -2');
    expect(stderr).toBe('');
    expect(status).toBe(0);
    expect(stdout).toContain('4 crossings');
    expect(stdout).toContain('nugatory');
    expect(stdout).toContain('crossing number exactly 3');
  });
  it('reduces P(1, 3, −1, 3, 3) by a flype and a Reidemeister II to P(3, 3, 3) = 9₃₅, crossing number 9 (from memory), and prints the 9-crossing diagram', () => {
    const { status, stdout, stderr } = skeinproof('compute', '--json', '--notation', 'family', '--keys', 'crossingNumber,simplified', 'pretzel 1 3 -1 3 3');
    expect(stderr).toBe('');
    expect(status).toBe(0);
    const [object] = jsonLines(stdout) as [Record<string, any>];
    expect(object.simplified.crossings).toBe(9);
    expect(object.simplified.moves).toEqual({ nugatory: 0, bigons: 1, slides: 0, flypes: 1 });
    expect(object.crossingNumber.exact).toBe(9);
    // The printed code is a diagram of the same knot: its own exact value is 9 without any move.
    const again = skeinproof('compute', '--json', '--keys', 'crossingNumber,simplified', object.simplified.codes.pd);
    const [reparsed] = jsonLines(again.stdout) as [Record<string, any>];
    expect(reparsed.crossingNumber.exact).toBe(9);
    expect(reparsed.simplified).toBeNull();
  });
  it('refuses a notation outside the choices as a usage error, without running the command (it used to run and crash as an internal error)', () => {
    const { status, stdout, stderr } = skeinproof('compute', '--notation', 'knot', '1 1');
    expect(status).toBe(2);
    expect(stdout).toBe('');
    expect(stderr).toContain('Choices');
    expect(stderr).not.toContain('internal error');
  });
  it('reads the notation name case-insensitively (PD, DT as written in prose): the positive Hopf link has lk = +1 (from memory)', () => {
    const { status, stdout } = skeinproof('compute', '--notation', 'PD', '(1,3,2,4) (3,1,4,2)');
    expect(status).toBe(0);
    expect(stdout).toContain('#1 pd ');
    expect(stdout).toContain('lk(0,1) = +1');
  });
  it('rejects a malformed or misplaced --strands and an unknown option with exit 2', () => {
    expect(skeinproof('compute', '--notation', 'braid', '--strands', '0', '1 1').status).toBe(2);
    expect(skeinproof('compute', '--strands', '3', '(1,5,2,4) (3,1,4,6) (5,3,6,2)').stderr).toContain('braid words only');
    expect(skeinproof('compute', '--notation', 'braid').stderr).toContain('no diagram code given');
    const unknown = skeinproof('compute', '--jsno', '1 1');
    expect(unknown.status).toBe(2);
    expect(unknown.stderr).toContain('--jsno');
  });

  it('takes every argument after "--" as a code, even one that looks like an option (common practice for command lines)', () => {
    // Negative Hopf link σ₁⁻² (from memory: V = −t^(−5/2) − t^(−1/2)); before the fix a code after "--" was dropped silently.
    const { status, stdout, stderr } = skeinproof('compute', '--json', '--notation', 'braid', '1 1', '--', '-1 -1', '--json');
    expect(status).toBe(2);
    const lines = jsonLines(stdout);
    expect(lines).toHaveLength(3);
    expect(lines[1]).toMatchObject({ code: '-1 -1', jones: { terms: [[-2.5, '-1'], [-0.5, '-1']] } });
    expect(lines[2]).toMatchObject({ code: '--json', error: { ruleId: 'code-invalid' } });
    expect(stderr).toContain('code #3');
    const alone = skeinproof('compute', '-n', 'braid', '--', '-1 -1');
    expect(alone.status).toBe(0);
    expect(alone.stdout).toContain('2 crossings, 2 components');
    // Taken as typed, not as a number: "1e3" would otherwise become the valid word "1000".
    const numeric = skeinproof('compute', '--json', '-n', 'braid', '--', '1e3');
    expect(numeric.status).toBe(2);
    expect(jsonLines(numeric.stdout)[0]).toMatchObject({ code: '1e3', error: { ruleId: 'code-invalid' } });
  });

  it('stops quietly when the reader closes the pipe early, as in `compute … | head -1` (common practice), with no stack trace', async () => {
    const codes = Array.from({ length: 300 }, () => '1 1 1');
    const child = spawn(process.execPath, ['bin/skeinproof.js', 'compute', '--json', '-n', 'braid', ...codes], { cwd: root });
    let stderr = '';
    child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
    // Read the first chunk, then close our end of stdout, as head does after its first line.
    child.stdout.once('data', () => child.stdout.destroy());
    const status = await new Promise<number | null>((resolve) => child.on('close', (code) => resolve(code)));
    expect(stderr).not.toContain('EPIPE');
    expect(stderr).not.toMatch(/\n\s+at /);
    expect(status).toBe(0);
  });
});

describe('skeinproof compute: options given more than once', () => {
  it('reads every --convention given, instead of silently dropping them all (σ(positive trefoil) = +2 in the positive sign, from memory)', () => {
    const { status, stdout, stderr } = skeinproof('compute', '--json', '-n', 'braid', '--convention', 'signature=positive', '--convention', 'jones=q', '1 1 1');
    expect(stderr).toBe('');
    expect(status).toBe(0);
    expect(jsonLines(stdout)[0]).toMatchObject({ signature: 2, signatureSign: 'positive' });
  });
  it('refuses one key set to two values across repeated --convention options, as within one', () => {
    const { status, stdout, stderr } = skeinproof('compute', '-n', 'braid', '--convention', 'signature=positive', '--convention', 'signature=negative', '1 1 1');
    expect(status).toBe(2);
    expect(stdout).toBe('');
    expect(stderr).toContain('signature');
  });
  it('build reads every --convention given too: V(positive trefoil) = t + t^3 − t^4 (from memory) is q^2 + q^6 − q^8, typeset descending', () => {
    const work = mkdtempSync(join(tmpdir(), 'skeinproof-repeated-'));
    try {
      const doc = join(work, 'k.md');
      writeFileSync(doc, '```skein id=k notation=braid\n1 1 1\n```\n\nV = :jones{of=k}.\n');
      const r = skeinproof('build', '--convention', 'jones=q', '--convention', 'order=descending', doc);
      expect(r.stderr).toBe('');
      expect(r.status).toBe(0);
      expect(readFileSync(join(work, 'k.filled.md'), 'utf8')).toContain('V = $-q^8 + q^6 + q^2$.');
    } finally {
      rmSync(work, { recursive: true, force: true });
    }
  });
  it('names a repeated --notation or --strands instead of echoing the values joined by a comma', () => {
    const notation = skeinproof('compute', '-n', 'pd', '-n', 'braid', '1 1');
    expect(notation.status).toBe(2);
    expect(notation.stderr).toContain('--notation is given 2 times (pd, braid)');
    expect(notation.stderr).not.toContain('pd,braid');
    const strands = skeinproof('compute', '-n', 'braid', '--strands', '3', '--strands', '4', '1 1');
    expect(strands.status).toBe(2);
    expect(strands.stderr).toContain('--strands is given 2 times (3, 4)');
  });
});

describe('skeinproof compute: the two-variable polynomials, braid index and Arf invariant in the plain summary', () => {
  it('shows them for the positive trefoil (from memory: P = 2v² − v⁴ + v²z², F = −2a⁻² − a⁻⁴ + (a⁻³ + a⁻⁵)z + (a⁻² + a⁻⁴)z², braid index 2, Arf 1)', () => {
    const { status, stdout } = skeinproof('compute', '-n', 'braid', '1 1 1');
    expect(status).toBe(0);
    expect(stdout).toContain('HOMFLY-PT P(v,z) = 2v^2 - v^4 + v^2z^2');
    expect(stdout).toContain('Kauffman F(a,z) = -a^(-4) - 2a^(-2) + a^(-5)z + a^(-3)z + a^(-4)z^2 + a^(-2)z^2');
    expect(stdout).toContain('braid index exactly 2');
    expect(stdout).toMatch(/\n {2}Arf {6}1\n/);
  });
  it('writes P in the declared variables: a = v⁻¹ under homfly=az (P = 2a⁻² − a⁻⁴ + a⁻²z², the same trefoil)', () => {
    const { stdout } = skeinproof('compute', '-n', 'braid', '--convention', 'homfly=az', '1 1 1');
    expect(stdout).toContain('HOMFLY-PT P(a,z) = -a^(-4) + 2a^(-2) + a^(-2)z^2');
  });
  it('says why the Arf invariant of the Hopf link is not defined (lk = ±1, from memory), numbering components from 0 like the rest of the summary', () => {
    const { status, stdout } = skeinproof('compute', '-n', 'braid', '1 1');
    expect(status).toBe(0);
    expect(stdout).toContain('Arf      not defined, the link is not proper: component 0 (counted from 0 in the code\'s order) has total linking number 1');
  });
  it('leaves P, F and the braid index out above 40 crossings but still gives Arf (T(2,41): a₂ = 20·21/2 = 210 from memory, so Arf 0)', () => {
    const { status, stdout } = skeinproof('compute', '-n', 'braid', Array.from({ length: 41 }, () => '1').join(' '));
    expect(status).toBe(0);
    expect(stdout).toContain('not shown above 40 crossings');
    expect(stdout).not.toContain('HOMFLY-PT P(');
    expect(stdout).toMatch(/\n {2}Arf {6}0\n/);
  });
  it('--json gives arf null with the reason in arfNotDefined for the Hopf link, and a value with arfNotDefined null for the Borromean rings (Arf 1, from V recalled from memory via Murakami’s theorem)', () => {
    const { status, stdout } = skeinproof('compute', '--json', '--keys', 'arf,arfNotDefined', '-n', 'braid', '1 1', '1 -2 1 -2 1 -2');
    expect(status).toBe(0);
    const [hopf, borromean] = jsonLines(stdout);
    expect(hopf!['arf']).toBe(null);
    expect(hopf!['arfNotDefined']).toMatch(/not proper, since component 1 .*total linking number 1/);
    expect(borromean).toMatchObject({ arf: 1, arfNotDefined: null });
  });
});
