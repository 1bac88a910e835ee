/** Errors the journal raises, with the fields a caller needs to explain them. */
import type { JournalProblem } from './analyse.js';

/** The chain is broken before its last line: the run may be read but never written. */
export class JournalTamperedError extends Error {
  readonly code = 'JOURNAL_TAMPERED';
  constructor(
    readonly journalPath: string,
    readonly firstBadSeq: number,
    readonly problems: readonly JournalProblem[],
  ) {
    super(
      `journal ${journalPath} is damaged or tampered with from seq ${firstBadSeq}: ${problems[0]?.problem ?? ''}; ` +
        'it will not be opened for writing',
    );
    this.name = 'JournalTamperedError';
  }
}

/** Another live process holds the journal open for writing. */
export class JournalBusyError extends Error {
  readonly code = 'JOURNAL_BUSY';
  constructor(readonly journalPath: string, readonly holderPid: number) {
    super(`journal ${journalPath} is open for writing by process ${holderPid}`);
    this.name = 'JournalBusyError';
  }
}
