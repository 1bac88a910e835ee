import type { Page } from '@playwright/test';
import { linearCountLiveState, type LinearCountLiveState, type LinearCountSpec } from '../../src-main/engine/index.js';
import { expect, test } from './support/browserHostFixture.js';
import { savePlanThroughChannel as savePlan, startRunOnScreen as startRun } from './support/runSteps.js';
import { percentText } from '../../src-renderer/src/lib/percent.js';
import { ruleText } from '../../src-renderer/src/lib/words.js';

// The NIST/SEMATECH e-Handbook §6.2.6 example plan: p0 1 %, p1 10 %, alpha 5 %, beta 10 %
// (inputs (from memory), NIST/SEMATECH e-Handbook §6.2.6 (first-hand)). Expected screen values are the engine's own linearCountLiveState,
// computed here on the same (n, total) as the run: the screen must show what the engine says.
const spec: LinearCountSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 };

/** The banner and the next numbers show exactly the engine's live state. */
async function expectEngineNumbers(page: Page, live: LinearCountLiveState): Promise<void> {
  const heading = { continue: 'Continue inspecting', accept: 'Accept the lot', reject: 'Reject the lot' }[live.decision];
  await expect(page.getByTestId('state-banner')).toHaveAttribute('data-decision', live.decision);
  await expect(page.getByTestId('state-heading')).toHaveText(heading);
  await expect(page.getByTestId('counted-n')).toHaveText(String(live.n));
  await expect(page.getByTestId('counted-total')).toHaveText(String(live.total));
  await expect(page.getByTestId('llr')).toHaveText(live.llr.toFixed(3));
  const open = live.decision === 'continue';
  if (!open) {
    // A decided run has nothing ahead: no odds, no expected remainder restating the decision.
    await expect(page.getByTestId('look-ahead-closed')).toBeVisible();
    await expect(page.getByTestId('p-accept-h0')).toHaveCount(0);
    return;
  }
  await expect(page.getByTestId('next-accept')).toHaveText(String(live.itemsToEarliestAccept));
  await expect(page.getByTestId('next-reject')).toHaveText(String(live.nonconformingToReject));
  // Probabilities are written for people: in percent, with the sign.
  await expect(page.getByTestId('p-accept-h0')).toHaveText(percentText(live.probabilityAcceptH0));
  await expect(page.getByTestId('p-accept-h1')).toHaveText(percentText(live.probabilityAcceptH1));
  await expect(page.getByTestId('asn-h0')).toHaveText(live.expectedRemainingH0.toFixed(1));
  await expect(page.getByTestId('asn-h1')).toHaveText(live.expectedRemainingH1.toFixed(1));
}

async function screenshotBothThemes(page: Page, name: string): Promise<void> {
  await page.getByRole('button', { name: 'Switch to dark theme' }).click();
  await page.screenshot({ path: `test/artifacts/${name}-dark.png` });
  await page.getByRole('button', { name: 'Switch to light theme' }).click();
  await page.screenshot({ path: `test/artifacts/${name}-light.png` });
}

