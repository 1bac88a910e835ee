import type { APIRequestContext, Page } from '@playwright/test';
import { expect, test, type RunningHost } from './support/browserHostFixture.js';

// The three models beyond pass/fail and count, end to end: designed in the Plan place, saved,
// run in the Inspect place by keyboard to a decision. Expected figures are not typed in here:
// they are asked of the host's own plan.design and inspection.open channels, i.e. the engine.
// Plan inputs are common practice, no source (a shaft diameter, an MTBF demonstration with
// discrimination ratio 2, three grades of a visual check).

const measurement = { model: 'measurement', mu0: 10, mu1: 10.05, sigma: 0.04, alpha: 0.05, beta: 0.1, truncation: null, overshootCorrection: false, unit: 'mm' };
const lifetime = { model: 'lifetime', theta0: 1000, theta1: 500, alpha: 0.1, beta: 0.1, maxTime: null, maxFailures: null, unit: 'hours' };
const graded = { model: 'graded', classes: ['conforming', 'minor', 'major'], p0: [0.95, 0.04, 0.01], p1: [0.85, 0.1, 0.05], alpha: 0.05, beta: 0.1, truncation: null };

async function channel<Value>(request: APIRequestContext, host: RunningHost, name: string, data: object): Promise<Value> {
  const response = await request.post(`${host.origin}/api/${name}`, { headers: { authorization: `Bearer ${host.token}` }, data });
  const result = await response.json();
  expect(result.ok, JSON.stringify(result)).toBe(true);
  return result.value as Value;
}

async function setRisks(page: Page, alpha: string, beta: string): Promise<void> {
  await page.getByLabel("Producer's risk α").fill(alpha);
  await page.getByLabel("Consumer's risk β").fill(beta);
}

async function savePlan(page: Page, name: string, source: string): Promise<void> {
  await page.getByLabel('Plan name').fill(name);
  await page.getByLabel('Source', { exact: true }).selectOption('new');
  await page.getByLabel('Source name').fill(source);
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  await expect(page.getByTestId('save-status')).toContainText(`Saved “${name}” version 1 under ${source}`);
}

async function startRun(page: Page, lot: string): Promise<void> {
  await page.getByRole('button', { name: 'Inspect', exact: true }).click();
  await expect(page.getByTestId('start-plan')).not.toHaveValue('');
  await page.getByTestId('start-lot').fill(lot);
  await page.getByTestId('start-inspector').fill('Ana Ruiz');
  await page.getByTestId('start-submit').click();
  await expect(page.getByTestId('run-lot')).toHaveText(lot);
}

/** The banner shows the decision of the run as the main side holds it. */
async function expectBannerAsRunView(page: Page, request: APIRequestContext, host: RunningHost, decision: 'accept' | 'reject'): Promise<void> {
  const runId = (await page.getByTestId('run-screen').getAttribute('data-run-id'))!;
  const view = await channel<{ state: { decision: string }; run: { status: string; decision: string } }>(request, host, 'inspection.open', { runId });
  expect(view.state.decision).toBe(decision);
  expect(view.run.status).toBe('closed');
  await expect(page.getByTestId('state-banner')).toHaveAttribute('data-decision', view.state.decision);
  await expect(page.getByTestId('state-heading')).toHaveText(decision === 'accept' ? 'Accept the lot' : 'Reject the lot');
}

/** A screenshot of the Plan place whole (it scrolls inside its own frame, so the window is made tall enough), or of a run as it is. */
async function shoot(page: Page, name: string): Promise<void> {
  const plan = name.endsWith('-plan');
  if (plan) await page.setViewportSize({ width: 1280, height: 1900 });
  await page.screenshot({ path: `test/artifacts/models-${name}.png` });
  if (plan) await page.setViewportSize({ width: 1280, height: 800 });
}

async function expectChartsDrawn(page: Page): Promise<void> {
  for (const id of ['oc', 'asn', 'limits']) await expect(page.getByTestId(`chart-${id}`).locator('canvas')).toBeVisible();
}

test('a measurement plan is designed, saved, and a run rejects on keyed values after a guarded slip', async ({ page, host, request }) => {
  const design = await channel<{ design: { exact: { asnH0: number }; single: { n: number } } }>(request, host, 'plan.design', { spec: measurement });
  await page.goto(host.url);
  await page.getByLabel('Measurements (known σ)').check();
  await page.getByLabel('Acceptable mean μ0').fill('10');
  await page.getByLabel('Rejectable mean μ1').fill('10.05');
  await page.getByLabel('Standard deviation σ (known)').fill('0.04');
  await page.getByTestId('measurement-unit').fill('mm');
  await setRisks(page, '5', '10');
  await expect(page.getByTestId('exact-asn-h0')).toHaveText(design.design.exact.asnH0.toFixed(1));
  await expect(page.getByTestId('single-n')).toHaveText(String(design.design.single.n));
  await expectChartsDrawn(page);
  await shoot(page, 'measurement-plan');
  await savePlan(page, 'Shaft, diameter', 'Westfield Turning');

  await startRun(page, 'M-100');
  const value = page.getByTestId('measured-value');
  await expect(value).toBeFocused();
  // 12 mm is 50 σ from both means: it asks instead of recording; Esc and a corrected value go on.
  await page.keyboard.type('12');
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('value-doubt')).toBeVisible();
  await expect(page.getByTestId('entry-row')).toHaveCount(0);
  await page.keyboard.press('Escape');
  await value.fill('');
  for (const reading of ['10.06', '10.06', '10.06']) {
    await page.keyboard.type(reading);
    await page.keyboard.press('Enter');
  }
  await expect(page.getByTestId('entry-row')).toHaveCount(3);
  await expectBannerAsRunView(page, request, host, 'reject');
  await shoot(page, 'measurement-run');
});

