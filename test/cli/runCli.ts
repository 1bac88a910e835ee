// Runs the real CLI the way an installed app does: the compiled build/main/cli.js under plain Node,
// from the repo root. test/support/buildOnce.ts builds it before the first test file runs.
import { spawn } from 'node:child_process';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

export const repoRoot = fileURLToPath(new URL('../..', import.meta.url));
/** The compiled command line, as `npm run cli` and the bin run it. */
export const compiledCliEntry = join(repoRoot, 'build', 'main', 'cli.js');

export interface CliResult {
  code: number | null;
  stdout: string;
  stderr: string;
}

export function runCli(args: readonly string[], options: { input?: string; entry?: string[] } = {}): Promise<CliResult> {
  const entry = options.entry ?? [compiledCliEntry];
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [...entry, ...args], { cwd: repoRoot, stdio: 'pipe' });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (chunk) => (stdout += chunk));
    child.stderr.on('data', (chunk) => (stderr += chunk));
    child.on('error', reject);
    child.on('close', (code) => resolve({ code, stdout, stderr }));
    child.stdin.end(options.input ?? '');
  });
}
