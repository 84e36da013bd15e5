/**
 * The grower's way in, at phone size (390×844) and desktop size (1280×800): the landing page, sign
 * in, the Overview of the one household, a harvest logged from it, then the home share and the
 * gaps — with the header's one menu inside the screen, nothing scrolling sideways and the saved
 * confirmation where the thumb is. A viewer meets no harvest entry. Screenshots go to the test output.
 */
import type { Page, TestInfo } from '@playwright/test';
import { expect, test } from './fixtures';
import { goToTab, householdLink } from './nav';
import { foodId, makeCrop } from '../support/entries';
import { addMember, apiAs, BASE_URL, createHousehold, newVerifiedUser } from '../support/users';

const SIZES = [
  { name: 'phone', viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, share: 'Share' },
  { name: 'desktop', viewport: { width: 1280, height: 800 }, isMobile: false, hasTouch: false, share: 'Home share' },
] as const;

async function noSidewaysScroll(page: Page) {
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(page.viewportSize()!.width);
}

async function shot(page: Page, testInfo: TestInfo, name: string) {
  await page.screenshot({ path: testInfo.outputPath(`${name}.png`) });
}

async function grower(name: string) {
  const owner = await newVerifiedUser({ name: 'Hana Home' });
  const h = await createHousehold(owner.cookie, { name, timezone: 'UTC', units: 'metric' });
  expect((await apiAs(owner.cookie, 'POST', `/api/households/${h.id}/people`, { name: 'Hana', sex: 'female', ageYears: 38, kcalPerDay: 2000 })).status).toBe(201);
  // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw": 25 % refuse
  await makeCrop(owner.cookie, h.id, { name: 'Potato', foodId: await foodId('11352'), category: 'root_tuber' });
  return { owner, h };
}

