/**
 * The command line's surface: --version, unknown commands, help that reads
 * cleanly at every terminal width, and standard input and output named `-`
 * (the POSIX utility convention, common practice). Value from memory: the
 * positive trefoil σ₁³ has V = t + t³ − t⁴.
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.ts';
import { skeinproof } from '../markdown/cli.ts';

const ROOT = join(import.meta.dirname, '..', '..');
const work = mkdtempSync(join(tmpdir(), 'skeinproof-cli-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

const TREFOIL = '```skein id=k notation=braid\n1 1 1\n```\n\nV = :jones{of=k}.\n';

/** Runs the command line in this process with a terminal of the given width, returning what it printed. */
async function helpAt(width: number, args: string[]): Promise<string> {
  const columns = Object.getOwnPropertyDescriptor(process.stdout, 'columns');
  const write = process.stdout.write;
  let out = '';
  Object.defineProperty(process.stdout, 'columns', { value: width, configurable: true });
  process.stdout.write = ((chunk: string) => ((out += chunk), true)) as typeof process.stdout.write;
  try {
    expect(await main(args)).toBe(0);
  } finally {
    process.stdout.write = write;
    if (columns) Object.defineProperty(process.stdout, 'columns', columns);
    else delete (process.stdout as { columns?: number }).columns;
  }
  return out;
}

describe('small things', () => {
  it('--version prints the version of package.json', () => {
    const r = skeinproof(['--version']);
    expect(r.status).toBe(0);
    expect(r.stdout).toBe(`${(JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')) as { version: string }).version}\n`);
  });

  it('an unknown command is named as one, with the commands there are', () => {
    const r = skeinproof(['frobnicate', 'paper.md']);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('unknown command `frobnicate`; the commands are compute, check, build, watch');
    expect(r.stderr).not.toContain('Unknown argument');
  });

  it('help never glues a type hint to its description, at any terminal width', async () => {
    // A spread of widths, and those where yargs alone glued them when this test was written (92, 97, 89).
    const widths = [60, 67, 74, 81, 88, 89, 92, 95, 97, 102, 109, 116, 123, 130];
    for (const command of ['compute', 'check', 'build', 'watch']) {
      for (const width of widths) {
        const help = await helpAt(width, [command, '--help']);
        expect(help, `${command} --help at ${width} columns`).not.toMatch(/[^\s[]\[(choices|default|boolean|string|number|array|required)/);
      }
    }
  });

  it('check --help calls the files required, without an empty default beside it', async () => {
    const help = await helpAt(100, ['check', '--help']);
    expect(help).toMatch(/files .*\[required\]\n/);
    expect(help).not.toContain('[default: []]');
  });

  it('build --help covers Markdown and LaTeX', async () => {
    const help = (await helpAt(100, ['build', '--help'])).replace(/\s+/g, ' ');
    expect(help).toContain('LaTeX (.tex, .ltx)');
    expect(help).toContain('sidecar NAME.skein.tex');
    expect(help).toContain('flat copy');
    expect(help).toContain('- is standard output');
  });
});

describe('standard input and output', () => {
  it('check - and build - refuse standard input plainly and never pass', () => {
    for (const args of [['check', '-'], ['check', '--format', 'json', '-'], ['build', '-']]) {
      const r = skeinproof(args);
      expect(r.status, args.join(' ')).toBe(2);
      expect(r.stdout + r.stderr).toContain('cannot be read from standard input');
      expect(r.stdout).not.toContain('no problems found');
    }
  });

  it('build -o - writes the built text to standard output and nothing else there', () => {
    const doc = join(work, 'to-stdout.md');
    writeFileSync(doc, TREFOIL);
    const r = skeinproof(['build', doc, '-o', '-']);
    expect(r.status).toBe(0);
    expect(r.stdout).toBe(TREFOIL.replace(':jones{of=k}', '$t + t^3 - t^4$'));
    expect(existsSync(join(work, '-'))).toBe(false);
    const page = skeinproof(['build', doc, '--html', '-o', '-']);
    expect(page.status).toBe(0);
    expect(page.stdout.startsWith('<!doctype html>')).toBe(true);
  });
});
