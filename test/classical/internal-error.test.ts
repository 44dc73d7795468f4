/**
 * A failed internal cross-check (two independent routes to an invariant
 * disagree) is a bug, and the command line must say so in words, not crash
 * with a stack trace. The disagreement is simulated by replacing the
 * classical invariants with a function that throws the way the real
 * cross-checks do.
 */
import { afterEach, describe, expect, it, vi } from 'vitest';

vi.mock('../../src/core/invariants/classical/index.ts', async (importOriginal) => {
  const original = await importOriginal<typeof import('../../src/core/invariants/classical/index.ts')>();
  return {
    ...original,
    classicalInvariants: () => {
      throw new Error('internal: signature -2 from V + Vᵀ but 0 from a Goeritz matrix');
    },
    // The report's route (with the time budget).
    classicalInvariantsWithin: () => {
      throw new Error('internal: signature -2 from V + Vᵀ but 0 from a Goeritz matrix');
    },
  };
});

const { main, EXIT_INTERNAL } = await import('../../src/cli/main.ts');

afterEach(() => vi.restoreAllMocks());

describe('an internal cross-check failure on the command line', () => {
  it('is a clear internal-error message with its own exit status, not a stack trace (common practice: compilers report internal errors as such)', async () => {
    const written: string[] = [];
    vi.spyOn(process.stderr, 'write').mockImplementation((chunk: string | Uint8Array) => (written.push(String(chunk)), true));
    vi.spyOn(process.stdout, 'write').mockImplementation(() => true);
    const status = await main(['compute', '--json', '--notation', 'braid', '1 1 1']);
    const stderr = written.join('');
    expect(status).toBe(EXIT_INTERNAL);
    expect(stderr).toMatch(/^skeinproof: internal error: signature -2 from V \+ Vᵀ but 0 from a Goeritz matrix\n/);
    expect(stderr).toMatch(/bug in skeinproof/);
    expect(stderr).not.toMatch(/\n\s+at /);
  });
});
