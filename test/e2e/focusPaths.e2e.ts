import type { PlanSpec } from '../../src-main/engine/index.js';
import { expect, test } from './support/browserHostFixture.js';
import { savePlanThroughChannel, startRunOnScreen } from './support/runSteps.js';

// Rejects at the third nonconforming item in a row: Wald's reject line for p0 1 %, p1 50 %,
// alpha = beta = 5 % is crossed at the second and third item (common practice, no source).
const quickSpec: PlanSpec = { model: 'passfail', p0: 0.01, p1: 0.5, alpha: 0.05, beta: 0.05 };

test('the first Tab reaches a skip link that moves the focus past the navigation to the place', async ({ page, host }) => {
  await page.goto(host.url);
  await page.keyboard.press('Tab');
  const skip = page.getByTestId('skip-link');
  await expect(skip).toBeFocused();
  await expect(skip).toBeInViewport();
  await page.keyboard.press('Enter');
  await expect(page.getByRole('heading', { level: 1, name: 'Plan a sequential test' })).toBeFocused();
  // The address still names the place: the skip link does not take over the fragment.
  expect(new URL(page.url()).hash).not.toContain('place');
});

test('choosing a place by keyboard puts the focus on that place’s heading, out of the navigation', async ({ page, host }) => {
  await page.goto(host.url);
  for (const [place, heading] of [['Records', 'Records'], ['Sources', 'Sources'], ['Inspect', 'Inspect'], ['Plan', 'Plan a sequential test']] as const) {
    await page.getByRole('button', { name: place, exact: true }).focus();
    await page.keyboard.press('Enter');
    await expect(page.getByRole('heading', { level: 1, name: heading })).toBeFocused();
  }
});

test('“All runs” hands the focus to the line of the run just left, not to the page', async ({ page, host }) => {
  await savePlanThroughChannel(page, host, quickSpec, 'Quick check');
  await startRunOnScreen(page, host, 'FOCUS-1');
  await page.getByTestId('leave-run').focus();
  await page.keyboard.press('Enter');
  const line = page.locator('[data-testid="open-run"]', { hasText: 'FOCUS-1' });
  await expect(line).toBeFocused();
  // And back: opening it by keyboard lands on the run, not on the page.
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('run-lot')).toHaveText('FOCUS-1');
  await expect(page.locator('body')).not.toBeFocused();
});

test('when a decision closes the entry panel the focus moves to the decision, not to the page', async ({ page, host }) => {
  await savePlanThroughChannel(page, host, quickSpec, 'Quick check');
  await startRunOnScreen(page, host, 'FOCUS-2');
  await page.getByTestId('item-id').focus();
  for (let i = 0; i < 3; i++) await page.keyboard.press('NumpadSubtract');
  await expect(page.getByTestId('decided')).toBeVisible();
  await expect(page.getByTestId('decided')).toBeFocused();
});
