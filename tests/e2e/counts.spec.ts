/**
 * Counts and volumes on a phone: 12 eggs and 2 l of milk are weighed by USDA SR28's household
 * weights (named beside the field before saving, stored and shown after), a crop without a weight
 * for a count says so before saving, and bought food starts in the household's currency.
 */
import type { BrowserContext } from '@playwright/test';
import { expect, test } from './fixtures';
import { allHarvests, allPurchases, foodId, makeCrop } from '../support/entries';
import { BASE_URL, createHousehold, newVerifiedUser, type TestUser } from '../support/users';

test.use({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 });

async function signInAs(context: BrowserContext, user: TestUser) {
  await context.addCookies(
    user.cookie.split('; ').map((pair) => {
      const i = pair.indexOf('=');
      return { name: pair.slice(0, i), value: pair.slice(i + 1), url: BASE_URL };
    }),
  );
}

test('12 eggs and 2 l of milk are weighed by the SR28 household weights, named where they are logged', async ({ page, context }) => {
  const owner = await newVerifiedUser({ name: 'Hen Keeper' });
  // A London household: its currency is guessed as pounds sterling (from memory: ISO 4217).
  const h = await createHousehold(owner.cookie, { name: 'Egg and dairy plot', timezone: 'Europe/London', units: 'metric' });
  expect(h.currency).toBe('GBP');
  await makeCrop(owner.cookie, h.id, { name: 'Hens eggs', foodId: await foodId('01123'), category: 'other' });
  await makeCrop(owner.cookie, h.id, { name: 'Lettuce', foodId: await foodId('11252'), category: 'leafy_green' });
  await signInAs(context, owner);

  // Eggs by the piece: the form says what 12 weigh and where that weight comes from, before saving.
  await page.goto(`/households/${h.id}/log`);
  await page.getByText('Hens eggs', { exact: true }).tap();
  await page.getByLabel('Count or volume').selectOption('piece');
  await expect(page.getByRole('radio', { name: 'kg', exact: true })).not.toBeChecked();
  await page.getByLabel('How many', { exact: true }).fill('12');
  // USDA SR28 01123 "Egg, whole, raw, fresh", Weight file: 1 large = 50 g → 12 × 50 g = 600 g
  await expect(page.getByTestId('unit-note')).toHaveText('12 pieces ≈ 600 g · USDA SR28 01123, 1 large = 50 g (edible portion)');
  await page.getByRole('button', { name: 'Save harvest' }).tap();
  await expect(page.getByTestId('saved-label').first()).toHaveText('12 pieces Hens eggs — fresh');
  // SR28's household weights are edible portion: the shell's 12 % refuse is not taken again.
  await expect(page.getByTestId('just-saved')).toContainText('edible portion 600 g');
  const [egg] = (await allHarvests(owner.cookie, h.id)).harvests;
  expect(egg).toMatchObject({ quantity: 12, unit: 'piece', grams: 600, edibleGrams: 600, weightSource: 'USDA SR28 01123, 1 large = 50 g' });

  // A crop whose food has no head measure says so beside the field, before saving.
  await page.getByText('Lettuce', { exact: true }).tap();
  await page.getByLabel('Count or volume').selectOption('head');
  await expect(page.getByTestId('unit-note')).toContainText('There is no weight for one head of Lettuce');
  await expect(page.getByTestId('unit-note')).toContainText('set a weight of one on the crop');

  // The harvest log shows the count with its grams and the weight's source.
  await page.goto(`/households/${h.id}/harvests`);
  const row = page.getByTestId('harvest-row');
  await expect(row).toContainText('12 pieces (600 g)');
  await expect(row.getByTestId('weight-source')).toHaveText('USDA SR28 01123, 1 large = 50 g');

  // Milk by the litre; the price starts in the household's currency.
  await page.goto(`/households/${h.id}/bought`);
  await expect(page.getByLabel('Currency', { exact: true })).toHaveValue('GBP');
  await page.getByLabel('Food bought').fill('milk whole 01077');
  await page.getByRole('listbox').getByRole('option', { name: /Milk, whole, 3\.25% milkfat/ }).first().tap();
  await page.getByLabel('Count or volume').selectOption('l');
  await page.getByLabel('Volume', { exact: true }).fill('2');
  // USDA SR28 01077 "Milk, whole, 3.25% milkfat": 1 cup = 244 g; 1 US cup = 236.5882365 ml (NIST Handbook 44)
  // → 2000 / 236.5882365 × 244 = 2062.66 g
  await expect(page.getByTestId('unit-note')).toHaveText('2 l ≈ 2.06 kg · USDA SR28 01077, 1 cup = 244 g; 1 US cup = 236.5882365 ml (edible portion)');
  await page.getByLabel('Price (optional)').fill('1,45');
  await page.getByRole('button', { name: 'Save bought food' }).tap();
  await expect(page.getByTestId('purchase-saved')).toContainText('2 l');
  const [milk] = (await allPurchases(owner.cookie, h.id)).purchases;
  expect(milk.unit).toBe('l');
  expect(milk.grams).toBeCloseTo((2000 / 236.5882365) * 244, 6);
  expect(milk.grams).toBeCloseTo(2062.66, 2);
  expect(milk).toMatchObject({ currency: 'GBP', weightSource: 'USDA SR28 01077, 1 cup = 244 g; 1 US cup = 236.5882365 ml' });
  await expect(page.getByTestId('purchase-row')).toContainText('2 l (2.06 kg)');
});

test('the owner sets the household currency in the settings, and bought food starts in it', async ({ page, context }) => {
  const owner = await newVerifiedUser({ name: 'Cash Keeper' });
  const h = await createHousehold(owner.cookie, { name: 'Nowhere in particular', timezone: 'UTC' });
  expect(h.currency).toBeNull();
  await signInAs(context, owner);

  await page.goto(`/households/${h.id}/settings`);
  await expect(page.getByLabel('Currency of bought food')).toHaveValue('');
  await page.getByLabel('Currency of bought food').fill('nok');
  await page.getByRole('button', { name: 'Save household' }).tap();
  await expect(page.getByText('Saved.')).toBeVisible();
  await page.goto(`/households/${h.id}/bought`);
  await expect(page.getByLabel('Currency', { exact: true })).toHaveValue('NOK');
});
