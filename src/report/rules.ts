/**
 * The rule catalogue: every rule id skeinproof reports, with a one-line
 * description for SARIF and for the documentation. Ids not listed here (a
 * front end may add its own) get a generic description.
 */
export interface RuleDescription {
  readonly id: string;
  readonly description: string;
}

export const RULES: readonly RuleDescription[] = [
  { id: 'claim-contradicted', description: 'A value stated in the manuscript contradicts the value computed from its diagram code.' },
  { id: 'claim-undecided', description: 'The proven bounds do not settle a stated crossing number.' },
  { id: 'claim-instances', description: 'A formula in a free parameter agrees at every value checked; only those instances are checked, not the formula for every value.' },
  { id: 'parameter-invalid', description: 'A free parameter of a family code is unusable, or a fill-in asks for one value of a family with a free parameter.' },
  { id: 'claim-cited', description: 'No theorem used here settles a stated crossing number, and the claim rests on the source the author cites.' },
  { id: 'claim-mirror-only', description: 'A stated value matches only the mirror image, which a DT code cannot tell apart.' },
  { id: 'claim-choice-open', description: 'A stated value holds only for a realisation of a DT code with another kink sign or part chirality than the drawing; the document is read in that realisation.' },
  { id: 'claim-choice-conflict', description: 'Two values stated for one DT diagram hold only in different realisations of its code, and a document reads each diagram one way.' },
  { id: 'choice-invalid', description: 'The part-signs attribute of a diagram is not one + or - per independent part of its DT code.' },
  { id: 'claim-unreadable', description: 'A stated value cannot be read as a polynomial, number or yes/no answer.' },
  { id: 'claim-malformed', description: 'A command-line claim is not of the form KEY=VALUE with a known key.' },
  { id: 'claim-inapplicable', description: 'A claim that does not apply to its diagram, such as a linking number of a knot.' },
  { id: 'code-invalid', description: 'A diagram code (PD, DT, Gauss code or braid word) cannot be parsed into a diagram.' },
  { id: 'convention-invalid', description: 'A convention setting names an unknown key or value.' },
  { id: 'target-unknown', description: 'A claim or fill-in names a diagram the manuscript does not define.' },
  { id: 'target-invalid', description: 'A claim or fill-in is skipped because its diagram code is invalid.' },
  { id: 'id-duplicate', description: 'Two diagrams of the manuscript share one id.' },
  { id: 'file-unreadable', description: 'An input file cannot be read.' },
  { id: 'encoding-invalid', description: 'An input file is not valid UTF-8; the first bad byte is named.' },
  { id: 'line-too-long', description: 'A Markdown manuscript has a line longer than 100,000 characters, which is not read.' },
  { id: 'front-matter-invalid', description: 'The manuscript front matter cannot be read.' },
  { id: 'markup-invalid', description: 'The markup around a diagram, claim or fill-in is malformed.' },
  { id: 'manuscript-unmarked', description: 'A manuscript has no skeinproof markup at all, so nothing in it was checked.' },
  { id: 'table-unfenced', description: 'A Markdown table with a diagram column and claim-key columns is not inside `:::invariants`, so none of its values is checked.' },
  { id: 'math-untypeset', description: 'A formula cannot be typeset.' },
  { id: 'khovanov-over-limit', description: 'Khovanov homology of a diagram is beyond the work budget of the computation; it is reported instead of run.' },
  { id: 'diagram-too-wide', description: 'A diagram is too wide for the bracket engine: every crossing order leaves too many open edge ends.' },
  { id: 'limit-exceeded', description: 'A diagram is over a limit on its crossings, its bracket\'s memory or its time budget, so it (or one of its invariants) is not computed.' },
  { id: 'figure-option-invalid', description: 'A figure option (size, line width, gap, arrows, colours, labels, outer face) has a value it does not take.' },
  { id: 'batch-line-invalid', description: 'A line of a batch input is not a JSON object with an id, a known notation and a code.' },
  { id: 'batch-worker-failed', description: 'The worker thread computing a batch line stopped (out of memory, a crash); the line is not computed.' },
  { id: 'output-unsupported', description: 'The requested output is not available for this manuscript format.' },
  { id: 'latex-environment-unopened', description: 'A LaTeX \\end closes an environment that was never begun.' },
  { id: 'latex-environment-unclosed', description: 'A skeincode or skeintable environment (or the tabular inside a skein table) is never closed.' },
  { id: 'latex-table-malformed', description: 'A skein table is not a well-formed tabular.' },
  { id: 'latex-argument-missing', description: 'A skeinproof LaTeX command lacks a required argument.' },
  { id: 'latex-brace-unbalanced', description: 'A brace group in the argument of a skeinproof LaTeX command is never closed.' },
  { id: 'latex-key-unknown', description: 'A LaTeX option, claim key, fill-in key or skein-table column that skeinproof does not know.' },
  { id: 'latex-key-repeated', description: 'A key is given twice in one LaTeX option list.' },
  { id: 'latex-option-invalid', description: 'A LaTeX option has no value or a value of the wrong kind (such as head=N that is not a whole number).' },
  { id: 'latex-id-missing', description: 'A LaTeX diagram, claim, fill-in or skein-table row names no diagram id.' },
  { id: 'latex-id-invalid', description: 'A diagram id in LaTeX markup has characters an id cannot have.' },
  { id: 'latex-notation-missing', description: 'A skeincode environment does not say how its diagram code is written.' },
  { id: 'latex-notation-unknown', description: 'A skeincode environment names a notation skeinproof does not read.' },
  { id: 'latex-cell-empty', description: 'An empty skein-table cell in a column skeinproof cannot fill in.' },
  { id: 'latex-cell-filled', description: 'A written value in a skein-table column that skeinproof fills in itself (such as statement).' },
  { id: 'latex-input-outside', description: 'An \\input or \\include names a file outside the paper\'s directory, which skeinproof does not follow.' },
  { id: 'latex-input-missing', description: 'An \\input or \\include names a file that does not exist.' },
  { id: 'latex-input-cycle', description: 'An \\input or \\include reads a file that is already being read.' },
  { id: 'latex-convention-twice', description: 'The convention is declared more than once in a LaTeX manuscript.' },
  { id: 'latex-convention-misplaced', description: '\\skeinconvention comes after \\begin{document} or before \\usepackage{skeinproof}, where LaTeX does not accept it.' },
  { id: 'latex-macro-parameter', description: 'A LaTeX fill-in or claim takes its arguments from the parameters of a macro that skeinproof cannot expand (delimited \\def parameters, other argument types), so it is not checked or filled at the uses.' },
  { id: 'latex-package-unseen', description: 'A LaTeX document with skeinproof markup loads the package nowhere skeinproof reads, so the default convention is assumed.' },
  { id: 'latex-flat-needs-package', description: 'The flat copy of a LaTeX manuscript still loads a package or class of the author\'s that loads skeinproof (or draws figures with TikZ that nothing in it loads).' },
  { id: 'latex-macro-loop', description: 'Expanding an author\'s LaTeX macro never ends (a macro that uses itself) or grows beyond the expansion limit.' },
];

export function ruleDescription(id: string): string {
  return RULES.find((r) => r.id === id)?.description ?? `Reported by skeinproof under the rule ${id}.`;
}
