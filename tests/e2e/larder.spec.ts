/**
 * The Larder page on a phone: a grower who stored potatoes a month ago opens the larder, sees the
 * lot with what is left and when it runs out, records that a quarter of it spoiled, sees the loss
 * in the lot's bar and undoes it; a viewer sees the same lot without any buttons.
 */
import { expect, test } from './fixtures';
import { goToTab, householdLink } from './nav';
import { foodId, logHarvest, makeCrop } from '../support/entries';
import { BASE_URL, householdWithRoles } from '../support/users';

test.use({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 });

function cookiesFor(header: string) {
  return header.split('; ').map((pair) => {
    const i = pair.indexOf('=');
    return { name: pair.slice(0, i), value: pair.slice(i + 1), url: BASE_URL };
  });
}

const iso = (d: Date) => d.toISOString().slice(0, 10);

test('a grower sees a stored lot in the larder, records a spoilage and undoes it; a viewer only reads', async ({ page, context, browser }, testInfo) => {
  const f = await householdWithRoles({ name: 'Larder e2e plot', timezone: 'UTC' });
  const hid = f.household.id;
  const now = new Date();
  const start = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - 1, 1)); // the 1st of last month
  const potato = await makeCrop(f.owner.cookie, hid, { name: 'Potato', foodId: await foodId('11352'), category: 'root_tuber' });
  const lot = await logHarvest(f.grower.cookie, hid, { cropId: potato.id, date: iso(start), quantity: 24, unit: 'kg', use: 'stored', spreadMonths: 6 });
  await context.addCookies(cookiesFor(f.grower.cookie));

  await page.goto(`/households/${hid}`);
  await goToTab(page, 'Larder');
  await expect(await householdLink(page, 'Larder')).toHaveAttribute('aria-current', 'page');
  await expect(page.getByTestId('larder-caution')).toContainText('tested recipes');
  const card = page.locator(`[data-harvest-id="${lot.id}"]`);
  await expect(card).toBeVisible();
  // 1st of last month + 6 months (date-fns addMonths)
  const end = new Date(Date.UTC(start.getUTCFullYear(), start.getUTCMonth() + 6, 1));
  const months = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
  await expect(card.getByTestId('lot-runs-out')).toHaveText(`1 ${months[end.getUTCMonth()]} ${end.getUTCFullYear()}`);
  await expect(card.getByTestId('lot-left')).toContainText('kg');
  await expect(page.getByTestId('larder-months').locator('li[data-empty="true"]').first()).toBeVisible();
  await page.screenshot({ path: testInfo.outputPath('larder-390x844.png'), fullPage: true });
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);

  const before = await card.getByTestId('lot-left').textContent();
  await card.getByRole('button', { name: 'Record what happened' }).click();
  await card.getByLabel('Spoiled or thrown out').check();
  await card.getByLabel('How much was lost').selectOption('0.25');
  await card.getByRole('button', { name: 'Save what happened' }).click();
  await expect(card.getByText(/Spoiled or thrown out on .* \(25 % of what was left\)/)).toBeVisible();
  await expect(card.getByTestId('lot-left')).not.toHaveText(before!);

  // A day before the lot went into store is refused beside the date, naming the lot's day.
  await card.getByRole('button', { name: 'Record what happened' }).click();
  await card.getByLabel('On which day').fill(iso(new Date(start.getTime() - 86400000)));
  await card.getByRole('button', { name: 'Save what happened' }).click();
  await expect(card.getByRole('alert').first()).toContainText(`went into store on ${iso(start)}`);
  await card.getByRole('button', { name: 'Cancel' }).click();

  await card.getByRole('button', { name: 'Undo' }).click();
  await expect(card.getByText(/Spoiled or thrown out on/)).toHaveCount(0);
  await expect(card.getByTestId('lot-left')).toHaveText(before!);

  const viewer = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  await viewer.addCookies(cookiesFor(f.viewer.cookie));
  const vp = await viewer.newPage();
  await vp.goto(`/households/${hid}/larder`);
  await expect(vp.locator(`[data-harvest-id="${lot.id}"]`)).toBeVisible();
  await expect(vp.getByRole('button', { name: 'Record what happened' })).toHaveCount(0);
  await vp.screenshot({ path: testInfo.outputPath('larder-1280.png'), fullPage: true });
  await viewer.close();
});
