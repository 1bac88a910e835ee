// Runs the real CLI the way a user does (node --import tsx src-main/cli.ts ...), from the repo root.
import { spawn } from 'node:child_process';
import { fileURLToPath } from 'node:url';

export const repoRoot = fileURLToPath(new URL('../..', import.meta.url));

export interface CliResult {
  code: number | null;
  stdout: string;
  stderr: string;
}

export function runCli(args: readonly string[], options: { input?: string; entry?: string[] } = {}): Promise<CliResult> {
  const entry = options.entry ?? ['--import', 'tsx', 'src-main/cli.ts'];
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
