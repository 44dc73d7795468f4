/**
 * Computed values as ASCII LaTeX. skeinproof's sentences use a few characters
 * beyond ASCII (the dash in Kauffman–Murasugi–Thistlethwaite); LaTeX reads a
 * file in the document's input encoding, so under `inputenc` with latin1 a
 * UTF-8 dash is an error. Written the LaTeX way they read in every encoding.
 */
const LATEX_FOR: Readonly<Record<string, string>> = {
  '\u2013': '--',
  '\u2014': '---',
  '\u2018': '`',
  '\u2019': "'",
  '\u201C': '``',
  '\u201D': "''",
  '\u2026': '\\dots{}',
  '\u2264': '\\ensuremath{\\le}',
  '\u2265': '\\ensuremath{\\ge}',
  '\u00A0': '~',
};

const NON_ASCII = new RegExp(`[${Object.keys(LATEX_FOR).join('')}]`, 'g');

export function asciiLatex(text: string): string {
  return text.replace(NON_ASCII, (c) => LATEX_FOR[c]!);
}
