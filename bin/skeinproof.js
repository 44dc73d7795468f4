#!/usr/bin/env node
// Runs the TypeScript command line directly through tsx, so a fresh clone needs no build step.
import { register } from 'tsx/esm/api';

register();
// A reader that stops early (`skeinproof compute … | head -1`) closes the pipe: stop quietly, as command-line tools do, not with a stack trace.
process.stdout.on('error', (error) => {
  if (error.code !== 'EPIPE') throw error;
  process.exit(process.exitCode ?? 0);
});
const { main } = await import('../src/cli/main.ts');
process.exitCode = await main(process.argv.slice(2));