test('a run from a saved plan takes results by keyboard and click, voids one, decides, and reloads exactly as it was', async ({ page, host }) => {
  await savePlan(page, host, spec, 'Incoming housings');
  await startRun(page, host, 'L-2041');
  await expectEngineNumbers(page, linearCountLiveState(spec, 0, 0));

  // A scan ends with Enter; the hyphen of the id is typed, not taken as a result.
  const itemId = page.getByTestId('item-id');
  await expect(itemId).toBeFocused();
  await page.keyboard.type('SN-0001');
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('scan-ended')).toBeVisible();
  await page.keyboard.press('NumpadAdd');
  for (let i = 0; i < 9; i++) await page.keyboard.press('NumpadAdd');
  await expect(page.getByTestId('entry-row')).toHaveCount(10);
  await expect(page.getByTestId('entry-row').last()).toContainText('SN-0001');

  // A mis-keyed nonconforming result by the number pad, voided with a reason.
  await page.keyboard.press('NumpadSubtract');
  await expect(page.getByTestId('entry-row')).toHaveCount(11);
  await expectEngineNumbers(page, linearCountLiveState(spec, 11, 1));
  await page.getByTestId('void-open').click();
  await page.getByTestId('void-confirm').click();
  await expect(page.getByTestId('void-missing')).toBeVisible();
  await page.getByTestId('void-reason').fill('keyed by mistake, item passed');
  await page.getByTestId('void-confirm').click();
  const voided = page.locator('[data-testid="entry-row"][data-voided="true"]');
  await expect(voided).toHaveCount(1);
  await expect(voided).toContainText('voided: keyed by mistake, item passed');
  await expect(voided.locator('.struck').first()).toHaveCSS('text-decoration-line', 'line-through');
  await expectEngineNumbers(page, linearCountLiveState(spec, 10, 0));

  // A nonconforming item by click, with its category; the click leaves the focus in the id field.
  await expect(itemId).toBeFocused();
  await page.keyboard.type('SN-0012');
  await page.getByTestId('category').fill('burr');
  await page.getByTestId('record-fail').click();
  await expect(page.getByTestId('entry-row')).toHaveCount(12);
  await expect(page.getByTestId('entry-row').first()).toContainText('burr');
  await expect(itemId).toBeFocused();
  const midRun = linearCountLiveState(spec, 11, 1);
  await expectEngineNumbers(page, midRun);
  await expect(page.getByTestId('evidence-counts').locator('canvas')).toHaveCount(1);
  await expect(page.getByTestId('evidence-llr').locator('canvas')).toHaveCount(1);
  await screenshotBothThemes(page, 'inspect-run-in-progress');

  // Passing items by keyboard, as fast as Playwright types, until the engine's earliest accept.
  await itemId.focus();
  const toAccept = midRun.itemsToEarliestAccept as number;
  for (let i = 0; i < toAccept; i++) await page.keyboard.press('NumpadAdd');
  const decided = linearCountLiveState(spec, 11 + toAccept, 1);
  expect(decided.decision).toBe('accept');
  await expect(page.getByTestId('decided')).toBeVisible();
  await expect(page.getByTestId('entry-row')).toHaveCount(12 + toAccept);
  await expect(page.getByTestId('entry-pending')).toHaveCount(0);
  await expectEngineNumbers(page, decided);
  // The engine's rule, written with the proper sign (≤) rather than ASCII.
  await expect(page.getByTestId('state-rule')).toContainText(ruleText(decided.rule));
  await expect(page.getByTestId('state-rule')).not.toContainText('<=');
  const logBefore = await page.getByTestId('entry-log').innerText();
  const bannerBefore = await page.getByTestId('state-banner').innerText();

  await page.reload();
  await expect(page.getByTestId('run-lot')).toHaveText('L-2041');
  await expectEngineNumbers(page, decided);
  expect(await page.getByTestId('entry-log').innerText()).toBe(logBefore);
  expect(await page.getByTestId('state-banner').innerText()).toBe(bannerBefore);
  await expect(page.locator('[data-testid="entry-row"][data-voided="true"]')).toHaveCount(1);
  await screenshotBothThemes(page, 'inspect-run-decided');

  // The decided run leads straight to its estimate with the interval and its decision record.
  await page.getByTestId('open-record').click();
  await expect(page.getByTestId('record-view')).toBeVisible();
  await expect(page.getByTestId('record-estimate')).toContainText('interval');
  await expect(page.getByTestId('record-estimate')).toContainText('Whitehead');
});

