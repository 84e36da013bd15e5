/**
 * Issue 13, "Mending mistakes", on a phone: the crop chips hold still after a save and a pinned
 * crop comes first; Undo at the thumb after a save, a delete and an edit; a harvest of a reference
 * food moved to another food; a cleared food picker in the bought-food edit row never quietly
 * keeps the old food.
 */
import type { BrowserContext, Page } from '@playwright/test';
import { addDays, todayIn } from '@/lib/months';
import { expect, test } from './fixtures';
import { allHarvests, allPurchases, foodId, logHarvest, makeCrop } from '../support/entries';
import { apiAs, BASE_URL, createHousehold, newVerifiedUser, type TestUser } from '../support/users';

test.use({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 });

const ZONE = 'Europe/Berlin';

async function signInAs(context: BrowserContext, user: TestUser) {
  await context.addCookies(
    user.cookie.split('; ').map((pair) => {
      const i = pair.indexOf('=');
      return { name: pair.slice(0, i), value: pair.slice(i + 1), url: BASE_URL };
    }),
  );
}

async function plot(context: BrowserContext, name: string) {
  const owner = await newVerifiedUser({ name: 'Mo Mender' });
  const h = await createHousehold(owner.cookie, { name, timezone: ZONE, units: 'metric' });
  await signInAs(context, owner);
  return { owner, h, today: todayIn(ZONE) };
}

/** The crop names on the chips, first to last. */
const chipNames = (page: Page) => page.getByTestId('crop-chip').evaluateAll((els) => els.map((e) => e.querySelector('span')!.textContent));

/** The Undo toast, checked to sit above the phone's bottom bar, where the thumb is. */
async function toastAtThumb(page: Page, text: string | RegExp) {
  const toast = page.getByTestId('undo-toast');
  await expect(toast.getByTestId('undo-message')).toHaveText(text);
  const bar = (await page.getByTestId('bottom-bar').boundingBox())!;
  const box = (await toast.boundingBox())!;
  expect(box.y + box.height).toBeLessThanOrEqual(bar.y + 1);
  expect(box.y).toBeGreaterThan(844 / 2);
  return toast;
}

test('the chips hold still after a save, and a crop pinned in the arrange panel comes first', async ({ page, context }) => {
  const { owner, h, today } = await plot(context, 'Steady plot');
  // USDA SR28 foods: 11352 potatoes, 11233 kale, 11282 onions, 11080 beets.
  const potato = await makeCrop(owner.cookie, h.id, { name: 'Potato', foodId: await foodId('11352'), category: 'root_tuber' });
  const kale = await makeCrop(owner.cookie, h.id, { name: 'Kale', foodId: await foodId('11233'), category: 'leafy_green' });
  await makeCrop(owner.cookie, h.id, { name: 'Onion', foodId: await foodId('11282'), category: 'other' });
  await makeCrop(owner.cookie, h.id, { name: 'Beet', foodId: await foodId('11080'), category: 'root_tuber' });
  await logHarvest(owner.cookie, h.id, { date: addDays(today, -20), cropId: potato.id, quantity: 1, unit: 'kg' });
  await logHarvest(owner.cookie, h.id, { date: addDays(today, -30), cropId: kale.id, quantity: 1, unit: 'kg' });

  await page.goto(`/households/${h.id}/log`);
  await expect(page.getByTestId('crop-chip')).toHaveCount(4);
  // Most used in the last year first (kale and potato once each, so by name), then the rest by name.
  expect(await chipNames(page)).toEqual(['Kale', 'Potato', 'Beet', 'Onion']);

  // Pin onion from the keyboard, pin beet with a tap and move it above onion.
  await page.getByRole('button', { name: 'Arrange: pin and order crops' }).tap();
  const arrange = page.getByTestId('chip-arrange');
  await arrange.getByRole('button', { name: 'Pin Onion' }).focus();
  await page.keyboard.press('Enter');
  await expect(arrange.getByRole('button', { name: 'Unpin Onion' })).toBeFocused();
  await arrange.getByRole('button', { name: 'Pin Beet' }).tap();
  await arrange.getByRole('button', { name: 'Move Beet up' }).tap();
  await expect(arrange.getByRole('status')).toHaveText('Beet is now pinned 1 of 2.');
  for (const name of ['Move Beet down', 'Unpin Beet', 'Pin Kale']) {
    expect((await arrange.getByRole('button', { name }).boundingBox())!.height).toBeGreaterThanOrEqual(44);
  }
  await arrange.getByRole('button', { name: 'Save order' }).tap();
  await expect(arrange).toHaveCount(0);
  expect(await chipNames(page)).toEqual(['Beet', 'Onion', 'Kale', 'Potato']);
  await expect(page.getByTestId('crop-chip').first()).toContainText('pinned');

  // A weighing of potato: it now has the most harvests of the year, but no chip moves.
  const potatoChip = page.getByTestId('crop-chip').filter({ hasText: 'Potato' });
  await expect(potatoChip).not.toContainText('harvested today');
  await page.getByText('Potato', { exact: true }).tap();
  await page.getByLabel('Weight', { exact: true }).fill('2');
  await page.getByRole('button', { name: 'Save harvest' }).tap();
  await expect(page.getByTestId('saved-label').first()).toHaveText('2 kg Potato — fresh');
  // The crops were read again after the save (the chip says so)…
  await expect(potatoChip).toContainText('harvested today');
  // …and the chips kept their places.
  expect(await chipNames(page)).toEqual(['Beet', 'Onion', 'Kale', 'Potato']);
  // The next visit takes the new counts: potato (2) before kale (1), pinned crops still first.
  await page.reload();
  await expect(page.getByTestId('crop-chip')).toHaveCount(4);
  expect(await chipNames(page)).toEqual(['Beet', 'Onion', 'Potato', 'Kale']);
  const ranks = (await apiAs(owner.cookie, 'GET', `/api/households/${h.id}/crops`)).body.crops.map((c: { name: string; pinRank: number | null }) => `${c.name}:${c.pinRank}`);
  expect(ranks.sort()).toEqual(['Beet:1', 'Kale:null', 'Onion:2', 'Potato:null']);
});

