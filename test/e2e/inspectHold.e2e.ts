import { spawn, spawnSync } from 'node:child_process';
import { once } from 'node:events';
import { compiledCliEntry, repoRoot } from '../cli/runCli.js';
import { expect, test } from './support/browserHostFixture.js';

/** The compiled command line under plain Node, as the installed app's `tallyline` runs it. */
const cli = (args: string[]) => [process.execPath, [compiledCliEntry, ...args]] as const;

test('a run shown read-only while a command-line feed holds it becomes writable when the feed lets go', async ({ page, host }) => {
  // The NIST/SEMATECH e-Handbook §6.2.6 example plan (from memory); one pass leaves it undecided.
  const plan = ['--model', 'passfail', '--p0', '0.01', '--p1', '0.1', '--alpha', '0.05', '--beta', '0.1'];
  const [node, startArgs] = cli(['run', 'start', ...plan, '--source', 'Acme Castings', '--lot', 'F-1', '--data-dir', host.dataDirectory, '--json']);
  const started = spawnSync(node, startArgs, { cwd: repoRoot, encoding: 'utf8' });
  expect(started.status, started.stderr).toBe(0);
  const runId = JSON.parse(started.stdout).run as string;

  const [, feedArgs] = cli(['feed', '--run', runId, '--data-dir', host.dataDirectory, '--json']);
  const feed = spawn(node, feedArgs, { cwd: repoRoot, stdio: ['pipe', 'pipe', 'pipe'] });
  feed.stdin.write('pass\n');
  await new Promise<void>((resolve) => feed.stdout.on('data', (chunk: Buffer) => chunk.toString().includes('"seq"') && resolve()));

  await page.goto(host.url);
  await page.getByRole('button', { name: 'Inspect', exact: true }).click();
  await page.locator('[data-testid="open-run"]', { hasText: 'F-1' }).click();
  await expect(page.getByRole('alert')).toContainText('another program is writing it');
  await expect(page.getByTestId('record-pass')).toHaveCount(0);

  feed.stdin.end();
  await once(feed, 'exit');
  await expect(page.getByTestId('record-pass')).toBeVisible();
  await expect(page.getByText('another program is writing it')).toHaveCount(0);
  await page.getByTestId('record-pass').click();
  await expect(page.getByTestId('entry-row')).toHaveCount(2);
});