test('more entries after the decision need a recorded reason', async ({ page, host }) => {
  await savePlan(page, host, spec, 'Incoming housings');
  await startRun(page, host, 'L-2042');
  await page.keyboard.press('NumpadSubtract');
  await page.keyboard.press('NumpadSubtract');
  const rejected = linearCountLiveState(spec, 2, 2);
  expect(rejected.decision).toBe('reject');
  await expectEngineNumbers(page, rejected);
  await expect(page.getByTestId('record-pass')).toHaveCount(0);
  await page.getByTestId('override-confirm').click();
  await expect(page.getByTestId('override-missing')).toBeVisible();
  await page.getByTestId('override-reason').fill('customer asked for the whole lot to be sorted');
  await page.getByTestId('override-confirm').click();
  await page.getByTestId('record-pass').click();
  await expect(page.getByTestId('entry-row')).toHaveCount(3);
  await expect(page.getByTestId('decided')).toBeVisible();
  await expectEngineNumbers(page, linearCountLiveState(spec, 3, 2));
});

test('an unfinished run reopens from the list where it stopped', async ({ page, host }) => {
  await savePlan(page, host, spec, 'Incoming housings');
  await startRun(page, host, 'L-2043');
  for (let i = 0; i < 5; i++) await page.keyboard.press('NumpadAdd');
  await expect(page.getByTestId('entry-row')).toHaveCount(5);
  await page.getByTestId('leave-run').click();
  await expect(page.locator('[data-testid="open-run"]', { hasText: 'L-2043' })).toBeVisible();
  await page.screenshot({ path: 'test/artifacts/inspect-start-and-runs-light.png' });
  await page.locator('[data-testid="open-run"]', { hasText: 'L-2043' }).click();
  await expectEngineNumbers(page, linearCountLiveState(spec, 5, 0));
  // On the main keys, minus is part of an id, also after the scan has ended; the number pad's minus records.
  await page.keyboard.type('SN-9');
  await page.keyboard.press('Enter');
  await page.keyboard.press('Minus');
  await expect(page.getByTestId('item-id')).toHaveValue('SN-9-');
  await page.getByTestId('item-id').fill('SN-9');
  await page.keyboard.press('NumpadSubtract');
  const sixth = page.locator('[data-testid="entry-row"][data-seq="6"]');
  await expect(sixth).toContainText('SN-9');
  await expect(sixth).toContainText('nonconforming');
  await expectEngineNumbers(page, linearCountLiveState(spec, 6, 1));
});

test('bad input gets a message naming what is wrong and keeps what was typed', async ({ page, host }) => {
  await savePlan(page, host, spec, 'Incoming housings');
  await page.goto(host.url);
  await page.getByRole('button', { name: 'Inspect', exact: true }).click();
  await page.getByTestId('start-inspector').fill('Ana Ruiz');
  await page.getByTestId('start-lot').fill('L-9');
  await page.getByTestId('start-lot-size').fill('12.5');
  await page.getByTestId('start-submit').click();
  await expect(page.getByTestId('start-problem')).toContainText('whole number');
  await expect(page.getByTestId('start-lot-size')).toHaveAttribute('aria-invalid', 'true');
  await expect(page.getByTestId('start-lot')).toHaveValue('L-9');
  await expect(page.getByTestId('start-inspector')).toHaveValue('Ana Ruiz');
});

test('a count plan takes a number of nonconformities per unit', async ({ page, host }) => {
  const countSpec: LinearCountSpec = { model: 'count', lambda0: 0.1, lambda1: 0.5, alpha: 0.05, beta: 0.05 };
  await savePlan(page, host, countSpec, 'Paint defects per panel');
  await startRun(page, host, 'P-77');
  await page.getByTestId('count').fill('x2');
  await page.getByTestId('count').press('Enter');
  await expect(page.getByRole('alert')).toContainText('not a whole number');
  await expect(page.getByTestId('count')).toHaveValue('x2');
  await page.getByTestId('count').fill('2');
  await page.getByTestId('count').press('Enter');
  await page.keyboard.press('NumpadAdd');
  await expect(page.getByTestId('entry-row')).toHaveCount(2);
  await expectEngineNumbers(page, linearCountLiveState(countSpec, 2, 2));
});
