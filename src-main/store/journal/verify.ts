/** Re-read a journal from disk and report whether its chain is intact. Read-only: repairs nothing. */
import { readFile } from 'node:fs/promises';
import { analyseJournal, type JournalProblem } from './analyse.js';

export interface JournalVerification {
  /** True when every line is intact and the chain is unbroken. */
  readonly ok: boolean;
  /** Number of intact entries read. */
  readonly entries: number;
  /** SHA-256 of the final intact line (the run's fingerprint), null for an empty file. */
  readonly fingerprint: string | null;
  readonly problems: JournalProblem[];
}

export async function verifyJournal(journalPath: string): Promise<JournalVerification> {
  const analysis = analyseJournal(await readFile(journalPath));
  return {
    ok: analysis.problems.length === 0,
    entries: analysis.entries.length,
    fingerprint: analysis.fingerprint,
    problems: analysis.problems,
  };
}
