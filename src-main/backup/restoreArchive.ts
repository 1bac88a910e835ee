/**
 * Restore: an archive replaces the data folder only once every file of it has been written to a
 * folder beside the data folder and checked there: the files' schemas, and every journal's hash
 * chain read back from disk. Then two renames swap the folders; the old one stays, dated.
 *
 * Method: unpack and check in memory (readArchive.ts) -> refuse while a live process holds a run's
 * lock -> write `<parent>/.<name>.restoring-<random>` file by file (fsync each, then the folders)
 * -> validate settings, sources and plans with their zod schemas; read each journal back with its
 * anchor and compare both with what the manifest recorded at backup; replay each intact journal
 * through the run service's own replay (RunReplay), so a run that would not open is refused here;
 * anchor an intact journal that has no anchor yet (an archive from before anchors) -> rename the data folder to
 * `<name>.before-restore-<UTC stamp>`, rename the checked folder to `<name>`, fsync the parent.
 * Any failure before the swap removes the checked folder and leaves the data folder as it was.
 */
import { randomBytes } from 'node:crypto';
import { mkdir, open, readFile, readdir, rename, rm, stat } from 'node:fs/promises';
import path from 'node:path';
import type { z } from 'zod';
import { readRunBytes } from '../inspection/index.js';
import {
  anchorFileBytes,
  anchorPathFor,
  liveLockOwner,
  planVersionSchema,
  readAnchorBytes,
  settingsSchema,
  sourceSchema,
  syncFolder,
  writeFileAtomic,
} from '../store/index.js';
import { ArchiveRefusedError, RestoreBlockedError } from './archiveFormat.js';
import { unpackArchive, type ArchivedFile } from './readArchive.js';

export interface RestoreReport {
  readonly files: number;
  readonly runs: number;
  readonly sources: number;
  readonly plans: number;
  /** The archive's creation time, from its manifest. */
  readonly backedUpAt: string;
  /** Where the data folder that was replaced now is, or null when there was none. */
  readonly previousDataKeptAt: string | null;
  /** Journals that were already damaged when backed up, restored as they were. */
  readonly damagedAtBackup: string[];
}

export interface RestoreOptions {
  readonly clock?: () => Date;
}

