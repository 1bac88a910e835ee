/**
 * The only way entries get into a run journal.
 *
 * Method: one long-lived handle per journal, opened for appending (O_APPEND), under the run's lock;
 * appends are queued one after another. Each checks that the file is still the size this writer
 * left it, writes every byte of its line, checks the size again (so any other writer shows up as
 * an error, never as an entry silently overwritten), fsyncs, records the new seq and hash in the run's
 * anchor (anchor.ts), and only then resolves. A failed or refused write poisons the writer:
 * the file may hold a partial line, which the next open cuts off into quarantine.
 */
import { constants, mkdir, open, readFile, type FileHandle } from 'node:fs/promises';
import path from 'node:path';
import { analyseJournal } from './analyse.js';
import { AnchorWriter, checkAnchor, readAnchorBytes } from './anchor.js';
import { JournalChangedError, JournalTamperedError } from './errors.js';
import {
  GENESIS_HASH,
  JOURNAL_FORMAT,
  entryLine,
  lineHash,
  localOffset,
  type JournalEntry,
  type JournalKind,
} from './format.js';
import { acquireJournalLock, type JournalLock } from './lock.js';
import { appendToQuarantine, type QuarantineRecord } from './quarantine.js';
import { syncFolder } from '../atomicWrite.js';
import { withAnchor } from './verify.js';

const APPEND = constants.O_RDWR | constants.O_APPEND;

export type Clock = () => Date;

export interface OpenedJournal {
  readonly writer: JournalWriter;
  /** The entries already in the journal, in order. */
  readonly entries: JournalEntry[];
  /** Set when a torn final line was cut off and moved to quarantine on this open. */
  readonly recovered: { readonly quarantinePath: string; readonly record: QuarantineRecord } | null;
}

export class JournalWriter {
  private queue: Promise<unknown> = Promise.resolve();
  private failure: unknown = null;
  private closed = false;

  private constructor(
    readonly journalPath: string,
    private readonly handle: FileHandle,
    private anchor: AnchorWriter | null,
    private readonly lock: JournalLock,
    private readonly clock: Clock,
    private size: number,
    private seq: number,
    private lastHash: string,
  ) {}

  /** Create a new journal whose seq 0 is an `open` header naming the format, plus `header` fields. */
  static async create(
    journalPath: string,
    actor: string,
    header: Record<string, unknown>,
    clock: Clock = () => new Date(),
  ): Promise<OpenedJournal> {
    await mkdir(path.dirname(journalPath), { recursive: true });
    const lock = await acquireJournalLock(journalPath);
    let handle: FileHandle;
    try {
      handle = await open(journalPath, APPEND | constants.O_CREAT | constants.O_EXCL, 0o644);
    } catch (error) {
      await lock.release();
      throw error;
    }
    await syncFolder(path.dirname(journalPath));
    const writer = new JournalWriter(journalPath, handle, null, lock, clock, 0, 0, GENESIS_HASH);
    const first = await writer.append('open', actor, { format: JOURNAL_FORMAT, ...header });
    return { writer, entries: [first], recovered: null };
  }

  /** Open an existing journal for appending: verify it, quarantine a torn tail, refuse a broken chain. */
  static async open(journalPath: string, clock: Clock = () => new Date()): Promise<OpenedJournal> {
    const lock = await acquireJournalLock(journalPath);
    try {
      // Under the lock nobody appends, so one read of each file is enough.
      const anchorFile = await readAnchorBytes(journalPath);
      const journal = analyseJournal(await readFile(journalPath));
      const anchor = checkAnchor(journal, anchorFile);
      const analysis = withAnchor(journal, anchor);
      const tampered = analysis.problems.filter((problem) => problem.kind === 'tampered');
      if (tampered.length > 0) throw new JournalTamperedError(journalPath, tampered[0].seq, tampered);
      const handle = await open(journalPath, APPEND);
      let recovered: OpenedJournal['recovered'] = null;
      let size = (await handle.stat()).size;
      if (analysis.tornTail !== null) {
        const moved = await appendToQuarantine(journalPath, analysis.tornTail, clock());
        await handle.truncate(analysis.tornTail.fromByte);
        await handle.sync();
        size = analysis.tornTail.fromByte;
        recovered = { quarantinePath: moved.path, record: moved.record };
      }
      // A crash between the journal's fsync and its anchor, or a journal from before anchors: anchor what verified.
      const anchorWriter = await AnchorWriter.open(
        journalPath,
        analysis.fingerprint === null ? null : { seq: analysis.entries.length - 1, fingerprint: analysis.fingerprint },
        anchor.status !== 'anchored',
      );
      const writer = new JournalWriter(
        journalPath,
        handle,
        anchorWriter,
        lock,
        clock,
        size,
        analysis.entries.length,
        analysis.fingerprint ?? GENESIS_HASH,
      );
      return { writer, entries: analysis.entries, recovered };
    } catch (error) {
      await lock.release();
      throw error;
    }
  }

  /** The seq the next append will take. */
  get nextSeq(): number {
    return this.seq;
  }

  /** SHA-256 of the last line written: the run's fingerprint so far. */
  get fingerprint(): string {
    return this.lastHash;
  }

  /** Append one entry; resolves only after its bytes are written and fsync'd. */
  append<Payload>(kind: JournalKind, actor: string, payload: Payload): Promise<JournalEntry<Payload>> {
    const result = this.queue.then(() => this.write(kind, actor, payload));
    this.queue = result.catch(() => undefined);
    return result;
  }

  /** Wait for queued appends, then release the handle and the lock. */
  async close(): Promise<void> {
    if (this.closed) return;
    await this.queue;
    this.closed = true;
    await this.handle.close();
    await this.anchor?.close();
    await this.lock.release();
  }

  private async write<Payload>(kind: JournalKind, actor: string, payload: Payload): Promise<JournalEntry<Payload>> {
    if (this.closed) throw new Error(`journal ${this.journalPath} is closed`);
    if (this.failure !== null) throw new Error(`journal ${this.journalPath} failed earlier and must be reopened`, { cause: this.failure });
    const now = this.clock();
    const entry: JournalEntry<Payload> = {
      seq: this.seq,
      time: now.toISOString(),
      offset: localOffset(now),
      actor,
      kind,
      payload,
      previous: this.lastHash,
    };
    const line = entryLine(entry);
    const bytes = Buffer.from(line + '\n', 'utf8');
    const hash = lineHash(line);
    try {
      await this.expectSize(this.size);
      let written = 0;
      while (written < bytes.length) {
        // O_APPEND: every write lands at the end of the file, whatever another writer did.
        const { bytesWritten } = await this.handle.write(bytes, written, bytes.length - written, null);
        written += bytesWritten;
      }
      await this.expectSize(this.size + bytes.length);
      await this.handle.sync();
      const anchor = { seq: entry.seq, fingerprint: hash };
      if (this.anchor === null) this.anchor = await AnchorWriter.open(this.journalPath, anchor, true);
      else await this.anchor.write(anchor);
    } catch (error) {
      this.failure = error;
      throw error;
    }
    this.size += bytes.length;
    this.seq += 1;
    this.lastHash = hash;
    return entry;
  }

  private async expectSize(expected: number): Promise<void> {
    const { size } = await this.handle.stat();
    if (size !== expected) throw new JournalChangedError(this.journalPath, expected, size);
  }
}
