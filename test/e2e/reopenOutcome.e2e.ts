import { execFile } from 'node:child_process';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { fileURLToPath } from 'node:url';
import type { APIRequestContext } from '@playwright/test';
import type { PlanSpec } from '../../src-main/engine/index.js';
import { expect, test, type RunningHost } from './support/browserHostFixture.js';

const run = promisify(execFile);
const appRoot = fileURLToPath(new URL('../..', import.meta.url));

// p0 1 %, p1 10 %, 5 % risks, untruncated: 31 passes accept (the engine's decide; the plan of
// records.e2e.ts). One nonconforming item after that takes the evidence back between the lines.
// All names are invented.
const spec: PlanSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.05 };
const SOURCE = 'Heron Valve Works (invented)';
const LOT = 'HV-4410';
const WORDS = 'reopened after a decision';

async function call<T>(request: APIRequestContext, host: RunningHost, channel: string, data: unknown): Promise<T> {
  const response = await request.post(`${host.origin}/api/${channel}`, { headers: { authorization: `Bearer ${host.token}` }, data });
  const body = (await response.json()) as { ok: boolean; value: T; message?: string };
  if (!body.ok) throw new Error(`${channel}: ${body.message}`);
  return body.value;
}

/** Accepts a run, reopens it with an override and a reason, and continues with a nonconforming item. */
async function acceptReopenContinue(request: APIRequestContext, host: RunningHost): Promise<string> {
  const plan = await call<{ id: string; sourceId: string }>(request, host, 'plan.save', {
    name: 'Valve seat check',
    source: { name: SOURCE, kind: 'supplier' },
    spec,
  });
  const started = await call<{ run: { id: string } }>(request, host, 'inspection.start', { planId: plan.id, sourceId: plan.sourceId, lot: LOT, inspector: 'R. Okafor' });
  const runId = started.run.id;
  let status = 'open';
  for (let item = 1; status === 'open' && item <= 40; item += 1) {
    status = (await call<{ run: { status: string } }>(request, host, 'inspection.record', { runId, result: 'pass' })).run.status;
  }
  expect(status).toBe('closed');
  await call(request, host, 'inspection.override', { runId, reason: 'customer asked for a second sample from the same lot' });
  const next = await call<{ run: { status: string }; state: { decision: string } }>(request, host, 'inspection.record', { runId, result: 'fail' });
  expect(next).toMatchObject({ run: { status: 'open' }, state: { decision: 'continue' } });
  return runId;
}

test('a run accepted, reopened with an override and continued reads "reopened after a decision" in Inspect, Records, Sources, the CLI and the record', async ({ page, host, request }) => {
  const runId = await acceptReopenContinue(request, host);
  await page.goto(host.url);

  // Inspect: under Unfinished, with the outcome words (not the evidence's "accept").
  await page.getByRole('button', { name: 'Inspect', exact: true }).click();
  const listed = page.locator(`[data-testid="open-run"][data-run-id="${runId}"]`);
  await expect(listed).toHaveAttribute('data-outcome', 'reopened');
  await expect(listed.getByTestId('run-outcome')).toContainText(WORDS);
  await expect(page.getByTestId('run-list').getByRole('heading', { name: 'Unfinished' })).toBeVisible();

  // Records: the row and the opened run.
  await page.getByRole('button', { name: 'Records', exact: true }).click();
  const row = page.locator(`[data-testid="history-row"][data-run-id="${runId}"]`);
  await expect(row).toHaveAttribute('data-outcome', 'reopened');
  await expect(row.getByTestId('history-outcome')).toHaveText(/Reopened after a decision/);
  await row.getByTestId('open-record').click();
  await expect(page.getByTestId('record-outcome')).toHaveText(/Reopened after a decision/);

  // Sources: the source's runs.
  await page.getByRole('button', { name: 'Sources', exact: true }).click();
  await page.getByTestId('source-item').filter({ hasText: SOURCE }).click();
  const sourceRun = page.locator(`[data-testid="source-run"][data-run-id="${runId}"]`);
  await expect(sourceRun).toHaveAttribute('data-outcome', 'reopened');
  await expect(sourceRun.getByTestId('source-run-outcome')).toHaveText(WORDS);
  await page.screenshot({ path: 'test/artifacts/sources-reopened-run.png' });

  // The CLI's run show (the compiled command line the global setup built), as text and as JSON.
  const cli = (args: string[]) => run(process.execPath, [join(appRoot, 'build', 'main', 'cli.js'), ...args, '--data-dir', host.dataDirectory], { cwd: appRoot });
  const shown = await cli(['run', 'show', '--run', runId]);
  expect(shown.stdout).toContain(`Outcome: ${WORDS}`);
  expect(shown.stdout).toContain('customer asked for a second sample from the same lot');
  const json = JSON.parse((await cli(['run', 'show', '--run', runId, '--json'])).stdout) as { outcome: string; history: Array<{ kind: string }> };
  expect(json.outcome).toBe('reopened');
  expect(json.history.map((event) => event.kind)).toEqual(['decision', 'reopened']);

  // The decision record, read back as text.
  const pdf = await call<{ base64: string; interim: boolean }>(request, host, 'record.pdf', { runId });
  expect(pdf.interim).toBe(true);
  const folder = await mkdtemp(join(tmpdir(), 'tallyline-reopened-'));
  try {
    const file = join(folder, 'record.pdf');
    await writeFile(file, Buffer.from(pdf.base64, 'base64'));
    const text = (await run('pdftotext', ['-layout', file, '-'])).stdout.replace(/\s+/g, ' ');
    expect(text).toContain(`Outcome ${WORDS}`);
    expect(text).toContain('customer asked for a second sample from the same lot');
  } finally {
    await rm(folder, { recursive: true, force: true });
  }
});
