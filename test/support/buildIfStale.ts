import { execFileSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

const repoRoot = fileURLToPath(new URL('../..', import.meta.url));

/**
 * Builds the named parts of the app when their sources changed since their last build (quiet when
 * up to date), so tests run the compiled JavaScript an installed app runs. See scripts/build.mjs.
 */
export function buildIfStale(targets: ReadonlyArray<'main' | 'renderer'>): void {
  execFileSync(process.execPath, [`${repoRoot}scripts/build.mjs`, ...targets], { cwd: repoRoot, stdio: 'inherit' });
}
