/** Re-read a journal and its anchor from disk and report whether both hold. Read-only: repairs nothing. */
import { readFile } from 'node:fs/promises';
import { analyseJournal, type JournalAnalysis, type JournalProblem } from './analyse.js';
import { anchorHolds, checkAnchor, readAnchorBytes, type AnchorCheck, type AnchorStatus, type JournalAnchor } from './anchor.js';

/** A journal read from disk with its anchor; `problems` holds the chain's problems and the anchor's. */
export interface AnchoredJournal extends JournalAnalysis {
  readonly anchor: AnchorCheck;
}

/**
 * Reads the anchor, then the journal, then (only when the journal seems far ahead) the anchor
 * again: a writer fsyncs the journal before it replaces the anchor, so this order never shows an
 * honest journal behind its anchor, even while another process appends.
 */
export async function readAnchoredJournal(journalPath: string): Promise<AnchoredJournal> {
  const anchorFile = await readAnchorBytes(journalPath);
  const analysis = analyseJournal(await readFile(journalPath));
  let anchor = checkAnchor(analysis, anchorFile);
  if (anchor.status === 'ahead') anchor = checkAnchor(analysis, anchorFile, await readAnchorBytes(journalPath));
  return withAnchor(analysis, anchor);
}

/** The analysis with the anchor's problem (if any) among its problems, in line order. */
export function withAnchor(analysis: JournalAnalysis, anchor: AnchorCheck): AnchoredJournal {
  if (anchor.problem === null) return { ...analysis, anchor };
  const problems = [...analysis.problems, anchor.problem].sort((a, b) => a.line - b.line);
  return { ...analysis, problems, anchor };
}

export interface JournalVerification {
  /** True when every line is intact, the chain is unbroken and the anchor holds (anchored or one-ahead). */
  readonly ok: boolean;
  /** Number of intact entries read. */
  readonly entries: number;
  /** SHA-256 of the final intact line (the run's fingerprint), null for an empty file. */
  readonly fingerprint: string | null;
  readonly problems: JournalProblem[];
  /** How the journal stands against its anchor, and the anchor read. */
  readonly anchor: { readonly status: AnchorStatus } & Partial<JournalAnchor>;
}

export async function verifyJournal(journalPath: string): Promise<JournalVerification> {
  const read = await readAnchoredJournal(journalPath);
  return {
    ok: read.problems.length === 0 && anchorHolds(read.anchor.status),
    entries: read.entries.length,
    fingerprint: read.fingerprint,
    problems: read.problems,
    anchor: { status: read.anchor.status, ...(read.anchor.anchor ?? {}) },
  };
}
