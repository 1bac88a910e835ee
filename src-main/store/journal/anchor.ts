/**
 * The anchor of a run journal: `<runId>.anchor` beside it, holding the last acknowledged entry's
 * seq and the SHA-256 of its line (`{"format":"tallyline.anchor/1","seq","fingerprint"}`), kept
 * outside the journal file so that dropping the last lines, or re-hashing a forged chain, no longer
 * passes as an intact journal.
 *
 * Method: the writer fsyncs the journal, then records the new anchor, then acknowledges. So an
 * honest journal is at most one entry ahead of its anchor (a crash between the two steps) and never
 * behind it. To keep an append cheap the anchor file has two fixed slots, 4 KiB apart so that no
 * disk block holds both: entry seq goes to slot seq % 2, written in place and fdatasync'd (no new
 * file, no rename, no folder fsync). A write torn by a power cut spoils only its own slot; the other
 * still holds the entry before, which reads as "one-ahead". Readers take the valid slot with the
 * highest seq. The whole file is written with writeFileAtomic when a writer first anchors a journal.
 *
 * Compared with its anchor a journal is:
 * - anchored: the line at the anchored seq is the journal's last, with the anchored hash;
 * - one-ahead: one more entry than anchored (a crash between journal and anchor; re-anchored on open);
 * - missing: no anchor file (a journal written before anchors were kept, or the anchor removed);
 * - behind: fewer entries than anchored (lines dropped from the end);
 * - differs: the line at the anchored seq has another hash (the chain was rewritten);
 * - ahead: more than one entry past the anchor (entries added by something other than the writer,
 *   or the anchor replaced by an older copy);
 * - unreadable: the anchor file holds no anchor.
 * What it cannot show: a consistent rewrite of both files by someone with write access to the folder.
 */
import { open, readFile, stat, type FileHandle } from 'node:fs/promises';
import { writeFileAtomic } from '../atomicWrite.js';
import type { JournalAnalysis, JournalProblem } from './analyse.js';

export const ANCHOR_FORMAT = 'tallyline.anchor/1';
/** Width of one slot (a JSON line padded with spaces), and where the two slots start. */
const SLOT_BYTES = 256;
const SLOT_OFFSETS = [0, 4096] as const;
const FILE_BYTES = SLOT_OFFSETS[1] + SLOT_BYTES;

export interface JournalAnchor {
  /** Seq of the last acknowledged entry. */
  readonly seq: number;
  /** SHA-256 of that entry's line: the run's fingerprint when it was acknowledged. */
  readonly fingerprint: string;
}

export type AnchorStatus = 'anchored' | 'one-ahead' | 'missing' | 'behind' | 'differs' | 'ahead' | 'unreadable';

export interface AnchorCheck {
  readonly status: AnchorStatus;
  /** The anchor as read, or null when there is none (or it is unreadable). */
  readonly anchor: JournalAnchor | null;
  /** For behind, differs, ahead and unreadable: the problem, reported like the chain's own. */
  readonly problem: JournalProblem | null;
}

/** Statuses an honest writer can leave behind (one-ahead: a crash between the journal and its anchor). */
export function anchorHolds(status: AnchorStatus): boolean {
  return status === 'anchored' || status === 'one-ahead';
}

export function anchorPathFor(journalPath: string): string {
  return journalPath.replace(/\.journal$/, '') + '.anchor';
}

/** One slot: the anchor as a JSON line, padded with spaces to the slot's width. */
function slotBytes(anchor: JournalAnchor | null): Buffer {
  const slot = Buffer.alloc(SLOT_BYTES, 0x20);
  slot[SLOT_BYTES - 1] = 0x0a;
  if (anchor !== null) slot.write(JSON.stringify({ format: ANCHOR_FORMAT, seq: anchor.seq, fingerprint: anchor.fingerprint }), 0, 'utf8');
  return slot;
}

/** A whole anchor file holding `anchor` in its slot and nothing in the other. */
export function anchorFileBytes(anchor: JournalAnchor): Buffer {
  const file = Buffer.alloc(FILE_BYTES, 0x20);
  file[SLOT_OFFSETS[1] - 1] = 0x0a;
  const slot = anchor.seq % 2;
  slotBytes(slot === 0 ? anchor : null).copy(file, SLOT_OFFSETS[0]);
  slotBytes(slot === 1 ? anchor : null).copy(file, SLOT_OFFSETS[1]);
  return file;
}

/** Keeps a journal's anchor file open for the writer: one slot rewritten in place per entry. */
export class AnchorWriter {
  private constructor(private readonly handle: FileHandle) {}

  /**
   * Opens the anchor file; writes it whole (atomically) first when it does not hold exactly
   * `current`'s layout, i.e. when missing, one entry behind or of another size.
   */
  static async open(journalPath: string, current: JournalAnchor | null, rewrite: boolean): Promise<AnchorWriter | null> {
    const anchorPath = anchorPathFor(journalPath);
    if (current !== null && (rewrite || (await sizeOf(anchorPath)) !== FILE_BYTES)) await writeFileAtomic(anchorPath, anchorFileBytes(current));
    if (current === null) return null;
    return new AnchorWriter(await open(anchorPath, 'r+'));
  }

