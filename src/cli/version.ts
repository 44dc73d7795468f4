/** The version `--version` prints; test/cli/small-things.test.ts keeps it equal to package.json's. */
export const SKEINPROOF_VERSION = '0.1.0';
