import type { PlanSpec } from '../../src-main/engine/index.js';
import { expect, test } from './support/browserHostFixture.js';
import { savePlanThroughChannel, startRunOnScreen } from './support/runSteps.js';

// NIST/SEMATECH e-Handbook §6.2.6 example plan (p0 1 %, p1 10 %, alpha 5 %, beta 10 %; from memory):
// four passes and one nonconforming item leave it undecided.
const spec: PlanSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 };

test('items are numbered 1..n on screen, a voided item keeps its number, and the journal entry shows only on hover', async ({ page, host }) => {
  await savePlanThroughChannel(page, host, spec, 'Incoming housings');
  await startRunOnScreen(page, host, 'N-1');
  for (let i = 0; i < 3; i++) await page.keyboard.press('NumpadAdd');
  await page.keyboard.press('NumpadSubtract');
  const rows = page.getByTestId('entry-row');
  await expect(rows).toHaveCount(4);
  await expect(page.getByTestId('void-open')).toHaveText('Void item 4…');
  await page.getByTestId('void-open').click();
  await expect(page.getByText('Why is item 4 voided?')).toBeVisible();
  await page.getByTestId('void-reason').fill('keyed by mistake');
  await page.getByTestId('void-confirm').click();
  await expect(page.locator('[data-testid="entry-row"][data-voided="true"]')).toHaveCount(1);
  await page.getByTestId('item-id').focus();
  await page.keyboard.press('NumpadAdd');
  await expect(rows).toHaveCount(5);
  // Newest first: the item after the void is item 5, not the journal's entry 6.
  await expect(page.getByTestId('item-number')).toHaveText(['5', '4', '3', '2', '1']);
  await expect(rows.nth(1)).toHaveAttribute('data-voided', 'true');
  await expect(page.getByTestId('item-number').first()).toHaveAttribute('title', 'journal entry 6');
  await expect(page.getByTestId('void-open')).toHaveText('Void item 5…');
});
