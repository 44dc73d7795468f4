/** How the command line passes on a manuscript named `-` (yargs itself drops a bare `-`). */
export const STANDARD_INPUT_ARGUMENT = '<standard input>';
