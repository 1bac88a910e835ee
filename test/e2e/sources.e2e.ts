import type { Page } from '@playwright/test';
import type { SourceListItem, SourceSummaryView } from '../../src-main/api/channels/sourceChannels.js';
import { expect, test, type RunningHost } from './support/browserHostFixture.js';

async function channel<T>(page: Page, host: RunningHost, name: string, payload: unknown): Promise<T> {
  const response = await page.request.post(`${host.origin}/api/${name}`, { headers: { authorization: `Bearer ${host.token}` }, data: payload });
  const body = (await response.json()) as { ok: boolean; value: T; message?: string };
  expect(body.ok, body.message).toBe(true);
  return body.value;
}

async function openSources(page: Page, host: RunningHost): Promise<void> {
  await page.goto(host.url);
  await page.getByRole('button', { name: 'Sources', exact: true }).click();
  await expect(page.getByTestId('source-register')).toBeVisible();
}

test.describe('an empty data folder', () => {
  test('create a source with a part and characteristic, rename it, retire it: it leaves the list and the plan picker', async ({ page, host }) => {
    await openSources(page, host);
    await expect(page.getByTestId('demo-offer')).toBeVisible();

    await page.getByTestId('new-source-name').fill('Osprey Castings (invented)');
    await page.getByTestId('add-source').click();
    await expect(page.getByTestId('source-name')).toHaveText('Osprey Castings (invented)');
    await expect(page.getByTestId('demo-offer')).toHaveCount(0);

    await page.getByTestId('new-part').fill('pump housing');
    await page.getByTestId('add-part').click();
    await page.getByLabel('New characteristic of pump housing').fill('porosity');
    await page.getByLabel('New characteristic of pump housing').press('Enter');
    await expect(page.getByTestId('part')).toContainText('porosity');

    await page.getByTestId('rename').click();
    await page.getByTestId('rename-input').fill('Osprey Foundry (invented)');
    await page.getByTestId('rename-save').click();
    await expect(page.getByTestId('source-name')).toHaveText('Osprey Foundry (invented)');
    await expect(page.getByTestId('source-item')).toHaveText(/Osprey Foundry \(invented\)\s+supplier · 0 runs/);

    // The Plan place offers the part and characteristic of the source it saves under.
    await page.getByRole('button', { name: 'Plan', exact: true }).click();
    await page.locator('#plan-source').selectOption({ label: 'Osprey Foundry (invented) (supplier)' });
    await page.getByTestId('plan-part').selectOption('pump housing');
    await expect(page.getByTestId('plan-characteristic').locator('option')).toHaveText(['Not named', 'porosity']);

    await page.getByRole('button', { name: 'Sources', exact: true }).click();
    await page.getByTestId('retire').click();
    await page.getByTestId('retire-confirm').click();
    await expect(page.getByTestId('source-item')).toHaveCount(0);
    await page.getByTestId('show-retired').check();
    await expect(page.getByTestId('source-item')).toHaveText(/Osprey Foundry \(invented\)\s+supplier · retired · 0 runs/);
    expect(await channel<unknown[]>(page, host, 'plan.sources', null)).toEqual([]);
  });

  test('the first-run offer fills the folder with the invented demo', async ({ page, host }) => {
    await openSources(page, host);
    await page.getByTestId('fill-demo').click();
    await expect(page.getByTestId('source-item')).toHaveCount(3);
    await expect(page.getByTestId('source-item').first()).toContainText('(invented)');
    await expect(page.getByTestId('demo-offer')).toHaveCount(0);
  });
});

test.describe('the demo data folder', () => {
  test.use({ hostData: 'demo' });

  test('a source summary shows the counts the channel gives, the decisions over time and the pooling caveat', async ({ page, host }) => {
    const sources = await channel<SourceListItem[]>(page, host, 'source.list', null);
    const brightwater = sources.find((source) => source.name.startsWith('Brightwater'))!;
    const expected = await channel<SourceSummaryView>(page, host, 'source.summary', { id: brightwater.id });

    await openSources(page, host);
    await page.getByTestId('source-item').filter({ hasText: 'Brightwater' }).click();
    await expect(page.getByTestId('source-name')).toHaveText(brightwater.name);
    const summary = expected.summary;
    for (const [id, count] of Object.entries({ runs: summary.runs, accepted: summary.accepted, rejected: summary.rejected, open: summary.open, items: summary.itemsInspected, nonconforming: summary.nonconformingFound })) {
      await expect(page.getByTestId(`summary-${id}`).locator('dd')).toHaveText(String(count));
    }
    expect(summary.rejected).toBeGreaterThan(0);
    expect(summary.open).toBe(1);
    await expect(page.getByTestId('decision-trend').locator('canvas')).toBeVisible();
    await expect(page.getByTestId('pooling-caveat')).toContainText('biased');
    await expect(page.getByTestId('source-runs').locator('tbody tr')).toHaveCount(summary.runs);
    await expect(page.getByTestId('source-runs')).toContainText('housing clip · flash');

    await page.getByTestId('decision-trend').locator('.u-over').hover({ position: { x: 200, y: 60 } });
    await page.screenshot({ path: 'test/artifacts/sources-summary-light.png', fullPage: true });
    await page.getByRole('button', { name: 'Switch to dark theme' }).click();
    await page.screenshot({ path: 'test/artifacts/sources-summary-dark.png', fullPage: true });
    await page.getByRole('button', { name: 'Switch to light theme' }).click();
    await page.getByTestId('source-register').screenshot({ path: 'test/artifacts/sources-register.png' });
    // Tall enough that the whole summary, down to the last run, is in the picture.
    await page.setViewportSize({ width: 1280, height: 1100 });
    await page.getByTestId('source-detail').screenshot({ path: 'test/artifacts/sources-summary-detail.png' });

    // A lot hands over to the Records place, which owns the read-only run and its record.
    await page.getByTestId('source-runs').getByRole('button', { name: 'BW-0419' }).click();
    await expect(page.getByRole('button', { name: 'Records', exact: true })).toHaveAttribute('aria-current', 'page');
    await expect(page.locator('main')).toContainText('BW-0419');
  });
});
