import type { PlanSpec } from '../../src-main/engine/index.js';
import { expect, test } from './support/browserHostFixture.js';
import { savePlanThroughChannel, startRunOnScreen } from './support/runSteps.js';

// The computer's locale decides how dates read; en-GB writes a medium date as "5 Dec 2026" (common practice, no source).
test.use({ locale: 'en-GB', timezoneId: 'UTC' });

const ukDateTime = /\b\d{1,2} [A-Z][a-z]{2,3} \d{4}, \d{2}:\d{2}\b/;

// The NIST/SEMATECH e-Handbook §6.2.6 example plan (first-hand): one conforming item decides nothing.
const nistSpec: PlanSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 };

test('dates read the same in every place, in the computer’s locale, and a count of one takes the singular', async ({ page, host }) => {
  await savePlanThroughChannel(page, host, nistSpec, 'Housing bore');
  await startRunOnScreen(page, host, 'DATES-1');
  await expect(page.getByTestId('run-screen').locator('.facts').first()).toContainText(ukDateTime);
  await page.keyboard.press('NumpadAdd');
  await expect(page.getByTestId('state-rule')).toHaveText('No limit crossed after 1 item.');

  await page.getByTestId('leave-run').click();
  await expect(page.locator('[data-testid="open-run"]', { hasText: 'DATES-1' })).toContainText(ukDateTime);

  await page.getByRole('button', { name: 'Records', exact: true }).click();
  const started = page.getByTestId('history-row').first().locator('time').first();
  await expect(started).toHaveText(ukDateTime);
  // Files and machine-readable attributes keep ISO 8601.
  expect(await started.getAttribute('datetime')).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/);
  await page.getByTestId('history-row').first().getByRole('button').first().click();
  await expect(page.getByTestId('record-view').locator('.facts')).toContainText(ukDateTime);
  // No place writes the ISO form or a numeric short date to people.
  await expect(page.getByTestId('record-view')).not.toContainText(/\d{4}-\d{2}-\d{2} \d{2}:\d{2}|\d{1,2}\/\d{1,2}\/\d{2,4}/);
});
