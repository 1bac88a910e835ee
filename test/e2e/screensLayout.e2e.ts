/**
 * Every place at three window sizes, light and dark, with the invented demo data: no element runs
 * out of the window or out of its card, no button's text spills out of it, and a screenshot of each
 * is kept for a person to look at (test/artifacts/screens/).
 */
import { expect, test } from './support/browserHostFixture.js';
import { overflowing, placeViews, showView, windowSizes } from './support/placeViews.js';

test.use({ hostData: 'demo' });

for (const size of windowSizes) {
  test(`at ${size.width}×${size.height}, light and dark, nothing runs out of the window or its card`, async ({ page, host }) => {
    test.setTimeout(180_000);
    await page.setViewportSize(size);
    const problems: string[] = [];
    for (const theme of ['light', 'dark'] as const) {
      for (const view of placeViews) {
        await showView(page, host, view, theme);
        await page.screenshot({ path: `test/artifacts/screens/${view.name}-${size.width}x${size.height}-${theme}.png` });
        for (const overflow of await overflowing(page)) problems.push(`${view.name} ${theme}: ${overflow}`);
      }
    }
    expect(problems).toEqual([]);
  });
}
