/** Reporters: pure string builders over diagnostics. */
export { formatDiagnostic, formatHumanReport, summaryLine, checkedLine, excerpt, type HumanReportOptions } from './human.ts';
export { formatJsonReport, jsonReport, type JsonReport } from './json.ts';
export { formatSarif, sarifLog, pathToUri, SARIF_SCHEMA, type SarifOptions } from './sarif.ts';
export { exitStatus, countDiagnostics, EXIT_OK, EXIT_FAILED_CHECK, EXIT_BAD_INPUT, type ExitStatus, type DiagnosticCounts } from './exit-status.ts';
export { RULES, ruleDescription, type RuleDescription } from './rules.ts';
export { judgementJson, unreadableClaimJson, type JudgementJson, type UnreadableClaimJson } from './claims-json.ts';
