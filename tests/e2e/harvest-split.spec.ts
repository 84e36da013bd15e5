/**
 * One weighing split between uses on the harvest form: the last part takes the rest, the parts are
 * stored together, and parts that leave nothing for the last one are caught before sending.
 */
import type { BrowserContext } from '@playwright/test';
import { expect, test } from './fixtures';
import { allHarvests, foodId, makeCrop } from '../support/entries';
import { apiAs, BASE_URL, createHousehold, newVerifiedUser } from '../support/users';

test.use({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 });

async function potatoPlot(context: BrowserContext) {
  const owner = await newVerifiedUser({ name: 'Sam Splitter' });
  const h = await createHousehold(owner.cookie, { name: 'Split plot', timezone: 'Europe/Berlin', units: 'metric' });
  // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw"
  const potato = await makeCrop(owner.cookie, h.id, { name: 'Potato', variety: 'Charlotte', foodId: await foodId('11352'), category: 'root_tuber' });
  await context.addCookies(
    owner.cookie.split('; ').map((pair) => {
      const i = pair.indexOf('=');
      return { name: pair.slice(0, i), value: pair.slice(i + 1), url: BASE_URL };
    }),
  );
  return { owner, h, potato };
}

test('a weighing split between fresh and stored is saved as two harvests, the last part taking the rest', async ({ page, context }) => {
  const { owner, h } = await potatoPlot(context);
  await page.goto(`/households/${h.id}/log`);
  await page.getByText('Potato', { exact: true }).tap();
  await page.getByLabel('Weight', { exact: true }).fill('10');
  await page.getByRole('button', { name: 'Split this weighing between uses' }).tap();
  await expect(page.getByLabel('Whole weighing', { exact: true })).toHaveValue('10');

  // Parts that weigh more than the whole are caught next to the last part, and nothing is sent.
  await page.getByLabel('Part 1', { exact: true }).fill('12');
  await page.getByRole('button', { name: 'Save harvest' }).tap();
  await expect(page.getByText('The other parts add up to 12 kg, which leaves nothing for the last part. Check the weights.')).toBeVisible();
  expect((await allHarvests(owner.cookie, h.id)).total).toBe(0);

  await page.getByLabel('Part 1', { exact: true }).fill('3');
  await expect(page.getByLabel('Part 2 (the rest)')).toHaveText('7');
  await page.getByRole('button', { name: 'Save harvest' }).tap();
  await expect(page.getByTestId('saved-label').first()).toHaveText('10 kg Potato (Charlotte) — 3 kg fresh, 7 kg stored');

  const saved = await allHarvests(owner.cookie, h.id);
  expect(saved.total).toBe(2);
  expect(saved.harvests.map((x: { quantity: number; use: string }) => `${x.quantity} ${x.use}`).sort()).toEqual(['3 fresh', '7 stored']);
  // After saving, the form is back to one use for the next weighing.
  await expect(page.getByRole('button', { name: 'Split this weighing between uses' })).toBeVisible();
  await expect(page.getByLabel('Weight', { exact: true })).toHaveValue('');
});

test('the harvest log shows a split as one weighing with its parts; a new date moves every part, a new amount one', async ({ page, context }) => {
  const { owner, h, potato } = await potatoPlot(context);
  const parts = [{ quantity: 2, use: 'fresh' }, { quantity: 10, use: 'stored', spreadMonths: 5 }];
  expect((await apiAs(owner.cookie, 'POST', `/api/households/${h.id}/harvests`, { date: '2026-09-10', cropId: potato.id, unit: 'kg', parts })).status).toBe(201);
  await page.goto(`/households/${h.id}/harvests`);
  await expect(page.getByTestId('split-weighing')).toHaveText(/One weighing of Potato \(Charlotte\), .*: 12 kg in 2 parts — 2 kg eaten fresh, 10 kg stored/);
  await expect(page.getByTestId('harvest-row')).toHaveCount(2);

  // The first part's date changed: both parts move to the new day.
  await page.getByRole('button', { name: /^Edit/ }).first().tap();
  await expect(page.getByTestId('split-edit-hint')).toBeVisible();
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await page.locator('[id^="edit-"][id$="-date"]').fill('2026-09-12');
  await page.locator('[id^="edit-"][id$="-quantity"]').fill('3');
  await page.getByRole('button', { name: 'Save changes' }).tap();
  await expect(page.getByTestId('split-weighing')).toContainText('13 kg in 2 parts');
  const after = await allHarvests(owner.cookie, h.id);
  expect(after.harvests.map((x: { date: string; quantity: number }) => `${x.date} ${x.quantity}`).sort()).toEqual(['2026-09-12 10', '2026-09-12 3']);
});

