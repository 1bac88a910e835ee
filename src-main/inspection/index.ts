/** Inspection runs: the run service over the run journal. */
export * from './runService.js';
export * from './runTypes.js';
export { RunReplay, RunJournalContentError } from './runReplay.js';
export { resultProblem, resultTotal, gradeIndex, canonicalResult } from './runState.js';
export { RunEvidence } from './runEvidence.js';
export * from './runCatalogue.js';
export * from './runOutcome.js';
export { runView } from './runView.js';
export { localTimestamp } from './localTime.js';
export * from './runPictures.js';
