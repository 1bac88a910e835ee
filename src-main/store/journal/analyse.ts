/**
 * Read a journal's bytes back and check its hash chain. Pure: no disk access here.
 *
 * Method: split at newlines; every complete line must parse, match the entry schema, carry
 * seq = its position, and record in `previous` the SHA-256 of the line before it (GENESIS_HASH for
 * seq 0). Bytes after the last newline, or an unparsable last line, are a torn tail (an append cut
 * short by a crash); anything wrong before that is tampering.
 */
import { GENESIS_HASH, JOURNAL_FORMAT, journalEntryProblem, lineHash, type JournalEntry } from './format.js';

export type JournalProblemKind = 'torn' | 'tampered';

export interface JournalProblem {
  /** The first sequence number the problem concerns. */
  readonly seq: number;
  /** 1-based line number in the file. */
  readonly line: number;
  readonly problem: string;
  readonly kind: JournalProblemKind;
}

export interface TornTail {
  /** Byte offset where the torn tail starts; the journal is cut back to this length. */
  readonly fromByte: number;
  readonly bytes: Buffer;
  readonly line: number;
}

export interface JournalAnalysis {
  /** Entries that parsed, in file order (all of them when the chain is intact). */
  readonly entries: JournalEntry[];
  /** SHA-256 of the last intact line, or null when there is none. */
  readonly fingerprint: string | null;
  readonly problems: JournalProblem[];
  readonly tornTail: TornTail | null;
}

const NEWLINE = 0x0a;

export function analyseJournal(bytes: Buffer): JournalAnalysis {
  const { lines, tornTail } = splitLines(bytes);
  const problems: JournalProblem[] = [];
  const entries: JournalEntry[] = [];
  let expectedSeq = 0;
  let previousHash = GENESIS_HASH;

  for (let index = 0; index < lines.length; index += 1) {
    const lineBytes = lines[index]!;
    const lineNumber = index + 1;
    const parsed = parseEntry(lineBytes);
    if (typeof parsed === 'string') {
      problems.push(tampered(expectedSeq, lineNumber, parsed));
      expectedSeq += 1;
    } else {
      entries.push(parsed);
      if (parsed.seq !== expectedSeq) {
        problems.push(
          tampered(
            expectedSeq,
            lineNumber,
            parsed.seq > expectedSeq
              ? `entry ${expectedSeq} is missing: line ${lineNumber} holds seq ${parsed.seq} (deleted or reordered)`
              : `line ${lineNumber} holds seq ${parsed.seq} where seq ${expectedSeq} belongs (reordered or duplicated)`,
          ),
        );
      } else if (parsed.previous !== previousHash) {
        const suspect = Math.max(0, parsed.seq - 1);
        problems.push(
          tampered(
            suspect,
            parsed.seq === 0 ? lineNumber : lineNumber - 1,
            parsed.seq === 0
              ? 'entry 0 does not start the chain from the genesis value'
              : `entry ${suspect} does not match the hash recorded by entry ${parsed.seq} (edited, or the link altered)`,
          ),
        );
      } else if (parsed.seq === 0 && !isHeader(parsed)) {
        problems.push(tampered(0, lineNumber, `entry 0 is not an "open" header naming ${JOURNAL_FORMAT}`));
      }
      expectedSeq = parsed.seq + 1;
    }
    previousHash = lineHash(lineBytes);
  }

  problems.sort((a, b) => a.line - b.line);
  if (tornTail !== null) {
    problems.push({
      seq: expectedSeq,
      line: tornTail.line,
      problem: `torn final line (${tornTail.bytes.length} bytes): an append cut short, moved to quarantine on open`,
      kind: 'torn',
    });
  }
  return { entries, fingerprint: lines.length === 0 ? null : previousHash, problems, tornTail };
}

function tampered(seq: number, line: number, problem: string): JournalProblem {
  return { seq, line, problem, kind: 'tampered' };
}

function splitLines(bytes: Buffer): { lines: Buffer[]; tornTail: TornTail | null } {
  const lines: Buffer[] = [];
  let start = 0;
  for (let newline = bytes.indexOf(NEWLINE, start); newline !== -1; newline = bytes.indexOf(NEWLINE, start)) {
    lines.push(bytes.subarray(start, newline));
    start = newline + 1;
  }
  if (start < bytes.length) {
    return { lines, tornTail: { fromByte: start, bytes: bytes.subarray(start), line: lines.length + 1 } };
  }
  // A complete but unparsable last line is also a cut-short append (e.g. zeros after a power cut).
  const last = lines.at(-1);
  if (last !== undefined && !parsesAsJson(last)) {
    lines.pop();
    const fromByte = bytes.length - last.length - 1;
    return { lines, tornTail: { fromByte, bytes: bytes.subarray(fromByte), line: lines.length + 1 } };
  }
  return { lines, tornTail: null };
}

function parsesAsJson(line: Buffer): boolean {
  try {
    JSON.parse(line.toString('utf8'));
    return true;
  } catch {
    return false;
  }
}

/** The entry on a line, or a sentence saying what is wrong with it. */
function parseEntry(line: Buffer): JournalEntry | string {
  let value: unknown;
  try {
    value = JSON.parse(line.toString('utf8'));
  } catch {
    return 'line is not valid JSON';
  }
  const problem = journalEntryProblem(value);
  return problem === null ? (value as JournalEntry) : `line is not a journal entry: ${problem}`;
}

function isHeader(entry: JournalEntry): boolean {
  const payload = entry.payload as { format?: unknown } | null;
  return entry.kind === 'open' && typeof payload === 'object' && payload !== null && payload.format === JOURNAL_FORMAT;
}
