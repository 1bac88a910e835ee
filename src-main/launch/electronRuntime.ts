import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

/**
 * Where the Electron runtime binary is, if it was downloaded. Importing the `electron` package
 * would try the download itself, so this reads the files the package leaves behind instead.
 */
export function findElectronRuntime(appRoot: string): string | null {
  const packageFolder = join(appRoot, 'node_modules', 'electron');
  const pathFile = join(packageFolder, 'path.txt');
  if (!existsSync(pathFile)) return null;
  const executable = join(packageFolder, 'dist', readFileSync(pathFile, 'utf8').trim());
  return existsSync(executable) ? executable : null;
}

/** Tries the package's own download once (it fails fast where its host is unreachable). */
export function tryDownloadElectronRuntime(appRoot: string): boolean {
  const installer = join(appRoot, 'node_modules', 'electron', 'install.js');
  if (!existsSync(installer)) return false;
  const outcome = spawnSync(process.execPath, [installer], { stdio: 'ignore', timeout: 180_000 });
  return outcome.status === 0;
}

/**
 * The arguments for the Electron runtime: the app folder, not the main script, so Electron reads
 * package.json (its `name`, `productName` and `main`) and keeps its profile and single-instance
 * lock under the app's own name rather than "Electron".
 */
export function electronLaunchArguments(appRoot: string, userArguments: readonly string[]): string[] {
  return [appRoot, ...userArguments];
}