test('Undo at the thumb: a harvest saved is removed, a stored lot deleted comes back with its larder record, a split part rejoins its weighing', async ({ page, context }) => {
  const { owner, h, today } = await plot(context, 'Undo plot');
  const potato = await makeCrop(owner.cookie, h.id, { name: 'Potato', foodId: await foodId('11352'), category: 'root_tuber' });

  // A save on the harvest form: its Undo removes the entry.
  await page.goto(`/households/${h.id}/log`);
  await page.getByText('Potato', { exact: true }).tap();
  await page.getByLabel('Weight', { exact: true }).fill('4');
  await page.getByRole('button', { name: 'Save harvest' }).tap();
  await expect(page.getByTestId('saved-label').first()).toHaveText('4 kg Potato — fresh');
  await expect(page.getByTestId('saved-label').first()).toBeInViewport();
  expect((await allHarvests(owner.cookie, h.id)).total).toBe(1);
  await page.getByTestId('just-saved').getByRole('button', { name: 'Undo' }).tap();
  await expect(page.getByTestId('saved-label')).toHaveCount(0);
  expect((await allHarvests(owner.cookie, h.id)).total).toBe(0);

  // A stored lot with a larder record, deleted in the log and brought back by Undo.
  const lot = await logHarvest(owner.cookie, h.id, { date: addDays(today, -40), cropId: potato.id, quantity: 20, unit: 'kg', use: 'stored', spreadMonths: 6, note: 'clamp' });
  const spoiled = await apiAs(owner.cookie, 'POST', `/api/households/${h.id}/larder/outcomes`, { harvestId: lot.id, kind: 'spoiled', date: addDays(today, -10), lostFraction: 0.25 });
  expect(spoiled.status).toBe(201);
  await page.goto(`/households/${h.id}/harvests`);
  await expect(page.getByTestId('harvest-row')).toHaveCount(1);
  await page.getByRole('button', { name: /^Delete/ }).tap();
  await page.getByRole('button', { name: 'Yes, delete' }).tap();
  await expect(page.getByText('No harvests logged yet.')).toBeVisible();
  const toast = await toastAtThumb(page, /^Deleted 20 kg Potato of /);
  // The row and its button went: the focus is on Undo, so a keyboard reaches it at once.
  await expect(toast.getByRole('button', { name: 'Undo', exact: true })).toBeFocused();
  await toast.getByRole('button', { name: 'Undo', exact: true }).tap();
  await expect(toast.getByTestId('undo-message')).toHaveText('The harvest is back in the log, with its larder records.');
  await expect(page.getByTestId('harvest-row')).toHaveCount(1);
  const [back] = (await allHarvests(owner.cookie, h.id)).harvests;
  expect(back).toMatchObject({ date: lot.date, cropId: potato.id, quantity: 20, unit: 'kg', use: 'stored', spreadMonths: 6, note: 'clamp', grams: lot.grams, edibleGrams: lot.edibleGrams });
  const records = await apiAs(owner.cookie, 'GET', `/api/households/${h.id}/larder/outcomes?harvestId=${back.id}`);
  expect(records.body.outcomes.map((o: { kind: string; date: string; lostFraction: number }) => [o.kind, o.date, o.lostFraction])).toEqual([['spoiled', addDays(today, -10), 0.25]]);

  // A part of a split weighing, deleted and brought back: one weighing of two parts again.
  await logHarvest(owner.cookie, h.id, { date: addDays(today, -2), cropId: potato.id, unit: 'kg', parts: [{ quantity: 2, use: 'fresh' }, { quantity: 1, use: 'given' }] });
  await page.reload();
  await expect(page.getByTestId('split-weighing')).toContainText('3 kg in 2 parts');
  await page.getByRole('button', { name: /^Delete 1 kg Potato/ }).tap();
  await page.getByRole('button', { name: 'Yes, delete' }).tap();
  await expect(page.getByTestId('split-weighing')).toHaveCount(0);
  await (await toastAtThumb(page, /^Deleted 1 kg Potato/)).getByRole('button', { name: 'Undo', exact: true }).tap();
  await expect(page.getByTestId('split-weighing')).toContainText('3 kg in 2 parts');
});

