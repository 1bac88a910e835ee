/** The names in a folder, or none when the folder does not exist yet (nothing saved there so far). */
import { readdir } from 'node:fs/promises';

export async function folderNames(folder: string): Promise<string[]> {
  try {
    return await readdir(folder);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return [];
    throw error;
  }
}
