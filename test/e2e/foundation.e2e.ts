import { expect, test } from './support/browserHostFixture.js';

// These tests only read: they share one host (and its empty data folder).
test.use({ hostSharing: 'file' });

// Check values: NIST/SEMATECH e-Handbook of Statistical Methods §6.2.6 "What is a Sequential
// Sampling Plan?" — p1 = 0.01, alpha = 0.05, p2 = 0.10, beta = 0.10 gives h1 = 0.939,
// h2 = 1.205, s = 0.0397 (inputs (from memory), printed results reproduced by computation;
// NIST/SEMATECH e-Handbook §6.2.6 (first-hand)). KL values: Wald 1947 OC/ASN formulas (computed independently).

test('the plan place shows Wald limits computed on the main side for the NIST example', async ({ page, host }) => {
  await page.goto(host.url);
  await page.getByLabel('Acceptable quality p0').fill('1');
  await page.getByLabel('Rejectable quality p1').fill('10');
  await page.getByLabel("Producer's risk α").fill('5');
  await page.getByLabel("Consumer's risk β").fill('10');
  await expect(page.getByTestId('h1')).toHaveText('0.939');
  await expect(page.getByTestId('h2')).toHaveText('1.205');
  await expect(page.getByTestId('slope')).toHaveText('0.0397');
  await expect(page.getByTestId('kl-h0h1')).toHaveText('0.07133 nats');
  await expect(page.getByTestId('kl-h1h0')).toHaveText('0.14448 nats');
  await page.screenshot({ path: 'test/artifacts/foundation-plan-slice.png', fullPage: true });
});

test('an impossible pair of quality levels shows the engine message and keeps the typed values', async ({ page, host }) => {
  await page.goto(host.url);
  await page.getByLabel('Rejectable quality p1').fill('0.5');
  await expect(page.getByTestId('plan-problem')).toContainText('p1');
  await expect(page.getByTestId('plan-problem')).toContainText('greater');
  await expect(page.getByTestId('plan-problem')).toContainText('p1 = 0.5 %'); // in the percent the engineer typed
  await expect(page.getByLabel('Rejectable quality p1')).toHaveValue('0.5');
  await expect(page.getByLabel('Rejectable quality p1')).toHaveAttribute('aria-invalid', 'true');
  await expect(page.getByTestId('h1')).toHaveText('–');
  await page.screenshot({ path: 'test/artifacts/foundation-plan-invalid.png', fullPage: true });
});

test('risks that add up to one or more are refused with a message saying what is allowed', async ({ page, host }) => {
  await page.goto(host.url);
  await page.getByLabel("Producer's risk α").fill('60');
  await page.getByLabel("Consumer's risk β").fill('50');
  await expect(page.getByTestId('plan-problem')).toContainText('alpha + beta');
});

test('a request to a channel without the token is refused with 401', async ({ request, host }) => {
  const response = await request.post(`${host.origin}/api/plan.limits`, { data: { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 } });
  expect(response.status()).toBe(401);
});

test('a reload keeps the token and the place', async ({ page, host }) => {
  await page.goto(host.url);
  await expect(page.getByTestId('h1')).not.toHaveText('–');
  await page.reload();
  await expect(page.getByTestId('h1')).toHaveText('0.939');
});