test('a harvest of a reference food moves to another food, and Undo puts it back', async ({ page, context }) => {
  const { owner, h, today } = await plot(context, 'Hen house');
  // USDA SR28 NDB 01123 "Egg, whole, raw, fresh" (12 % refuse) and 01139 "Egg, goose, whole, fresh, raw" (13 % refuse)
  const egg = await foodId('01123');
  const goose = await foodId('01139');
  const logged = await logHarvest(owner.cookie, h.id, { date: addDays(today, -1), foodId: egg, quantity: 1, unit: 'kg' });
  expect(logged.edibleGrams).toBeCloseTo(880, 6);

  await page.goto(`/households/${h.id}/harvests`);
  await page.getByRole('button', { name: /^Edit/ }).tap();
  const row = page.getByRole('form', { name: /^Edit/ });
  await expect(row.getByTestId(`edit-${logged.id}-food-chosen`)).toContainText('Egg, whole, raw, fresh');
  await row.getByRole('button', { name: 'Change reference food' }).tap();
  // No food chosen: nothing quietly kept, Save waits.
  await expect(row.getByTestId('edit-blocked')).toHaveText('Choose the reference food (or a crop) to save, or Cancel to keep Egg, whole, raw, fresh.');
  await expect(row.getByRole('button', { name: 'Save changes' })).toBeDisabled();
  await row.getByLabel('Reference food').fill('egg goose');
  await page.getByRole('option', { name: /Egg, goose/ }).first().tap();
  await row.getByRole('button', { name: 'Save changes' }).tap();
  await expect(page.getByTestId('harvest-row')).toContainText('Egg, goose, whole, fresh, raw');
  let [h1] = (await allHarvests(owner.cookie, h.id)).harvests;
  expect(h1).toMatchObject({ id: logged.id, cropId: null, foodId: goose });
  expect(h1.edibleGrams).toBeCloseTo(870, 6); // 1 kg × (1 − 13/100), SR28 01139

  const toast = await toastAtThumb(page, /^Changes saved to Egg, goose/);
  await toast.getByRole('button', { name: 'Undo', exact: true }).tap();
  await expect(toast.getByTestId('undo-message')).toHaveText('Undone: the previous values are back.');
  await expect(page.getByTestId('harvest-row')).toContainText('Egg, whole, raw, fresh');
  [h1] = (await allHarvests(owner.cookie, h.id)).harvests;
  expect(h1).toMatchObject({ id: logged.id, foodId: egg });
  expect(h1.edibleGrams).toBeCloseTo(880, 6);
});

