/**
 * A lock file beside a journal (`<runId>.lock`, holding the writer's pid) so that two processes
 * never append to one journal at once. A lock left by a dead process (e.g. killed) is taken over.
 */
import { open, readFile, rm } from 'node:fs/promises';
import { JournalBusyError } from './errors.js';

export interface JournalLock {
  readonly path: string;
  release(): Promise<void>;
}

function lockPathOf(journalPath: string): string {
  return journalPath.replace(/\.journal$/, '') + '.lock';
}

/** The pid of the live process holding the journal's lock, or null when none does (one small file read). */
export async function journalHolder(journalPath: string): Promise<number | null> {
  const holder = Number.parseInt(await readFile(lockPathOf(journalPath), 'utf8').catch(() => ''), 10);
  return Number.isInteger(holder) && holder > 0 && isAlive(holder) ? holder : null;
}

export async function acquireJournalLock(journalPath: string): Promise<JournalLock> {
  const lockPath = lockPathOf(journalPath);
  for (let attempt = 0; attempt < 3; attempt += 1) {
    try {
      const handle = await open(lockPath, 'wx');
      try {
        await handle.writeFile(String(process.pid));
      } finally {
        await handle.close();
      }
      return { path: lockPath, release: () => rm(lockPath, { force: true }) };
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw error;
      const holder = Number.parseInt(await readFile(lockPath, 'utf8').catch(() => ''), 10);
      if (Number.isInteger(holder) && holder > 0 && isAlive(holder)) throw new JournalBusyError(journalPath, holder);
      // The holder is gone (or the lock never got its pid): the lock is stale.
      await rm(lockPath, { force: true });
    }
  }
  throw new Error(`could not take the lock ${lockPath}`);
}

/** Whether a process with this pid runs (EPERM: it does, under another user). */
export function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}
