/**
 * Issue 9 through a person's eyes: a household made today, with one person and one harvest and no
 * bought food logged, must not read "100 % of what you ate"; carbohydrate and fat show their
 * recommended range; the months before its records start read "before records"; a vegetarian's
 * zinc caution sits under the zinc row.
 */
import { expect, test } from './fixtures';
import { foodId, logHarvest, makeCrop } from '../support/entries';
import { apiAs, BASE_URL, createHousehold, newVerifiedUser } from '../support/users';

function cookiesFor(header: string) {
  return header.split('; ').map((pair) => {
    const i = pair.indexOf('=');
    return { name: pair.slice(0, i), value: pair.slice(i + 1), url: BASE_URL };
  });
}

const TZ = 'Europe/Berlin';

function monthsBack(month: string, n: number): string {
  const [y, m] = month.split('-').map(Number) as [number, number];
  const d = new Date(Date.UTC(y, m - 1 - n, 1));
  return d.toISOString().slice(0, 7);
}

/** Whole grams as the dashboard writes amounts of 100 or more (en-US, no decimals). */
const grams = (n: number) => new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 }).format(n);

test('a new household with one harvest is told bought food looks incomplete, sees ranges and months before records', async ({ page, context }) => {
  const owner = await newVerifiedUser({ name: 'Ines Grower' });
  const h = await createHousehold(owner.cookie, { name: 'Honest share plot', timezone: TZ });
  expect((await apiAs(owner.cookie, 'POST', `/api/households/${h.id}/people`, { name: 'Ines', sex: 'female', ageYears: 40, kcalPerDay: 2000, diet: 'vegetarian' })).status).toBe(201);
  const potato = await makeCrop(owner.cookie, h.id, { name: 'Potato', foodId: await foodId('11352'), category: 'root_tuber' });
  const today = new Intl.DateTimeFormat('en-CA', { timeZone: TZ, year: 'numeric', month: '2-digit', day: '2-digit' }).format(new Date());
  await logHarvest(owner.cookie, h.id, { date: today, cropId: potato.id, quantity: 2, unit: 'kg', use: 'fresh' });
  await context.addCookies(cookiesFor(owner.cookie));

  const month = today.slice(0, 7);
  const from = monthsBack(month, 2);
  const [y, m] = month.split('-').map(Number) as [number, number];
  const days = new Date(Date.UTC(y, m, 0)).getUTCDate();
  await page.goto(`/households/${h.id}/share?from=${from}&to=${month}`);

  // One potato harvest and nothing bought: "of what you ate" must not read a clean 100 %.
  // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw": 77 kcal, 25 % refuse → 1,155 kcal against 2,000 kcal × days: far under 70 %
  const intake = page.getByTestId('intake-share-energy_kcal');
  await expect(intake).toHaveText('bought food looks incomplete');
  await expect(intake).not.toHaveText(/100 %/);
  await expect(page.getByTestId('intake-incomplete')).toContainText('Bought food looks incomplete');

  // Carbohydrate and fat show their range over the counted month (the current one only).
  // IOM 2005 AMDR: carbohydrate 45–65 % of energy at 4 kcal/g; fat 20–35 % from 19 y at 9 kcal/g
  const kcal = 2000 * days;
  await expect(page.getByTestId('need-carbohydrate_g')).toHaveText(`${grams((kcal * 0.45) / 4)}–${grams((kcal * 0.65) / 4)} g`);
  await expect(page.getByTestId('need-fat_g')).toHaveText(`${grams((kcal * 0.2) / 9)}–${grams((kcal * 0.35) / 9)} g`);
  await expect(page.getByTestId('basis-fat_g')).toHaveText('range');
  // The fat row is no longer a line of dashes: the current month has a figure.
  await expect(page.getByTestId(`cell-fat_g-${month}`)).not.toHaveAttribute('data-band', 'no figure');

  // The household was made this month, so the two months before read as before records.
  await expect(page.getByTestId('months-before')).toHaveText('before records');
  await expect(page.getByTestId('months-before')).toHaveAttribute('colspan', '2');
  await expect(page.getByTestId(`cell-energy_kcal-${from}`)).toHaveAttribute('data-band', 'before records');
  await expect(page.getByTestId(`cell-energy_kcal-${from}`)).toContainText('before records, no need counted');
  await expect(page.getByTestId('records-note')).toContainText('before records');

  // The cautions sit under their nutrients, and the general ones in "About these figures".
  await expect(page.getByTestId('caution-iron_mg')).toContainText('absorbed much less well');
  // Ines is vegetarian: the zinc row adds that her need may be up to 50 % higher (IOM 2001, zinc chapter)
  await expect(page.getByTestId('caution-zinc_mg')).toContainText('up to 50 % higher');
  await expect(page.getByTestId('share-about')).toContainText('food supply, not what was eaten');
  await expect(page.getByTestId('share-about')).toContainText('registered dietitian');
  await expect(page.getByTestId('ratio-energy_kcal')).toContainText('Production against supply');
  // No bought food logged: the FAO ratio's supply lacks purchases, so it says it reads too high
  await expect(page.getByTestId('ratio-incomplete-energy_kcal')).toContainText('too high while bought food looks incomplete');
});

test('the owner moves the records start back on the settings page, and the share report counts from there', async ({ page, context }) => {
  const owner = await newVerifiedUser({ name: 'Rhea Owner' });
  const h = await createHousehold(owner.cookie, { name: 'Records start plot', timezone: TZ });
  await context.addCookies(cookiesFor(owner.cookie));
  const today = new Intl.DateTimeFormat('en-CA', { timeZone: TZ, year: 'numeric', month: '2-digit', day: '2-digit' }).format(new Date());
  const month = today.slice(0, 7);
  const earlier = monthsBack(month, 2);

  await page.goto(`/households/${h.id}`);
  // A household made this month with no entries counts from this month (the default rule).
  await expect(page.getByTestId('records-from')).toContainText(`records count from ${month}.`);
  await expect(page.getByRole('link', { name: 'Change it in the settings.' })).toHaveAttribute('href', `/households/${h.id}/settings`);
  await page.goto(`/households/${h.id}/settings`);
  await expect(page.getByTestId('records-since-form')).toContainText(`Now counted from ${month}`);
  await page.getByLabel('Records start (month)').fill(earlier);
  await page.getByTestId('records-since-form').getByRole('button', { name: 'Save' }).click();
  await expect(page.getByTestId('records-since-form')).toContainText(`Records now start in ${earlier}.`);
  expect((await apiAs(owner.cookie, 'GET', `/api/households/${h.id}`)).body.household.recordsSince).toBe(earlier);

  await page.goto(`/households/${h.id}/share?from=${earlier}&to=${month}`);
  await expect(page.getByTestId('months-before')).toHaveCount(0);
});
