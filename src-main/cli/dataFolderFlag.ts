/** `--data-dir DIR`, accepted by every command that reads or writes the data folder. */
import os from 'node:os';
import { resolveDataDirectory } from '../store/index.js';
import { flag } from './flags.js';

export const dataDirectoryFlags = { 'data-dir': flag.text('a folder') };

/** The data directory for these args: --data-dir, then TALLYLINE_DATA, then the OS app-data folder. */
export function dataDirectoryFor(args: readonly string[]): string {
  return resolveDataDirectory({ argv: args, env: process.env, platform: process.platform, home: os.homedir() });
}
