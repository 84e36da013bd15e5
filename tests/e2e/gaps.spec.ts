/**
 * The Gaps page on a phone: a grower with a season of harvests opens Gaps, sees the nutrient ×
 * month strip and the table, sets targets for energy and vitamin C in every month, gets a plan,
 * turns it into plantings with one action and finds them on the Beds page. Screenshots of the page
 * at phone and desk size go to the run's artifacts for a person to look at.
 */
import { expect, test } from './fixtures';
import { goToTab, householdLink } from './nav';
import { foodId, logHarvest, makeCrop } from '../support/entries';
import { apiAs, BASE_URL, householdWithRoles } from '../support/users';

test.use({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 });

function cookiesFor(header: string) {
  return header.split('; ').map((pair) => {
    const i = pair.indexOf('=');
    return { name: pair.slice(0, i), value: pair.slice(i + 1), url: BASE_URL };
  });
}

test('a grower finds the gaps, plans by month for energy and vitamin C, and turns the plan into plantings', async ({ page, context }, testInfo) => {
  const f = await householdWithRoles({ name: 'Gaps e2e plot', timezone: 'Europe/Berlin' });
  const hid = f.household.id;
  expect((await apiAs(f.owner.cookie, 'POST', `/api/households/${hid}/people`, { name: 'Ada', sex: 'female', ageYears: 34, kcalPerDay: 2000 })).status).toBe(201);
  const potato = await makeCrop(f.owner.cookie, hid, { name: 'Potato', foodId: await foodId('11352'), category: 'root_tuber' });
  await logHarvest(f.owner.cookie, hid, { date: '2026-08-10', cropId: potato.id, quantity: 20, unit: 'kg', use: 'stored', spreadMonths: 3 });
  await context.addCookies(cookiesFor(f.grower.cookie));

  await page.goto(`/households/${hid}`);
  await goToTab(page, 'Gaps');
  await expect(await householdLink(page, 'Gaps')).toHaveAttribute('aria-current', 'page');
  await expect(page.getByTestId('gaps-caution')).toContainText('not medical or dietary advice');
  const report = page.getByTestId('gaps-report');
  await expect(report).toBeVisible();
  // The stored potatoes feed August to October; the strip colours those months, the table names the leanest.
  await expect(page.getByTestId('strip-energy_kcal-2026-09')).not.toHaveAttribute('data-band', 'none from home');
  await expect(page.getByTestId('strip-energy_kcal-2026-09')).not.toHaveAttribute('data-lean', 'true');
  await expect(page.getByTestId('gap-row-energy_kcal')).toContainText('Short by');
  await expect(page.getByTestId('least-area-vitamin_c_mg')).toContainText('m² closes it');
  await page.screenshot({ path: testInfo.outputPath('gaps-390x844.png') });
  await page.getByTestId('gap-strip').screenshot({ path: testInfo.outputPath('gaps-strip-390.png') });
  // A phone never scrolls the page sideways.
  const wide = await page.evaluate(() =>
    [...document.querySelectorAll('body *')]
      .filter((e) => e.getBoundingClientRect().right > 391 && !e.closest('nav'))
      .slice(0, 5)
      .map((e) => `${e.tagName}.${e.className} ${Math.round(e.getBoundingClientRect().right)}`.slice(0, 160)),
  );
  expect(wide).toEqual([]);
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);

  // No target: the form's own rule, before anything is sent.
  await page.getByRole('button', { name: 'Make a plan' }).click();
  await expect(page.getByText('Choose a target for at least one nutrient')).toBeVisible();

  await page.getByLabel('Energy', { exact: true }).selectOption('50');
  await page.getByLabel('Vitamin C', { exact: true }).selectOption('100');
  await page.getByLabel('In every month (fills the lean months too)').check();
  await page.getByRole('button', { name: 'Make a plan' }).click();
  const plan = page.getByTestId('plan');
  await expect(plan).toBeVisible({ timeout: 20_000 });
  await expect(page.getByTestId('projected-energy_kcal')).toContainText('→');
  const crops = page.getByTestId('plan-crops').locator('li');
  const count = await crops.count();
  expect(count).toBeGreaterThan(0);
  const firstName = (await crops.first().locator('p.font-bold').textContent())!.trim();

  await page.getByRole('button', { name: 'Turn into plantings' }).click();
  await expect(page.getByTestId('planted')).toContainText(`${count} planting${count === 1 ? '' : 's'} made for 2026`);
  await page.getByRole('link', { name: 'See them on the Beds page' }).click();
  await expect(page).toHaveURL(new RegExp(`/households/${hid}/beds`));
  const planted = page.getByTestId('planting').filter({ hasText: 'from the plan' });
  await expect(planted).toHaveCount(count);
  await expect(planted.filter({ hasText: firstName.split(' (')[0]!.split(',')[0]! }).first()).toBeVisible();

  await page.setViewportSize({ width: 1280, height: 800 });
  await page.goto(`/households/${hid}/gaps`);
  await expect(page.getByTestId('gaps-report')).toBeVisible();
  await page.screenshot({ path: testInfo.outputPath('gaps-1280x800.png') });
});
