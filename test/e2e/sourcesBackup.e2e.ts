import { readFile, readdir, rm, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { expect, test } from './support/browserHostFixture.js';

test.use({ hostData: 'demo' });

test('settings are saved; a backup downloads, a damaged copy is refused with the data untouched, the good one restores', async ({ page, host }, testInfo) => {
  await page.goto(host.url);
  await page.getByRole('button', { name: 'Sources', exact: true }).click();
  await expect(page.getByTestId('settings-organisation')).toHaveValue('Demo organisation (invented)');
  await page.getByTestId('settings-site').fill('Hall B (invented)');
  await page.getByTestId('settings-confidence').selectOption({ label: '95 %' });
  await page.getByTestId('settings-save').click();
  await expect(page.getByTestId('settings-status')).toHaveText('Settings saved.');

  const downloading = page.waitForEvent('download');
  await page.getByTestId('backup').click();
  const download = await downloading;
  expect(download.suggestedFilename()).toMatch(/^tallyline-backup-\d{8}-\d{4}\.tallyline-archive$/);
  const archive = testInfo.outputPath('backup.tallyline-archive');
  await download.saveAs(archive);

  await page.getByTestId('new-source-name').fill('Made after the backup (invented)');
  await page.getByTestId('add-source').click();
  await expect(page.getByTestId('source-item')).toHaveCount(4);

  const damaged = testInfo.outputPath('damaged.tallyline-archive');
  const bytes = await readFile(archive);
  await writeFile(damaged, bytes.subarray(0, bytes.length - 40));
  await page.getByTestId('restore-file').setInputFiles(damaged);
  await page.getByTestId('restore').click();
  await page.getByTestId('restore-confirmed').click();
  await expect(page.getByTestId('settings-problem')).toContainText('The archive was refused');
  await expect(page.getByTestId('settings-problem')).toContainText('the current data is untouched');
  await expect(page.getByTestId('source-item')).toHaveCount(4);
  await page.getByTestId('settings').screenshot({ path: 'test/artifacts/sources-restore-refused.png' });

  // Restore asks first, naming what it replaces and where the old data goes; Cancel changes nothing.
  await page.getByTestId('restore-file').setInputFiles(archive);
  await page.getByTestId('restore').click();
  const confirm = page.getByTestId('restore-confirm');
  await expect(confirm).toContainText(`Replace all data in ${host.dataDirectory} — every source, plan, run and these settings — with the archive backup.tallyline-archive?`);
  await expect(confirm).toContainText(`the data now in use is kept beside it as ${host.dataDirectory}.before-restore-<date and time>`);
  await page.getByTestId('settings').screenshot({ path: 'test/artifacts/sources-restore-confirm.png' });
  await page.getByTestId('restore-cancel').click();
  await expect(confirm).toHaveCount(0);
  await expect(page.getByTestId('source-item')).toHaveCount(4);
  await page.getByTestId('restore').click();
  await page.getByTestId('restore-confirmed').click();
  await expect(page.getByTestId('settings-status')).toContainText('Restored 3 sources, 3 plans and 13 runs');
  await expect(page.getByTestId('source-item')).toHaveCount(3);
  await expect(page.getByTestId('settings-site')).toHaveValue('Hall B (invented)');

  // The replaced data folder was kept beside the data folder, dated; the fixture removes only the data folder.
  const parent = path.dirname(host.dataDirectory);
  const kept = (await readdir(parent)).filter((name) => name.startsWith(`${path.basename(host.dataDirectory)}.before-restore-`));
  expect(kept).toHaveLength(1);
  await rm(path.join(parent, kept[0]), { recursive: true, force: true });
});
