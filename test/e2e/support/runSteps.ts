import type { Page } from '@playwright/test';
import type { PlanSpec } from '../../../src-main/engine/index.js';
import { expect, type RunningHost } from './browserHostFixture.js';

/** Saves a plan under a source through the plan channel, as the Plan place would. */
export async function savePlanThroughChannel(page: Page, host: RunningHost, planSpec: PlanSpec, name: string, sourceName = 'Acme Castings'): Promise<void> {
  const response = await page.request.post(`${host.origin}/api/plan.save`, {
    headers: { authorization: `Bearer ${host.token}` },
    data: { name, source: { name: sourceName, kind: 'supplier' }, spec: planSpec },
  });
  expect(response.status()).toBe(200);
  expect(await response.json()).toMatchObject({ ok: true });
}

/** Opens Inspect and starts a run of the first saved plan on the given lot. */
export async function startRunOnScreen(page: Page, host: RunningHost, lot: string): Promise<void> {
  await page.goto(host.url);
  await page.getByRole('button', { name: 'Inspect', exact: true }).click();
  await expect(page.getByTestId('start-plan')).not.toHaveValue('');
  await page.getByTestId('start-lot').fill(lot);
  await page.getByTestId('start-lot-size').fill('800');
  await page.getByTestId('start-inspector').fill('Ana Ruiz');
  await page.getByTestId('start-submit').click();
  await expect(page.getByTestId('run-lot')).toHaveText(lot);
}
