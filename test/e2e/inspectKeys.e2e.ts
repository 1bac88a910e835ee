import type { Page } from '@playwright/test';
import type { PlanSpec } from '../../src-main/engine/index.js';
import { expect, test } from './support/browserHostFixture.js';
import { savePlanThroughChannel, startRunOnScreen } from './support/runSteps.js';

// A plan that needs many nonconforming items before it rejects (about 24 at the start, by Wald's
// limits for p0 5 %, p1 6 %, alpha = beta = 1 %; common practice, no source), so one run can take
// every key in every focus state without deciding.
const slowSpec: PlanSpec = { model: 'passfail', p0: 0.05, p1: 0.06, alpha: 0.01, beta: 0.01 };

type Focus = 'no field' | 'Item id, empty' | 'Item id, with text' | 'Item id, scan ended' | 'Category' | 'Note' | 'the Nonconforming button';
type Key = 'Minus' | 'Shift+Equal' | 'NumpadSubtract' | 'NumpadAdd' | 'Enter';

/** What each key does in each focus state, exactly as the hint under the result buttons says. */
const expected: Record<Focus, Record<Key, 'pass' | 'nonconforming' | 'types' | 'nothing'>> = {
  'no field': { Minus: 'nonconforming', 'Shift+Equal': 'pass', NumpadSubtract: 'nonconforming', NumpadAdd: 'pass', Enter: 'nothing' },
  'Item id, empty': { Minus: 'types', 'Shift+Equal': 'types', NumpadSubtract: 'nonconforming', NumpadAdd: 'pass', Enter: 'nothing' },
  'Item id, with text': { Minus: 'types', 'Shift+Equal': 'types', NumpadSubtract: 'nonconforming', NumpadAdd: 'pass', Enter: 'nothing' },
  'Item id, scan ended': { Minus: 'types', 'Shift+Equal': 'types', NumpadSubtract: 'nonconforming', NumpadAdd: 'pass', Enter: 'nothing' },
  // Enter in Category or Note records the nonconforming item they describe (the fieldset says so).
  Category: { Minus: 'types', 'Shift+Equal': 'types', NumpadSubtract: 'types', NumpadAdd: 'types', Enter: 'nonconforming' },
  Note: { Minus: 'types', 'Shift+Equal': 'types', NumpadSubtract: 'types', NumpadAdd: 'types', Enter: 'nonconforming' },
  'the Nonconforming button': { Minus: 'nonconforming', 'Shift+Equal': 'pass', NumpadSubtract: 'nonconforming', NumpadAdd: 'pass', Enter: 'nonconforming' },
};

async function putFocus(page: Page, focus: Focus): Promise<void> {
  const itemId = page.getByTestId('item-id');
  await itemId.fill('');
  await page.getByTestId('category').fill('');
  await page.getByTestId('note').fill('');
  if (focus === 'no field') {
    await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
    await expect(page.locator('body')).toBeFocused();
  } else if (focus === 'Item id, empty') {
    await itemId.focus();
  } else if (focus === 'Item id, with text') {
    await itemId.focus();
    await page.keyboard.type('SN');
  } else if (focus === 'Item id, scan ended') {
    await itemId.focus();
    await page.keyboard.type('SN');
    await page.keyboard.press('Enter');
    await expect(page.getByTestId('scan-ended')).toBeVisible();
  } else if (focus === 'Category') {
    await page.getByTestId('category').focus();
  } else if (focus === 'Note') {
    await page.getByTestId('note').focus();
  } else {
    await page.getByTestId('record-fail').focus();
  }
}

test('each result key does what the hint says in each focus state, and nothing else', async ({ page, host }) => {
  test.setTimeout(120_000);
  await savePlanThroughChannel(page, host, slowSpec, 'Slow plan');
  await startRunOnScreen(page, host, 'K-1');
  const hint = page.getByTestId('keys-hint');
  await expect(hint).toHaveText(
    "Number pad + and − record a result anywhere except in Category and Note. The main keyboard's + and - record only when no field has the focus; in Item id they type.",
  );
  const rows = page.getByTestId('entry-row');
  let count = 0;
  for (const [focus, keys] of Object.entries(expected) as [Focus, Record<Key, string>][]) {
    for (const [key, outcome] of Object.entries(keys) as [Key, string][]) {
      await putFocus(page, focus);
      const fieldId = await page.evaluate(() => (document.activeElement instanceof HTMLInputElement ? document.activeElement.dataset.testid : undefined));
      const field = page.getByTestId(fieldId ?? 'no-field');
      const before = fieldId ? await field.inputValue() : '';
      await page.keyboard.press(key);
      const what = `${key} with the focus in ${focus}`;
      if (outcome === 'pass' || outcome === 'nonconforming') {
        count += 1;
        await expect(rows, what).toHaveCount(count);
        // The log writes a passed item as conforming, the glossary's word for it.
        await expect(rows.first().locator('td.result'), what).toHaveText(outcome === 'pass' ? 'conforming' : 'nonconforming');
      } else {
        if (outcome === 'types') {
          const typed = { Minus: '-', 'Shift+Equal': '+', NumpadSubtract: '-', NumpadAdd: '+', Enter: '' }[key];
          await expect(field, what).toHaveValue(before + typed);
        }
        // Give a wrongly taken result time to reach the log before looking.
        await page.waitForTimeout(300);
        await expect(rows, what).toHaveCount(count);
        await expect(page.getByTestId('entry-pending'), what).toHaveCount(0);
      }
    }
  }
});
