import type { APIRequestContext } from '@playwright/test';
import type { LinearCountSpec } from '../../src-main/engine/index.js';
import { expect, test, type RunningHost } from './support/browserHostFixture.js';

// p0 1 %, p1 10 %, 5 % risks, untruncated: 31 passes accept, 2 nonconforming in the first 2 items reject
// (the engine's decide; the same plan as test/record/fromRunFixtures.ts). All names below are invented.
const spec: LinearCountSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.05 };

async function call<T>(request: APIRequestContext, host: RunningHost, channel: string, data: unknown): Promise<T> {
  const response = await request.post(`${host.origin}/api/${channel}`, { headers: { authorization: `Bearer ${host.token}` }, data });
  const body = (await response.json()) as { ok: boolean; value: T; message?: string };
  if (!body.ok) throw new Error(`${channel}: ${body.message}`);
  return body.value;
}

/** Four runs through the real channels: two sources, accepted, rejected and undecided. */
async function seedRuns(request: APIRequestContext, host: RunningHost): Promise<void> {
  const runs = [
    { source: 'Kestrel Fasteners (invented)', part: 'M6 flange nut', lot: 'KF-25-0311', results: Array<'pass'>(31).fill('pass') },
    { source: 'Kestrel Fasteners (invented)', part: 'M6 flange nut', lot: 'KF-25-0312', results: ['fail', 'fail'] },
    { source: 'Brightwater Plastics (invented)', part: 'Cap, 38 mm', lot: 'BW-7781', results: Array<'pass'>(31).fill('pass') },
    { source: 'Brightwater Plastics (invented)', part: 'Cap, 38 mm', lot: 'BW-7782', results: ['pass', 'pass', 'fail', 'pass'] },
  ] as const;
  const plans = new Map<string, { id: string; sourceId: string }>();
  for (const run of runs) {
    if (!plans.has(run.source)) {
      const known = await call<Array<{ id: string; name: string }>>(request, host, 'plan.sources', null);
      const existing = known.find((source) => source.name === run.source);
      const saved = await call<{ id: string; sourceId: string }>(request, host, 'plan.save', {
        name: 'Incoming check',
        source: existing ? { id: existing.id } : { name: run.source, kind: 'supplier' },
        part: run.part,
        characteristic: 'Visual and gauge check',
        spec,
      });
      plans.set(run.source, saved);
    }
    const plan = plans.get(run.source)!;
    const started = await call<{ run: { id: string } }>(request, host, 'inspection.start', {
      planId: plan.id,
      sourceId: plan.sourceId,
      lot: run.lot,
      lotSize: 5000,
      inspector: 'J. Marlow',
    });
    let item = 0;
    for (const result of run.results) {
      item += 1;
      await call(request, host, 'inspection.record', { runId: started.run.id, itemId: `${run.lot}-${String(item).padStart(3, '0')}`, result });
    }
  }
}

test('the Records place lists runs, filters them, opens one read-only with its chart, and downloads its record', async ({ page, host, request }) => {
  await seedRuns(request, host);
  await page.goto(host.url);
  await page.getByRole('button', { name: 'Records', exact: true }).click();

  const rows = page.getByTestId('history-row');
  await expect(rows).toHaveCount(4);
  await expect(page.getByTestId('history-count')).toHaveText('4 runs');
  await page.screenshot({ path: 'test/artifacts/records-history.png' });

  // Filter by outcome, then by source, then clear.
  await page.getByTestId('filter-outcome').selectOption('accepted');
  await expect(rows).toHaveCount(2);
  await expect(page.getByTestId('history-count')).toHaveText('2 of 4 runs');
  await page.getByTestId('filter-source').selectOption({ label: 'Kestrel Fasteners (invented)' });
  await expect(rows).toHaveCount(1);
  await expect(rows.first()).toContainText('KF-25-0311');
  await page.getByTestId('filter-outcome').selectOption('open');
  await expect(page.getByText('No run matches these filters.')).toBeVisible();
  await page.getByTestId('filter-clear').click();
  await expect(rows).toHaveCount(4);

  // The period filter, against the start date the table shows: a period ending the day before shows none.
  // The table writes dates in the OS locale; the machine-readable date rides in <time datetime>.
  const started = ((await rows.first().locator('td').nth(4).locator('time').getAttribute('datetime')) ?? '').slice(0, 10);
  const dayBefore = new Date(Date.parse(`${started}T12:00:00Z`) - 86_400_000).toISOString().slice(0, 10);
  await page.getByTestId('filter-to').fill(dayBefore);
  await expect(rows).toHaveCount(0);
  await page.getByTestId('filter-from').fill(dayBefore);
  await page.getByTestId('filter-to').fill(started);
  await expect(rows).toHaveCount(4);
  await page.getByTestId('filter-clear').click();
  await expect(rows).toHaveCount(4);

  // Open the rejected run read-only: its decision, counts, chart and estimate; no way to enter results.
  await page.getByRole('button', { name: 'Open lot KF-25-0312' }).click();
  const view = page.getByTestId('record-view');
  await expect(view).toBeVisible();
  await expect(page.getByTestId('record-decision')).toHaveAttribute('data-outcome', 'rejected');
  await expect(page.getByTestId('record-n')).toHaveText('2');
  await expect(page.getByTestId('record-total')).toHaveText('2');
  await expect(page.getByTestId('record-estimate')).toContainText('Whitehead 1986');
  // The estimate is written for people: a fraction nonconforming in percent, with the sign at both ends.
  await expect(page.getByTestId('estimate-interval')).toHaveText(/^\d+(\.\d+)? % to \d+(\.\d+)? %$/);
  await expect(page.getByTestId('evidence-counts').locator('canvas')).toBeVisible();
  await expect(page.getByTestId('evidence-llr').locator('canvas')).toBeVisible();
  await expect(view.getByRole('textbox')).toHaveCount(0);
  await page.screenshot({ path: 'test/artifacts/records-decided-run.png' });

  // The record PDF comes as a download; its bytes are a PDF.
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('download-record').click()]);
  expect(download.suggestedFilename()).toMatch(/^record-KF-25-0312-DR-[0-9a-f]{8}-[0-9a-f]{8}\.pdf$/);
  const stream = await download.createReadStream();
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(chunk as Buffer);
  const bytes = Buffer.concat(chunks);
  expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
  await expect(page.getByTestId('file-status')).toContainText('Downloaded record-KF-25-0312');

  // And the entries as CSV, with their header row.
  const [csv] = await Promise.all([page.waitForEvent('download'), page.getByTestId('download-csv').click()]);
  expect(csv.suggestedFilename()).toMatch(/^entries-KF-25-0312-.*\.csv$/);

  // An undecided run opens too, and its record is offered as interim.
  await page.getByTestId('leave-record').click();
  await page.getByRole('button', { name: 'Open lot BW-7782' }).click();
  await expect(page.getByTestId('record-decision')).toHaveAttribute('data-outcome', 'open');
  await expect(page.getByTestId('download-record')).toHaveText('Download interim record (PDF)');
  await expect(page.getByTestId('record-estimate')).toContainText('Interim, the run is undecided');
});
