import { expect, test } from './support/browserHostFixture.js';

test('what is typed on Plan is kept across places and a reload', async ({ page, host }) => {
  await page.goto(host.url);
  await page.getByLabel('Rejectable quality p1').fill('7');
  await page.getByLabel('Plan name').fill('Bracket, hole position');
  await page.getByLabel('Time to failure').check();
  await page.getByLabel('Acceptable MTBF θ0').fill('1200');

  await page.getByRole('button', { name: 'Sources', exact: true }).click();
  await page.getByRole('button', { name: 'Plan', exact: true }).click();
  await expect(page.getByLabel('Time to failure')).toBeChecked();
  await expect(page.getByLabel('Acceptable MTBF θ0')).toHaveValue('1200');
  await expect(page.getByLabel('Plan name')).toHaveValue('Bracket, hole position');

  await page.reload();
  await expect(page.getByLabel('Time to failure')).toBeChecked();
  await expect(page.getByLabel('Acceptable MTBF θ0')).toHaveValue('1200');
  await page.getByLabel('Pass/fail items').check();
  await expect(page.getByLabel('Rejectable quality p1')).toHaveValue('7');
});

test('after a reload the draft still says which saved plan it differs from', async ({ page, host }) => {
  await page.goto(host.url);
  await page.getByLabel('Plan name').fill('Housing, bore');
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  await expect(page.getByTestId('draft-of')).toHaveText('The inputs are saved “Housing, bore” v1.');
  await page.getByLabel('Rejectable quality p1').fill('8');
  await page.getByRole('button', { name: 'Records', exact: true }).click();
  await page.getByRole('button', { name: 'Plan', exact: true }).click();
  await expect(page.getByTestId('draft-of')).toHaveText('The inputs differ from saved “Housing, bore” v1; saving keeps that version as it is.');
  await page.reload();
  await expect(page.getByLabel('Rejectable quality p1')).toHaveValue('8');
  await expect(page.getByTestId('draft-of')).toHaveText('The inputs differ from saved “Housing, bore” v1; saving keeps that version as it is.');
  await expect(page.getByRole('button', { name: 'Save as version 2' })).toBeVisible();
});
