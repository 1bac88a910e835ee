/**
 * Every place, light and dark, mid-run and decided, checked by axe-core (WCAG 2 A/AA rules and
 * best practices): no violation of any impact is allowed. One window size: the rules that depend on
 * the size (a region that scrolls) are met at the smallest size by the same markup.
 */
import AxeBuilder from '@axe-core/playwright';
import { expect, test } from './support/browserHostFixture.js';
import { placeViews, showView } from './support/placeViews.js';

test.use({ hostData: 'demo' });

for (const theme of ['light', 'dark'] as const) {
  test(`axe-core finds no violation on any place in the ${theme} theme`, async ({ page, host }) => {
    test.setTimeout(180_000);
    await page.setViewportSize({ width: 1024, height: 700 });
    const problems: string[] = [];
    for (const view of placeViews) {
      await showView(page, host, view, theme);
      const axe = await new AxeBuilder({ page }).analyze();
      for (const violation of axe.violations) {
        problems.push(`${view.name}: ${violation.id} (${violation.impact}) at ${violation.nodes.map((node) => node.target.join(' ')).slice(0, 3).join(', ')}`);
      }
    }
    expect(problems).toEqual([]);
  });
}
