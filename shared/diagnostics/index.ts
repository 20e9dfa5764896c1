/** Diagnostic codes and the one formatter. See README.md. */
export { CODES, CODE_LIST, type CodeInfo, type Facts } from './codes';
export { makeDiagnostic, formatDiagnosticText, sortDiagnostics, closestName } from './format';
