/**
 * What one digit addition of the bracket engine costs where its rows live:
 * the WebAssembly kernel that adds a source row into a target row
 * (src/core/invariants/wasm/digit-kernels.ts), over rows of 1,000 digits in
 * cache, taken in sequence through two 640 MB slabs, and with the target rows
 * scattered over their slab (as the engine meets them: targets are visited in
 * the order of their sources), beside the JavaScript loop it replaced on the
 * same rows. Every pass is checked: each target digit must have grown by
 * exactly the source digits added to it.
 */
import os from 'node:os';
import { DigitSlabs } from '../src/core/invariants/wasm/digit-slabs.ts';

const ROW = 1000;
const SLAB = 80_000_000; // digits per slab: 640 MB
const CALLS = 100_000;

interface Pattern {
  name: string;
  source: (call: number) => number;
  target: (call: number) => number;
}

/** A fixed pseudo-random sequence of row numbers below `rows`. */
function scattered(rows: number): (call: number) => number {
  const order = new Int32Array(CALLS);
  let x = 12345;
  for (let i = 0; i < CALLS; i++) {
    x = (Math.imul(x, 1103515245) + 12345) >>> 0;
    order[i] = x % rows;
  }
  return (call) => order[call]!;
}

export function runDigitKernelBench(): void {
  const slabs = new DigitSlabs();
  if (!slabs.reserve(0, SLAB) || !slabs.reserve(1, SLAB)) {
    console.log('\n(digit kernels: two 640 MB slabs could not be reserved; skipped)');
    return;
  }
  const digits = slabs.digits;
  const sources = slabs.start(0);
  const targets = slabs.start(1);
  for (let i = 0; i < SLAB; i++) digits[sources + i] = i % 7;
  const rows = Math.floor(SLAB / ROW) - 1;
  const random = scattered(rows);
  const patterns: Pattern[] = [
    { name: 'one row pair, in cache', source: () => sources, target: () => targets + 1 },
    { name: 'rows in sequence through 640 MB slabs', source: (c) => sources + (c % rows) * ROW, target: (c) => targets + (c % rows) * ROW + 1 },
    { name: 'sources in sequence, target rows scattered', source: (c) => sources + (c % rows) * ROW, target: (c) => targets + random(c) * ROW + 1 },
  ];
  const lines = ['| rows | WebAssembly kernel | JavaScript loop | JavaScript / kernel |', '| --- | ---: | ---: | ---: |'];
  for (const pattern of patterns) {
    const kernel = time(digits, pattern, (from, to) => slabs.kernels.addRow(from, ROW, to));
    const loop = time(digits, pattern, (from, to) => {
      for (let i = 0; i < ROW; i++) digits[to + i]! += digits[from + i]!;
    });
    lines.push(`| ${pattern.name} | ${kernel.toFixed(2)} ns | ${loop.toFixed(2)} ns | ${(loop / kernel).toFixed(1)}× |`);
  }
  console.log('\nAdding a 1,000-digit source row into a target row, per digit (best of 3 passes of 100,000 rows):\n');
  console.log(lines.join('\n'));
  console.log(`\n(load average ${os.loadavg().map((l) => l.toFixed(1)).join(', ')} at the end; ${os.cpus().length} cores)`);
}

/** Nanoseconds per digit, best of three passes; throws if a pass added wrongly. */
function time(digits: Float64Array, pattern: Pattern, add: (from: number, to: number) => void): number {
  let best = Infinity;
  for (let pass = 0; pass < 3; pass++) {
    const probe = pattern.target(0);
    const before = digits[probe + ROW - 1]!;
    const start = performance.now();
    for (let c = 0; c < CALLS; c++) add(pattern.source(c), pattern.target(c));
    best = Math.min(best, ((performance.now() - start) * 1e6) / (CALLS * ROW));
    // The last digit of the first target row got the source's last digit once per call that hit that row.
    let hits = 0;
    let expected = 0;
    for (let c = 0; c < CALLS; c++) {
      if (pattern.target(c) === probe) {
        hits++;
        expected += digits[pattern.source(c) + ROW - 1]!;
      }
    }
    if (hits === 0 || digits[probe + ROW - 1]! - before !== expected) throw new Error(`digit kernel bench: ${pattern.name} added wrongly`);
  }
  return best;
}

if (import.meta.url === `file://${process.argv[1]}`) runDigitKernelBench();