  /** Records `anchor` in its slot and waits until it is on disk. */
  async write(anchor: JournalAnchor): Promise<void> {
    await this.handle.write(slotBytes(anchor), 0, SLOT_BYTES, SLOT_OFFSETS[anchor.seq % 2]);
    await this.handle.datasync();
  }

  async close(): Promise<void> {
    await this.handle.close();
  }
}

async function sizeOf(file: string): Promise<number | null> {
  try {
    return (await stat(file)).size;
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return null;
    throw error;
  }
}

/** The anchor file's bytes, or null when there is none. */
export async function readAnchorBytes(journalPath: string): Promise<Buffer | null> {
  try {
    return await readFile(anchorPathFor(journalPath));
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return null;
    throw error;
  }
}

/** The anchor an anchor file holds (its valid slot with the highest seq), or null when it holds none. */
export function parseAnchor(bytes: Buffer): JournalAnchor | null {
  let best: JournalAnchor | null = null;
  for (const line of bytes.toString('utf8').split('\n')) {
    const anchor = line.trim() === '' ? null : parseSlot(line);
    if (anchor !== null && (best === null || anchor.seq > best.seq)) best = anchor;
  }
  return best;
}

function parseSlot(line: string): JournalAnchor | null {
  let value: unknown;
  try {
    value = JSON.parse(line);
  } catch {
    return null;
  }
  if (typeof value !== 'object' || value === null) return null;
  const record = value as Record<string, unknown>;
  if (record.format !== ANCHOR_FORMAT || !Number.isSafeInteger(record.seq) || (record.seq as number) < 0) return null;
  if (typeof record.fingerprint !== 'string' || !/^[0-9a-f]{64}$/.test(record.fingerprint)) return null;
  return { seq: record.seq as number, fingerprint: record.fingerprint };
}

/** The SHA-256 of the line holding `seq`, from the links the entries after it record. */
function hashAt(analysis: JournalAnalysis, seq: number): string | null {
  const { entries } = analysis;
  const index = entries[seq]?.seq === seq ? seq : entries.findIndex((entry) => entry.seq === seq);
  if (index === -1) return null;
  return index === entries.length - 1 ? analysis.fingerprint : entries[index + 1].previous;
}

/**
 * Compares a journal (its analysis, torn tail already left out) with its anchor file's bytes.
 * `laterAnchorBytes`, when given, is the anchor read again after the journal: a reader that takes
 * no lock can see a busy writer several entries further on, which is not "ahead".
 */
export function checkAnchor(analysis: JournalAnalysis, anchorFile: Buffer | null, laterAnchorBytes?: Buffer | null): AnchorCheck {
  if (anchorFile === null) return { status: 'missing', anchor: null, problem: null };
  const entries = analysis.entries.length;
  const lastSeq = entries - 1;
  const anchor = parseAnchor(anchorFile);
  if (anchor === null) {
    return {
      status: 'unreadable',
      anchor: null,
      problem: { seq: Math.max(0, lastSeq), line: Math.max(1, entries), kind: 'tampered', problem: 'the anchor file beside the journal is not a tallyline.anchor/1 record (edited or replaced)' },
    };
  }
  if (lastSeq < anchor.seq) {
    return {
      status: 'behind',
      anchor,
      problem: {
        seq: lastSeq + 1,
        line: entries + 1,
        kind: 'tampered',
        problem: `the journal ends at seq ${lastSeq} but its anchor records seq ${anchor.seq}: ${anchor.seq - lastSeq} entr${anchor.seq - lastSeq === 1 ? 'y was' : 'ies were'} removed from the end`,
      },
    };
  }
  if (hashAt(analysis, anchor.seq) !== anchor.fingerprint) {
    return {
      status: 'differs',
      anchor,
      problem: {
        seq: anchor.seq,
        line: anchor.seq + 1,
        kind: 'tampered',
        problem: `entry ${anchor.seq} does not have the hash its anchor records (${anchor.fingerprint}): the journal was rewritten up to there`,
      },
    };
  }
  if (lastSeq === anchor.seq) return { status: 'anchored', anchor, problem: null };
  if (lastSeq === anchor.seq + 1) return { status: 'one-ahead', anchor, problem: null };
  const later = laterAnchorBytes == null ? null : parseAnchor(laterAnchorBytes);
  if (later !== null && later.seq >= lastSeq - 1) return { status: lastSeq <= later.seq ? 'anchored' : 'one-ahead', anchor: later, problem: null };
  return {
    status: 'ahead',
    anchor,
    problem: {
      seq: anchor.seq + 1,
      line: anchor.seq + 2,
      kind: 'tampered',
      problem: `the journal runs ${lastSeq - anchor.seq} entries past its anchor (seq ${anchor.seq}): entries were added outside Tallyline's writer, or the anchor was replaced by an older copy`,
    },
  };
}
