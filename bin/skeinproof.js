#!/usr/bin/env node
// Runs the command line compiled by `npm ci` (the `prepare` script, scripts/compile.mjs) into dist/.
// SKEINPROOF_FROM_SOURCE=1 runs the TypeScript sources through tsx instead (a clone with its dev dependencies).
// A reader that stops early (`skeinproof compute … | head -1`) closes the pipe: stop quietly, as command-line tools do, not with a stack trace.
process.stdout.on('error', (error) => {
  if (error.code !== 'EPIPE') throw error;
  process.exit(process.exitCode ?? 0);
});

async function loadMain() {
  if (process.env.SKEINPROOF_FROM_SOURCE === '1') {
    const { register } = await import('tsx/esm/api');
    register();
    return (await import('../src/cli/main.ts')).main;
  }
  const compiled = new URL('../dist/main.js', import.meta.url);
  try {
    return (await import(compiled.href)).main;
  } catch (error) {
    if (error?.code !== 'ERR_MODULE_NOT_FOUND' || !String(error.message).includes(compiled.pathname)) throw error;
    process.stderr.write(
      'skeinproof: the compiled command line (dist/main.js) is missing. Run `npm ci` (or `npm run build`) in the skeinproof folder to compile it.\n',
    );
    process.exit(2);
  }
}

const main = await loadMain();
process.exitCode = await main(process.argv.slice(2));
