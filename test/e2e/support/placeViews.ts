/**
 * Every place of the app in the states a person sees, reached from a fresh load with the invented demo
 * data, and the layout check used on each: no element out of the window or out of its card.
 */
import type { Page } from '@playwright/test';
import { expect, type RunningHost } from './browserHostFixture.js';

export const windowSizes = [
  { width: 1280, height: 800 },
  { width: 1920, height: 1080 },
  { width: 1024, height: 700 },
] as const;

export type Theme = 'light' | 'dark';

/** One state of one place, reached from a fresh load of the app. */
export interface PlaceView {
  name: string;
  reach: (page: Page) => Promise<void>;
}

async function goTo(page: Page, place: string): Promise<void> {
  await page.getByRole('button', { name: place, exact: true }).click();
  await expect(page.locator('main section').first()).toBeVisible();
}

export const placeViews: PlaceView[] = [
  {
    name: 'plan',
    reach: async (page) => {
      await goTo(page, 'Plan');
      await expect(page.getByTestId('chart-oc').locator('canvas')).toBeVisible();
    },
  },
  {
    name: 'inspect-runs',
    reach: async (page) => {
      await goTo(page, 'Inspect');
      await expect(page.getByTestId('open-run').first()).toBeVisible();
    },
  },
  {
    name: 'inspect-mid-run',
    reach: async (page) => {
      await goTo(page, 'Inspect');
      // A pass/fail plan that is still undecided after 30 passing items.
      const flangeNut = await page.getByTestId('start-plan').locator('option', { hasText: 'M6 flange nut' }).getAttribute('value');
      await page.getByTestId('start-plan').selectOption(flangeNut ?? '');
      await page.getByTestId('start-lot').fill('SCREEN-1');
      await page.getByTestId('start-inspector').fill('Ana Ruiz');
      await page.getByTestId('start-submit').click();
      await expect(page.getByTestId('run-lot')).toHaveText('SCREEN-1');
      // Enough entries for the log to scroll.
      for (let i = 0; i < 30; i++) await page.keyboard.press('NumpadAdd');
      await expect(page.getByTestId('entry-row')).not.toHaveCount(0);
      await expect(page.getByTestId('entry-pending')).toHaveCount(0);
    },
  },
  {
    name: 'inspect-decided',
    reach: async (page) => {
      await goTo(page, 'Inspect');
      await page.locator('[data-testid="open-run"]', { hasText: /accept|reject/ }).first().click();
      await expect(page.getByTestId('decided')).toBeVisible();
    },
  },
  {
    name: 'records',
    reach: async (page) => {
      await goTo(page, 'Records');
      await expect(page.getByTestId('history-row').first()).toBeVisible();
    },
  },
  {
    name: 'records-run',
    reach: async (page) => {
      await goTo(page, 'Records');
      await page.getByTestId('history-row').first().getByRole('button').first().click();
      await expect(page.getByTestId('record-view')).toBeVisible();
    },
  },
  {
    name: 'sources',
    reach: async (page) => {
      await goTo(page, 'Sources');
      await page.getByTestId('source-item').first().click();
      await expect(page.getByTestId('source-name')).toBeVisible();
    },
  },
];

/**
 * Loads the app afresh in the theme and reaches the view. The window's memory of an open run is
 * cleared first: Inspect would otherwise reopen it on its own while the view looks for the list.
 */
export async function showView(page: Page, host: RunningHost, view: PlaceView, theme: Theme): Promise<void> {
  await page.goto(host.url);
  await page.evaluate((wanted) => {
    sessionStorage.removeItem('tallyline.inspect.activeRun');
    localStorage.setItem('tallyline.theme', wanted);
  }, theme);
  await page.reload();
  await view.reach(page);
  await page.evaluate(() => new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(resolve)))); // charts draw in the next frame
}

/**
 * Elements that run out of the window, out of their card (`.panel`), or whose text spills out of
 * a button; content inside a scrolling box is allowed to run past it.
 */
export async function overflowing(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const found: string[] = [];
    const width = document.documentElement.clientWidth;
    const describe = (element: Element) => {
      const id = element.getAttribute('data-testid') ?? element.id;
      const text = (element.textContent ?? '').trim().replace(/\s+/g, ' ').slice(0, 40);
      return `${element.tagName.toLowerCase()}${id ? `#${id}` : ''}${element.className && typeof element.className === 'string' ? `.${element.className.split(' ')[0]}` : ''} “${text}”`;
    };
    const scrolls = (element: Element) => ['auto', 'scroll', 'hidden'].includes(getComputedStyle(element).overflowX);
    for (const element of document.querySelectorAll('body *')) {
      const box = element.getBoundingClientRect();
      if (box.width === 0 || box.height === 0) continue;
      const style = getComputedStyle(element);
      if (style.visibility === 'hidden' || style.position === 'fixed' || element.matches('.skip-link, .visually-hidden')) continue;
      let ancestor = element.parentElement;
      let clipped = false;
      let card: Element | null = null;
      while (ancestor && ancestor !== document.body) {
        if (card === null && scrolls(ancestor) && !ancestor.matches('main')) clipped = true;
        if (card === null && ancestor.classList.contains('panel')) card = ancestor;
        ancestor = ancestor.parentElement;
      }
      if (clipped) continue;
      if (box.right > width + 1 || box.left < -1) found.push(`${describe(element)} runs out of the window (${Math.round(box.left)}..${Math.round(box.right)} of ${width})`);
      else if (card) {
        const cardBox = card.getBoundingClientRect();
        if (box.right > cardBox.right + 1 || box.left < cardBox.left - 1) {
          found.push(`${describe(element)} runs ${Math.round(Math.max(box.right - cardBox.right, cardBox.left - box.left))} px out of its card ${describe(card).slice(0, 40)}`);
        }
      }
      if (element instanceof HTMLButtonElement && element.scrollWidth > element.clientWidth + 1) found.push(`${describe(element)}: its text spills out of the button`);
    }
    return found;
  });
}
