import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

/**
 * The app's root folder: the nearest one above this file holding package.json. The same code
 * runs from `src-main/` under tsx and from `build/main/` inside Electron (also inside an asar).
 */
function findAppRoot(start: string): string {
  for (let folder = start; ; folder = dirname(folder)) {
    if (existsSync(join(folder, 'package.json'))) return folder;
    if (dirname(folder) === folder) throw new Error(`No package.json above ${start}.`);
  }
}

export const appRoot = findAppRoot(dirname(fileURLToPath(import.meta.url)));
export const rendererRoot = join(appRoot, 'build', 'renderer');