test('bought food: a cleared picker blocks Save, Undo takes back a save, a delete and an edit', async ({ page, context }) => {
  const { owner, h, today } = await plot(context, 'Larder shelf');
  // USDA SR28 NDB 20081 "Wheat flour, white, all-purpose, enriched, bleached"; 11352 potatoes
  const flour = await foodId('20081');
  const r = await apiAs(owner.cookie, 'POST', `/api/households/${h.id}/purchases`, { date: addDays(today, -3), foodId: flour, quantity: 25, unit: 'kg', spreadMonths: 6, price: 20, currency: 'EUR' });
  expect(r.status).toBe(201);

  await page.goto(`/households/${h.id}/bought`);
  await expect(page.getByTestId('purchase-row')).toHaveCount(1);

  // Clearing the food in the edit row: Save is disabled and says why; Cancel keeps the flour.
  await page.getByRole('button', { name: /^Edit Wheat flour/ }).tap();
  const edit = page.getByRole('form', { name: /^Edit Wheat flour/ });
  await edit.getByRole('button', { name: 'Change food' }).tap();
  await expect(edit.getByRole('button', { name: 'Save changes' })).toBeDisabled();
  await expect(edit.getByTestId('edit-blocked')).toHaveText('Choose the food bought to save, or Cancel to keep Wheat flour, white, all-purpose, enriched, bleached.');
  await edit.getByRole('button', { name: 'Cancel' }).tap();
  await expect(page.getByTestId('purchase-row')).toContainText('Wheat flour, white');
  expect((await allPurchases(owner.cookie, h.id)).purchases[0].foodId).toBe(flour);

  // An edit of the amount and price, undone.
  await page.getByRole('button', { name: /^Edit Wheat flour/ }).tap();
  await page.locator('[id^="pedit-"][id$="-quantity"]').fill('20');
  await page.locator('[id^="pedit-"][id$="-price"]').fill('');
  await page.getByRole('button', { name: 'Save changes' }).tap();
  await expect(page.getByTestId('purchase-row')).toContainText('20 kg');
  await (await toastAtThumb(page, /^Changes saved to Wheat flour/)).getByRole('button', { name: 'Undo', exact: true }).tap();
  await expect(page.getByTestId('purchase-row')).toContainText('25 kg');
  expect((await allPurchases(owner.cookie, h.id)).purchases[0]).toMatchObject({ quantity: 25, price: 20, currency: 'EUR' });

  // A delete, undone: the same values again.
  await page.getByRole('button', { name: /^Delete 25 kg Wheat flour/ }).tap();
  await page.getByRole('button', { name: 'Yes, delete' }).tap();
  await expect(page.getByTestId('purchase-row')).toHaveCount(0);
  await (await toastAtThumb(page, /^Deleted 25 kg Wheat flour/)).getByRole('button', { name: 'Undo', exact: true }).tap();
  await expect(page.getByTestId('purchase-row')).toHaveCount(1);
  expect((await allPurchases(owner.cookie, h.id)).purchases[0]).toMatchObject({ foodId: flour, quantity: 25, unit: 'kg', price: 20, currency: 'EUR', spreadMonths: 6, date: addDays(today, -3) });

  // A save from the form (at the bottom of the phone's page), undone from the toast at the thumb.
  await page.getByLabel('Food bought').fill('potatoes raw');
  await page.getByRole('listbox').getByRole('option').first().tap();
  await page.getByLabel('Weight', { exact: true }).fill('2');
  await page.getByRole('button', { name: 'Save bought food' }).tap();
  await expect(page.getByTestId('purchase-row')).toHaveCount(2);
  await (await toastAtThumb(page, /^Saved 2 kg /)).getByRole('button', { name: 'Undo', exact: true }).tap();
  await expect(page.getByTestId('undo-message')).toHaveText('Undone: the bought food is removed.');
  await expect(page.getByTestId('purchase-row')).toHaveCount(1);
  expect((await allPurchases(owner.cookie, h.id)).total).toBe(1);
});
