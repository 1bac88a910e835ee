/**
 * Replace a file's contents so that a reader sees either the old file or the new one, never a mix.
 *
 * Method: write a temp file in the same folder (same file system, so rename is atomic), fsync it,
 * rename it over the target (retrying briefly when Windows holds a lock: EPERM, EBUSY, EACCES),
 * then fsync the folder so the rename itself survives a power cut (skipped where the platform
 * refuses to open a folder, i.e. Windows).
 */
import { link, open, rename, rm } from 'node:fs/promises';
import path from 'node:path';
import { randomBytes } from 'node:crypto';

const RENAME_RETRY_CODES = new Set(['EPERM', 'EBUSY', 'EACCES']);
const RENAME_ATTEMPTS = 10;
const RENAME_PAUSE_MS = 25;

export interface AtomicWriteOptions {
  /** Injected for tests; defaults to `fs.promises.rename`. */
  readonly rename?: (from: string, to: string) => Promise<void>;
}

export async function writeFileAtomic(
  filePath: string,
  contents: string | Uint8Array,
  options: AtomicWriteOptions = {},
): Promise<void> {
  const renameFile = options.rename ?? rename;
  await placeSyncedTempFile(filePath, contents, (tempPath) => renameWithRetry(renameFile, tempPath, filePath));
}

/**
 * Write a file that must never be replaced once it exists (a plan version). Same steps as
 * writeFileAtomic, but the temp file is hard-linked into place, which fails with EEXIST instead of
 * overwriting, so two writers can never both think they wrote the same file.
 */
export async function writeFileOnce(filePath: string, contents: string | Uint8Array): Promise<void> {
  await placeSyncedTempFile(filePath, contents, async (tempPath) => {
    await link(tempPath, filePath);
    await rm(tempPath, { force: true });
  });
}

async function placeSyncedTempFile(
  filePath: string,
  contents: string | Uint8Array,
  place: (tempPath: string) => Promise<void>,
): Promise<void> {
  const folder = path.dirname(filePath);
  const tempPath = path.join(folder, `.${path.basename(filePath)}.${process.pid}.${randomBytes(6).toString('hex')}.tmp`);
  try {
    const handle = await open(tempPath, 'wx', 0o644);
    try {
      await handle.writeFile(contents);
      await handle.sync();
    } finally {
      await handle.close();
    }
    await place(tempPath);
  } catch (error) {
    await rm(tempPath, { force: true });
    throw error;
  }
  await syncFolder(folder);
}

async function renameWithRetry(
  renameFile: (from: string, to: string) => Promise<void>,
  from: string,
  to: string,
): Promise<void> {
  for (let attempt = 1; ; attempt += 1) {
    try {
      await renameFile(from, to);
      return;
    } catch (error) {
      const code = (error as NodeJS.ErrnoException).code ?? '';
      if (!RENAME_RETRY_CODES.has(code) || attempt >= RENAME_ATTEMPTS) throw error;
      await new Promise((resolve) => setTimeout(resolve, RENAME_PAUSE_MS * attempt));
    }
  }
}

/** fsync a folder so a rename or a new file in it is durable. Windows cannot open folders: skipped. */
export async function syncFolder(folder: string): Promise<void> {
  if (process.platform === 'win32') return;
  let handle;
  try {
    handle = await open(folder, 'r');
    await handle.sync();
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code ?? '';
    // Some file systems refuse fsync on a folder; the data itself is already synced.
    if (code !== 'EINVAL' && code !== 'EISDIR' && code !== 'EPERM') throw error;
  } finally {
    await handle?.close();
  }
}
