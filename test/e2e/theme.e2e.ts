import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { expect, test } from './support/browserHostFixture.js';

test("the theme follows the operating system under the 'system' setting, also when it changes", async ({ page, host }) => {
  await page.emulateMedia({ colorScheme: 'light' });
  await page.goto(host.url);
  await expect(page.locator('html')).toHaveAttribute('data-theme', 'light');
  await page.emulateMedia({ colorScheme: 'dark' });
  await expect(page.locator('html')).toHaveAttribute('data-theme', 'dark');
  await page.emulateMedia({ colorScheme: 'light' });
  await expect(page.locator('html')).toHaveAttribute('data-theme', 'light');
});

test('a theme picked with the switch is saved as the theme setting and kept after a reload and against the system', async ({ page, host }) => {
  await page.emulateMedia({ colorScheme: 'light' });
  await page.goto(host.url);
  await page.getByRole('button', { name: 'Switch to dark theme' }).click();
  await expect(page.locator('html')).toHaveAttribute('data-theme', 'dark');
  await expect
    .poll(async () => JSON.parse(await readFile(join(host.dataDirectory, 'settings.json'), 'utf8').catch(() => '{}')).theme)
    .toBe('dark');
  // A fresh page with nothing cached still opens dark: the setting, not the browser, holds the choice.
  await page.evaluate(() => localStorage.clear());
  await page.reload();
  await expect(page.locator('html')).toHaveAttribute('data-theme', 'dark');
  await page.emulateMedia({ colorScheme: 'light' });
  await expect(page.locator('html')).toHaveAttribute('data-theme', 'dark');
});