test('a time-to-failure plan shows its test time in θ1 multiples, and a run with one failure accepts on time readings', async ({ page, host, request }) => {
  const design = await channel<{ design: { exact: { expectedTimeH0: number } } }>(request, host, 'plan.design', { spec: lifetime });
  await page.goto(host.url);
  await page.getByLabel('Time to failure').check();
  await page.getByLabel('Acceptable MTBF θ0').fill('1000');
  await page.getByLabel('Rejectable MTBF θ1').fill('500');
  await setRisks(page, '10', '10');
  await expect(page.getByTestId('discrimination-ratio')).toHaveText('2.00');
  await expect(page.getByTestId('exact-time-h0')).toHaveText(design.design.exact.expectedTimeH0.toFixed(0));
  await expect(page.getByTestId('sentence-h0')).toContainText(`takes on average ${(design.design.exact.expectedTimeH0 / 500).toFixed(1)} θ1`);
  await expectChartsDrawn(page);
  await shoot(page, 'lifetime-plan');
  await savePlan(page, 'Pump, endurance', 'Eastgate Hydraulics');

  // Exported and imported back over an edited form, the plan returns with every field.
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Export saved version…' }).click()]);
  const exportedPath = test.info().outputPath('lifetime.json');
  await download.saveAs(exportedPath);
  await page.getByLabel('Acceptable MTBF θ0').fill('1500');
  await page.getByLabel('Pass/fail items').check();
  await page.getByLabel('Plan file to import').setInputFiles(exportedPath);
  await expect(page.getByTestId('file-status')).toContainText('Imported “Pump, endurance”');
  await expect(page.getByLabel('Time to failure')).toBeChecked();
  await expect(page.getByLabel('Acceptable MTBF θ0')).toHaveValue('1000');
  await expect(page.getByTestId('exact-time-h0')).toHaveText(design.design.exact.expectedTimeH0.toFixed(0));

  await startRun(page, 'T-7');
  await expect(page.getByTestId('test-time')).toBeFocused();
  await page.keyboard.type('400');
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('time-so-far')).toHaveText('400');
  await page.keyboard.type('650');
  await page.keyboard.press('f');
  await expect(page.getByTestId('counted-total')).toHaveText('1');
  await expect(page.getByTestId('state-banner')).toHaveAttribute('data-decision', 'continue');
  await page.keyboard.type('3000');
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('entry-row')).toHaveCount(3);
  await expectBannerAsRunView(page, request, host, 'accept');
  await shoot(page, 'lifetime-run');
});

test('a graded plan checks its shares, and a run graded by the digit keys rejects', async ({ page, host, request }) => {
  const design = await channel<{ design: { exact: { asnH0: number } | null; simulated: { h0: { asn: number } } | null } }>(request, host, 'plan.design', { spec: graded, curvePoints: 31 });
  await page.goto(host.url);
  await page.getByLabel('Graded items').check();
  await setRisks(page, '5', '10');
  // A column off 100 % says so in words and shows no figures.
  await page.getByLabel('Share of class 1 at acceptable quality').fill('90');
  await expect(page.getByTestId('plan-problem')).toContainText('add up to 95 %; they must add up to 100 %');
  await page.getByLabel('Share of class 1 at acceptable quality').fill('95');
  await expect(page.getByTestId('plan-problem')).toHaveCount(0);
  const asnH0 = design.design.exact?.asnH0 ?? design.design.simulated!.h0.asn;
  // The exact recursion over class counts takes a few seconds (engine cost, not the screen's).
  await expect(page.getByTestId('sentence-h0')).toContainText(`on average ${asnH0.toFixed(1)} items`, { timeout: 20_000 });
  await expectChartsDrawn(page);
  await shoot(page, 'graded-plan');
  await savePlan(page, 'Panel, visual check', 'Northside Paint');

  await startRun(page, 'G-12');
  await expect(page.getByTestId('record-grade-3')).toContainText('major');
  for (const key of ['1', '1', '2', '3', '1', '3']) {
    await page.keyboard.press(key);
  }
  await expect(page.getByTestId('entry-row')).toHaveCount(6);
  await expect(page.getByTestId('entry-row').first()).toContainText('major');
  await expectBannerAsRunView(page, request, host, 'reject');
  await shoot(page, 'graded-run');
});