const SCHEMAS: [RegExp, z.ZodType, string][] = [
  [/^settings\.json$/, settingsSchema, 'settings'],
  [/^sources\//, sourceSchema, 'source'],
  [/^plans\//, planVersionSchema, 'plan version'],
];

export async function restoreArchive(archive: Uint8Array, dataDirectory: string, options: RestoreOptions = {}): Promise<RestoreReport> {
  const clock = options.clock ?? (() => new Date());
  const unpacked = await unpackArchive(archive);
  const target = path.resolve(dataDirectory);
  const parent = path.dirname(target);
  await refuseWhileRunsAreOpen(target);
  await mkdir(parent, { recursive: true });

  const staging = path.join(parent, `.${path.basename(target)}.restoring-${randomBytes(4).toString('hex')}`);
  let damagedAtBackup: string[];
  try {
    await writeFiles(staging, unpacked.files);
    damagedAtBackup = await checkWritten(staging, unpacked.files);
  } catch (error) {
    await rm(staging, { recursive: true, force: true });
    throw error;
  }

  const previousDataKeptAt = (await exists(target)) ? `${target}.before-restore-${stamp(clock())}` : null;
  if (previousDataKeptAt !== null) await rename(target, previousDataKeptAt);
  try {
    await rename(staging, target);
  } catch (error) {
    // Put the data folder back where it was before reporting the failure.
    if (previousDataKeptAt !== null) await rename(previousDataKeptAt, target);
    await rm(staging, { recursive: true, force: true });
    throw error;
  }
  await syncFolder(parent);

  const count = (prefix: string, suffix: string) => unpacked.files.filter((file) => file.path.startsWith(prefix) && file.path.endsWith(suffix)).length;
  return {
    files: unpacked.files.length,
    runs: count('runs/', '.journal'),
    sources: count('sources/', '.json'),
    plans: new Set(unpacked.files.filter((file) => file.path.startsWith('plans/')).map((file) => file.path.split('/')[1])).size,
    backedUpAt: unpacked.manifest.createdAt,
    previousDataKeptAt,
    damagedAtBackup,
  };
}

async function writeFiles(staging: string, files: readonly ArchivedFile[]): Promise<void> {
  await mkdir(staging, { recursive: false });
  const folders = new Set<string>([staging]);
  for (const file of files) {
    const destination = path.join(staging, ...file.path.split('/'));
    const folder = path.dirname(destination);
    if (!folders.has(folder)) {
      await mkdir(folder, { recursive: true });
      folders.add(folder);
    }
    const handle = await open(destination, 'wx', 0o644);
    try {
      await handle.writeFile(file.contents);
      await handle.sync();
    } finally {
      await handle.close();
    }
  }
  for (const folder of [...folders].sort((a, b) => b.length - a.length)) await syncFolder(folder);
}

/** Checks what is on disk in the staging folder; returns the journals already damaged at backup. */
async function checkWritten(staging: string, files: readonly ArchivedFile[]): Promise<string[]> {
  const damagedAtBackup: string[] = [];
  for (const file of files) {
    const onDisk = path.join(staging, ...file.path.split('/'));
    if (file.path.endsWith('.journal')) {
      if (await checkJournal(file, onDisk)) damagedAtBackup.push(file.path);
      continue;
    }
    const rule = SCHEMAS.find(([pattern]) => pattern.test(file.path));
    if (rule === undefined) continue; // quarantined tails are kept byte for byte, never parsed
    const [, schema, what] = rule;
    let value: unknown;
    try {
      value = JSON.parse(await readFile(onDisk, 'utf8'));
    } catch {
      throw new ArchiveRefusedError(`the ${what} file "${file.path}" is not JSON`);
    }
    const parsed = schema.safeParse(value);
    if (!parsed.success) {
      const issue = parsed.error.issues[0];
      throw new ArchiveRefusedError(`the ${what} file "${file.path}" is not valid at "${issue?.path.join('.') ?? ''}": ${issue?.message ?? 'invalid'}`);
    }
  }
  return damagedAtBackup;
}

/**
 * Checks one restored journal against the manifest: the same chain verification, the same standing
 * against its anchor, and a replay of its entries. Returns true when it was already damaged at
 * backup (restored as it was); throws ArchiveRefusedError when anything differs or it does not replay.
 */
async function checkJournal(file: ArchivedFile, onDisk: string): Promise<boolean> {
  const recorded = file.journal;
  if (recorded === undefined) throw new ArchiveRefusedError(`the manifest has no chain check for the journal "${file.path}"`);
  // The catalogue's one reading of a run: chain, anchor and replay of the entries.
  const read = readRunBytes(path.basename(onDisk, '.journal'), await readFile(onDisk), await readAnchorBytes(onDisk));
  const anchor = read.anchor!;
  const chainProblems = read.problems.filter((problem) => problem !== anchor.problem && problem !== read.replayProblem);
  const chainOk = chainProblems.length === 0;
  if (chainOk !== recorded.ok || read.entriesRead !== recorded.entries || read.fingerprint !== recorded.fingerprint) {
    const problem = chainProblems[0];
    throw new ArchiveRefusedError(
      `the journal "${file.path}" does not verify as it did at backup` +
        (problem ? ` (seq ${problem.seq}, line ${problem.line}: ${problem.problem})` : ` (fingerprint ${read.fingerprint} instead of ${recorded.fingerprint})`),
    );
  }
  const anchorAtBackup = recorded.anchor?.status ?? 'missing';
  if (anchor.status !== anchorAtBackup || (anchor.anchor?.seq ?? null) !== (recorded.anchor?.seq ?? null)) {
    const problem = anchor.problem;
    throw new ArchiveRefusedError(
      `the journal "${file.path}" does not stand against its anchor as it did at backup (${anchorAtBackup} then, ${anchor.status} now` +
        (problem ? `; seq ${problem.seq}: ${problem.problem})` : ')'),
    );
  }
  if (!chainOk || anchor.problem !== null) return true;
  if (read.replayProblem !== null) {
    throw new ArchiveRefusedError(`the journal "${file.path}" does not replay: seq ${read.replayProblem.seq}: ${read.replayProblem.detail}`);
  }
  if (anchor.status !== 'anchored' && read.fingerprint !== null) {
    // Checked against the manifest's fingerprint above: that record is the anchor this journal had.
    await writeFileAtomic(anchorPathFor(onDisk), anchorFileBytes({ seq: read.entriesRead - 1, fingerprint: read.fingerprint }));
  }
  return false;
}

/** A run whose lock names a live process is being written: swapping the folder under it would lose entries. */
async function refuseWhileRunsAreOpen(dataDirectory: string): Promise<void> {
  let names: string[];
  try {
    names = await readdir(path.join(dataDirectory, 'runs'));
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return;
    throw error;
  }
  for (const name of names.filter((entry) => entry.endsWith('.lock'))) {
    const owner = await liveLockOwner(path.join(dataDirectory, 'runs', name));
    if (owner !== null) {
      const who = owner.pid === process.pid ? 'this Tallyline' : `another Tallyline (process ${owner.pid}${owner.host === null ? '' : ` on ${owner.host}`})`;
      throw new RestoreBlockedError(
        `run ${name.slice(0, -'.lock'.length)} is open for entry in ${who}; close Tallyline and restore from the command line ` +
          `(tallyline restore --from FILE --data-dir DIR)`,
      );
    }
  }
}

async function exists(folder: string): Promise<boolean> {
  try {
    await stat(folder);
    return true;
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return false;
    throw error;
  }
}

/** `20261201T225034Z`: sortable, and safe in a folder name on every platform. */
function stamp(now: Date): string {
  return now.toISOString().replace(/[-:]/g, '').replace(/\.\d+Z$/, 'Z');
}