for (const size of SIZES) {
  test.describe(`at ${size.viewport.width}×${size.viewport.height}`, () => {
    test.use({ viewport: size.viewport, isMobile: size.isMobile, hasTouch: size.hasTouch });

    test(`a grower goes from the landing page to a logged harvest, the share and the gaps (${size.name})`, async ({ page }, testInfo) => {
      const { owner, h } = await grower(`Home ${size.name} plot`);
      const month = new Date().toISOString().slice(0, 7);

      await page.goto('/');
      await expect(page.getByRole('heading', { level: 1 })).toHaveText('How much of what you eat comes from your own ground?');
      await noSidewaysScroll(page);
      await shot(page, testInfo, `landing-${size.name}`);
      await page.getByRole('main').getByRole('link', { name: 'Sign in' }).click();
      await page.getByLabel('E-mail').fill(owner.email);
      await page.getByLabel('Password').fill(owner.password);
      await page.getByRole('button', { name: 'Sign in' }).click();

      // One household: signing in opens its Overview, with the next steps ticked from the records.
      await expect(page).toHaveURL(new RegExp(`/households/${h.id}$`));
      await expect(page.getByTestId('household-name')).toHaveText(`Home ${size.name} plot`);
      await expect(page.getByTestId('step-people')).toHaveAttribute('data-done', 'true');
      await expect(page.getByTestId('step-harvest')).toHaveAttribute('data-done', 'false');
      // A compact top: header and household title together well under a fifth of a phone screen.
      const titleBottom = (await page.getByTestId('household-name').boundingBox())!;
      expect(titleBottom.y + titleBottom.height).toBeLessThan(140);
      await noSidewaysScroll(page);
      await shot(page, testInfo, `overview-new-${size.name}`);

      // The household menu opens inside the screen, and Sign out stays reachable.
      await page.getByTestId('household-switcher').locator('summary').click();
      const menu = (await page.getByTestId('header-menu').boundingBox())!;
      expect(menu.x).toBeGreaterThanOrEqual(0);
      expect(menu.x + menu.width).toBeLessThanOrEqual(size.viewport.width);
      await expect(page.getByRole('button', { name: 'Sign out' })).toBeInViewport();
      await shot(page, testInfo, `menu-${size.name}`);
      await page.keyboard.press('Escape');
      await expect(page.getByTestId('header-menu')).toBeHidden();

      // One tap to the harvest form.
      await page.getByTestId('overview-log').click();
      await expect(page.getByRole('heading', { name: 'Log a harvest' })).toBeVisible();
      await page.getByText('Potato', { exact: true }).click();
      await page.getByLabel('Weight', { exact: true }).fill('4');
      await page.getByRole('button', { name: 'Save harvest' }).click();
      const saved = page.getByTestId('saved-label').first();
      await expect(saved).toHaveText('4 kg Potato — fresh');
      // The confirmation is on screen, above the phone's bottom bar.
      await expect(saved).toBeInViewport();
      if (size.name === 'phone') {
        const bar = (await page.getByTestId('bottom-bar').boundingBox())!;
        const box = (await page.getByTestId('just-saved').boundingBox())!;
        expect(box.y + box.height).toBeLessThanOrEqual(bar.y + 1);
      }
      await shot(page, testInfo, `logged-${size.name}`);

      // The Overview now has something to say.
      await goToTab(page, 'Overview');
      await expect(page.getByTestId('overview-recent')).toContainText('Potato');
      // USDA SR28, NDB 11352: 77 kcal/100 g, 25 % refuse → 4 kg gives 2,310 kcal, against 2,000 kcal a day this month
      await expect(page.getByTestId('overview-energy-share')).toHaveText(/^\d+ %$/);
      await noSidewaysScroll(page);
      await shot(page, testInfo, `overview-${size.name}`);

      // The home share, the grid opened on the current month.
      await goToTab(page, size.share);
      await expect(await householdLink(page, size.share)).toHaveAttribute('aria-current', 'page');
      await expect(page.getByTestId('share-grid')).toBeVisible();
      // The current month's column is within the grid's visible width (the grid may sit below the fold).
      const monthInView = () =>
        page.getByTestId(`month-head-${month}`).evaluate((th) => {
          const box = th.closest('.overflow-x-auto')!.getBoundingClientRect();
          const r = th.getBoundingClientRect();
          return r.left >= box.left - 1 && r.right <= box.right + 1;
        });
      await expect.poll(monthInView).toBe(true);
      await noSidewaysScroll(page);
      await shot(page, testInfo, `share-${size.name}`);

      // The gaps: on a phone from the More sheet, which lists every other destination.
      await goToTab(page, 'Gaps');
      await expect(page).toHaveURL(new RegExp(`/households/${h.id}/gaps$`));
      await expect(page.getByTestId('gaps-report')).toBeVisible();
      await noSidewaysScroll(page);
      await shot(page, testInfo, `gaps-${size.name}`);
    });
  });
}

test.describe('a viewer on a phone', () => {
  test.use({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });

  test('meets no harvest entry, and /log says why', async ({ page, context }, testInfo) => {
    const { owner, h } = await grower('Viewer home plot');
    const viewer = await newVerifiedUser({ name: 'Vale Viewer' });
    await addMember(owner, h.id, viewer, 'viewer');
    await context.addCookies(viewer.cookie.split('; ').map((pair) => {
      const i = pair.indexOf('=');
      return { name: pair.slice(0, i), value: pair.slice(i + 1), url: BASE_URL };
    }));
    await page.goto(`/households/${h.id}`);
    const bar = page.getByTestId('bottom-bar');
    await expect(bar.getByRole('link')).toHaveText(['Overview', 'Harvests', 'Larder', 'Share'].map((t) => new RegExp(t)));
    await expect(page.getByTestId('header-log')).toHaveCount(0);
    await expect(page.getByTestId('overview-log')).toHaveCount(0);
    await page.getByTestId('more-menu').locator('summary').click();
    await expect(page.getByTestId('more-sheet').getByRole('link', { name: 'Log harvest' })).toHaveCount(0);
    await shot(page, testInfo, 'viewer-more-phone');
    await page.goto(`/households/${h.id}/log`);
    await expect(page.getByTestId('log-viewer')).toContainText('logged by owners and growers');
    await expect(page.getByRole('button', { name: 'Save harvest' })).toHaveCount(0);
  });
});
