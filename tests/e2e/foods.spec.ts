import { expect, test } from './fixtures';

test('a visitor searches the reference foods and opens one', async ({ page }) => {
  await page.goto('/foods');
  await page.getByLabel('Search reference foods').fill('butternut raw');
  await page.getByRole('button', { name: 'Search' }).click();
  const first = page.getByTestId('food-results').getByRole('link').first();
  await expect(first).toContainText('Squash, winter, butternut, raw');
  await first.click();
  await expect(page.getByRole('heading', { level: 1 })).toHaveText('Squash, winter, butternut, raw');
  // USDA SR28, NDB 11485: 16 % refuse, 45 kcal per 100 g
  await expect(page.getByTestId('food-code')).toHaveText('11485');
  await expect(page.getByTestId('refuse')).toHaveText('16 %');
  await expect(page.locator('tr[data-key="energy_kcal"] td')).toHaveText('45 kcal');
  await expect(page.getByText('USDA National Nutrient Database for Standard Reference, Release 28').first()).toBeVisible();
  // A kilogram as harvested: 45 kcal × 10 × (1 − 16/100) = 378 kcal; 1.00 g protein × 10 × 0.84 = 8.4 g
  await expect(page.getByTestId('per-kg-energy-value')).toHaveText('378');
  await expect(page.getByTestId('per-kg-protein-value')).toHaveText('8.4');
  await expect(page.getByTestId('edible')).toHaveText('84 %');
  // USDA SR28, NDB 11485: vitamin A 532 µg RAE and vitamin C 21 mg per 100 g; RDA men 31–50 y: 900 µg and 90 mg
  // (National Academies DRI, Vitamins RDA/AI table): 59 % and 23 %, the only two at 20 % or more
  const rich = page.getByTestId('rich-in').getByRole('listitem');
  await expect(rich).toHaveCount(2);
  await expect(rich.nth(0)).toContainText('Vitamin A (RAE)');
  await expect(rich.nth(0)).toContainText('59 %');
  await expect(rich.nth(1)).toContainText('Vitamin C');
  await expect(rich.nth(1)).toContainText('23 %');
  await expect(page.getByText(/adult aged 31–50/)).toBeVisible();
  // Sections in the order a grower asks
  const headings = await page.getByRole('heading', { level: 2 }).allTextContents();
  expect(headings.slice(0, 4)).toEqual([
    'A kilogram as harvested gives',
    'The edible part',
    'Rich in',
    'Every nutrient, per 100 g edible portion',
  ]);
  await expect(page.getByTestId('food-source')).toContainText('SQUASH, WNTR, BUTTERNUT, RAW');
});
