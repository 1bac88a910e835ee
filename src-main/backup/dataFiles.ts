/** The data folder's own files, as relative "/" paths, found without blocking (lock and temp files left out). */
import { readdir } from 'node:fs/promises';
import path from 'node:path';
import { isArchivedPath } from './archiveFormat.js';

export interface DataFileList {
  /** Files of the layout, sorted. */
  readonly files: string[];
  /** Anything else found (besides locks and temp files), left out of the archive. */
  readonly skipped: string[];
}

export async function listDataFiles(dataDirectory: string): Promise<DataFileList> {
  const files: string[] = [];
  const skipped: string[] = [];
  async function walk(relative: string): Promise<void> {
    let entries;
    try {
      entries = await readdir(path.join(dataDirectory, relative), { withFileTypes: true });
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === 'ENOENT') return;
      throw error;
    }
    for (const entry of entries) {
      const child = relative === '' ? entry.name : `${relative}/${entry.name}`;
      if (entry.isDirectory()) await walk(child);
      else if (isArchivedPath(child)) files.push(child);
      // Locks belong to a live writer and temp files to a write in progress: neither is data.
      else if (!entry.name.endsWith('.lock') && !entry.name.startsWith('.')) skipped.push(child);
    }
  }
  await walk('');
  return { files: files.sort(), skipped: skipped.sort() };
}
