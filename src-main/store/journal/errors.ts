/** Errors the journal raises, with the fields a caller needs to explain them. */
import { hostname } from 'node:os';
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
  constructor(readonly journalPath: string, readonly holderPid: number, readonly holderHost: string | null = null) {
    super(
      `journal ${journalPath} is open for writing by process ${holderPid}` +
        (holderHost !== null && holderHost !== hostname() ? ` on ${holderHost}` : ''),
    );
    this.name = 'JournalBusyError';
  }
}

/**
 * The journal on disk is not what this writer last left there (another process wrote to it, or it
 * was cut or replaced): the entry was not acknowledged and the writer takes no more entries.
 */
export class JournalChangedError extends Error {
  readonly code = 'JOURNAL_CHANGED';
  constructor(readonly journalPath: string, readonly expectedBytes: number, readonly foundBytes: number) {
    super(
      `journal ${journalPath} changed on disk while this process held it (${expectedBytes} bytes expected, ${foundBytes} found): ` +
        'another writer touched it; the entry was not recorded, reopen the run',
    );
    this.name = 'JournalChangedError';
  }
}
