/** `--data-dir DIR`, accepted by every command that reads or writes the data folder, and its checks. */
import { stat } from 'node:fs/promises';
import os from 'node:os';
import { layout, resolveDataDirectory } from '../store/index.js';
import { CliFailure } from './command.js';
import { flag } from './flags.js';

export const dataDirectoryFlags = { 'data-dir': flag.path('a folder') };

/** The data directory for these args: --data-dir, then TALLYLINE_DATA, then the OS app-data folder. */
export function dataDirectoryFor(args: readonly string[]): string {
  return resolveDataDirectory({ argv: args, env: process.env, platform: process.platform, home: os.homedir() });
}

/**
 * The data directory for these args, checked before anything reads or writes it: it must be a
 * folder; with `mayCreate` it may also not exist yet (the first run, the demo, a restore).
 *
 * @throws CliFailure naming the folder and what is wrong with it.
 */
export async function checkedDataDirectory(args: readonly string[], mayCreate = false): Promise<string> {
  const dataDirectory = dataDirectoryFor(args);
  let stats;
  try {
    stats = await stat(dataDirectory);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'ENOENT' && mayCreate) return dataDirectory;
    if (code === 'ENOENT') throw new CliFailure(`the data folder ${dataDirectory} does not exist (give --data-dir an existing folder)`);
    if (code === 'ENOTDIR') throw new CliFailure(`the data folder ${dataDirectory} is inside a file, not a folder`);
    throw error;
  }
  if (!stats.isDirectory()) throw new CliFailure(`the data folder ${dataDirectory} is a file, not a folder`);
  return dataDirectory;
}

/** Refuses a run id with no journal in the data folder, before anything opens it. */
export async function requireExistingRun(dataDirectory: string, runId: string): Promise<void> {
  try {
    await stat(layout.runJournal(dataDirectory, runId));
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') throw new CliFailure(`there is no run ${runId} in the data folder ${dataDirectory}`);
    throw error;
  }
}
